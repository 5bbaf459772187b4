import { MEASUREMENT_PROFILE_LABELS, type MeasurementProfile, type PayLineSource } from '../../constants';
import { settingsQuantityToDate, type QuantitySettings } from './settings-quantity';

export type PaySourceSettings = QuantitySettings & { mobilizationSteps?: readonly unknown[] | undefined };

/**
 * What a pay application takes an item's quantity from: the one rule of the compilation
 * (server/modules/pay-apps/pay-app-build.ts), also said to the screens. Truck-measure and weight items are paid from
 * their tickets, a lump sum in mobilization steps by those steps, and a plan-quantity or lump-sum item whose
 * settings give a quantity by those settings, and an item paid by force account from the signed daily sheets under
 * its change order (MoDOT EPG 109.5), so a tally for it could never pay the same work twice; every other item (and
 * one with no profile) from its tallies.
 * Settings that cannot give a quantity (a percent out of range) still take the item off its tallies: the
 * compilation then refuses them by name.
 */
export function paySourceOf(profile: MeasurementProfile | null, settings: PaySourceSettings): PayLineSource {
  if (profile === null) return 'tallies';
  if (profile === 'truck_measure' || profile === 'weight') return 'tickets';
  if (profile === 'force_account') return 'days';
  if (profile === 'lump_sum' && (settings.mobilizationSteps?.length ?? 0) > 0) return 'steps';
  try {
    return settingsQuantityToDate(profile, settings, 1, 4) === null ? 'tallies' : 'settings';
  } catch {
    return 'settings';
  }
}

/** Why a pay application does not bill an item's tallies, or null when it does (`paySourceOf`). */
export function talliesNotBilledReason(profile: MeasurementProfile | null, settings: PaySourceSettings): string | null {
  if (paySourceOf(profile, settings) === 'tallies') return null;
  return `paid as “${MEASUREMENT_PROFILE_LABELS[profile!]}”, not from tallies: a tally saved for it is kept as backup and bills nothing`;
}
