import { MEASUREMENT_PROFILE_LABELS, type MeasurementProfile } from '../../constants';
import { settingsQuantityToDate, type QuantitySettings } from './settings-quantity';

/**
 * Why a pay application does not bill an item's tallies, or null when it does: the rule of the compilation
 * (server/modules/pay-apps/pay-app-build.ts) said once for the screens. Truck-measure and weight items are paid
 * from their tickets, a lump sum in mobilization steps by those steps, and a plan-quantity or lump-sum item whose
 * settings give a quantity by those settings; every other item is paid from its tallies.
 */
export function talliesNotBilledReason(
  profile: MeasurementProfile | null,
  settings: QuantitySettings & { mobilizationSteps?: readonly unknown[] | undefined },
): string | null {
  if (profile === null) return null;
  const paidBy = `paid as “${MEASUREMENT_PROFILE_LABELS[profile]}”, not from tallies: a tally saved for it is kept as backup and bills nothing`;
  if (profile === 'truck_measure' || profile === 'weight') return paidBy;
  if (profile === 'lump_sum' && (settings.mobilizationSteps?.length ?? 0) > 0) return paidBy;
  try {
    return settingsQuantityToDate(profile, settings, 1, 4) === null ? null : paidBy;
  } catch {
    return paidBy;
  }
}
