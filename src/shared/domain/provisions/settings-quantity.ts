import type { MeasurementProfile } from '../../constants';
import { DomainError } from '../domain-error';
import { roundTo } from '../rounding';
import { lumpSumStagesEarnedCents, stagesDone, type LumpSumStage } from './lump-sum';
import { planQuantityEarned } from './plan-quantity';

export interface QuantitySettings {
  percentComplete?: number | undefined;
  stages?: readonly LumpSumStage[] | undefined;
  completedStages?: readonly number[] | undefined;
}

/**
 * The quantity to date an item's own settings pay, for the profiles paid that way: a lump sum by its stages done
 * (the whole quantity once every stage is done) or by percent complete, and a contract (plan) quantity by percent
 * complete, to the measured decimals (FDOT 9-3.2.1 pays plan quantity as the work is completed). Null when the
 * settings say nothing (the item is then paid from its tallies). Lump-sum quantities keep 4 decimals, the stored
 * precision: 1 LS at 45 % is 0.45 LS.
 */
export function settingsQuantityToDate(
  profile: MeasurementProfile,
  settings: QuantitySettings,
  contractQuantity: number,
  measuredDecimals: number,
  /** The period's end: a stage counts once its completed date is on or before it. */
  asOf?: string,
): number | null {
  const percent = settings.percentComplete;
  if (percent !== undefined && (percent < 0 || percent > 100)) {
    throw new DomainError('INVALID_QUANTITY', 'Percent complete is from 0 to 100', ['percentComplete']);
  }
  if (profile === 'plan_quantity') {
    return percent === undefined ? null : planQuantityEarned(contractQuantity, percent, measuredDecimals);
  }
  if (profile !== 'lump_sum') return null;
  if (settings.stages && settings.stages.length > 0) {
    const done = stagesDone(settings.stages, settings.completedStages, asOf);
    const { percent: staged } = lumpSumStagesEarnedCents(0, settings.stages, done);
    return staged === 100 ? contractQuantity : roundTo((contractQuantity * staged) / 100, 4);
  }
  return percent === undefined ? null : roundTo((contractQuantity * percent) / 100, 4);
}
