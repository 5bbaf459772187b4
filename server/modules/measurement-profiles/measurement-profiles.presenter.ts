import { MEASUREMENT_PROFILE_LABELS, type PayUnit } from '../../../src/shared/constants';
import { lineAmountCents } from '../../../src/shared/domain/money';
import {
  lumpSumEarnedCents,
  lumpSumStagesEarnedCents,
  stagesDone,
} from '../../../src/shared/domain/provisions/lump-sum';
import { planQuantityEarned } from '../../../src/shared/domain/provisions/plan-quantity';
import { precisionFor } from '../../../src/shared/domain/provisions/precision';
import type { MeasurementProfileView, ProfileSettings } from '../../../src/shared/schemas/provisions/profile';
import type { BidItemProfileRow, ProfileItemRow } from './measurement-profiles.repository';

/** Earned to date for the profiles whose amount follows from their settings; null for the measured ones. */
function earnedCents(
  item: ProfileItemRow,
  profile: BidItemProfileRow | null,
  settings: ProfileSettings,
  decimals: number,
) {
  if (!profile) return null;
  if (profile.profile === 'plan_quantity') {
    const quantity = planQuantityEarned(item.contractQuantity, settings.percentComplete ?? 0, decimals);
    return lineAmountCents(quantity, item.unitPriceCents);
  }
  if (profile.profile !== 'lump_sum') return null;
  // Mobilization in steps earns what the other items' earnings reach, known only on a pay application.
  if (settings.mobilizationSteps && settings.mobilizationSteps.length > 0) return null;
  const value = lineAmountCents(item.contractQuantity, item.unitPriceCents);
  if (settings.stages && settings.stages.length > 0) {
    return lumpSumStagesEarnedCents(value, settings.stages, stagesDone(settings.stages, settings.completedStages))
      .earnedCents;
  }
  return lumpSumEarnedCents(value, settings.percentComplete ?? 0);
}

export function presentProfile(item: ProfileItemRow, profile: BidItemProfileRow | null): MeasurementProfileView {
  const unit = item.payUnit as PayUnit;
  const precision = precisionFor(unit, profile?.payDecimals);
  const settings = (profile?.settings ?? {}) as ProfileSettings;
  const kind = profile?.profile ?? 'worksheet';
  return {
    bidItemId: item.id,
    itemNumber: item.itemNumber,
    description: item.description,
    payUnit: unit,
    profile: kind,
    profileLabel: MEASUREMENT_PROFILE_LABELS[kind],
    payDecimals: precision.payDecimals,
    measuredDecimals: precision.measuredDecimals,
    stage: profile?.stage ?? 'interim',
    settings,
    isDefault: !profile,
    earnedCents: earnedCents(item, profile, settings, precision.measuredDecimals),
  };
}
