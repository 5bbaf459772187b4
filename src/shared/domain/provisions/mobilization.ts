import { DomainError, assertNonNegative } from '../domain-error';
import { percentOfCents, type Cents } from '../money';
import { roundTo } from '../rounding';

/** A step: once `contractEarnedPercent` % of the original contract is earned, `mobilizationPercent` % is paid. */
export interface MobilizationStep {
  contractEarnedPercent: number;
  mobilizationPercent: number;
}

/** Steps rise in both columns, each percent in 0..100 (a project setting; Iowa DOT 2533 gives one example). */
export function checkMobilizationSteps(steps: readonly MobilizationStep[]): void {
  steps.forEach((step, i) => {
    for (const key of ['contractEarnedPercent', 'mobilizationPercent'] as const) {
      assertNonNegative(step[key], ['steps', i, key]);
      if (step[key] > 100) throw new DomainError('VALIDATION_FAILED', 'A percent cannot exceed 100', ['steps', i, key]);
    }
    const before = steps[i - 1];
    if (
      before &&
      (step.contractEarnedPercent <= before.contractEarnedPercent ||
        step.mobilizationPercent <= before.mobilizationPercent)
    ) {
      throw new DomainError('VALIDATION_FAILED', 'Each step must rise above the one before it', ['steps', i]);
    }
  });
}

export interface MobilizationEarned {
  /** Percent of the mobilization item payable (the highest step reached, 0 before the first). */
  mobilizationPercent: number;
  earnedCents: Cents;
  /** The step reached, or null. */
  step: MobilizationStep | null;
}

/**
 * Mobilization paid in steps tied to the percent of the original contract earned (Iowa DOT 2533). The caller
 * passes the earnings to date without the mobilization item itself (from memory: agency specifications count
 * the other items). Compared in whole cents: earned x 100 >= step x original, so no binary fraction decides a step.
 */
export function mobilizationEarned(
  mobilizationCents: Cents,
  originalContractCents: Cents,
  earnedToDateCents: Cents,
  steps: readonly MobilizationStep[],
): MobilizationEarned {
  checkMobilizationSteps(steps);
  assertNonNegative(mobilizationCents, ['mobilizationCents']);
  assertNonNegative(originalContractCents, ['originalContractCents'], true);
  assertNonNegative(earnedToDateCents, ['earnedToDateCents']);
  let reached: MobilizationStep | null = null;
  for (const step of steps) {
    const hundredths = Math.round(step.contractEarnedPercent * 100);
    if (BigInt(earnedToDateCents) * 10_000n >= BigInt(hundredths) * BigInt(originalContractCents)) reached = step;
  }
  const percent = reached?.mobilizationPercent ?? 0;
  return { mobilizationPercent: percent, earnedCents: percentOfCents(mobilizationCents, percent), step: reached };
}

export interface MobilizationLineInput {
  /** The mobilization item's contract quantity (usually 1 LS) and its contract amount, cents. */
  contractQuantity: number;
  mobilizationCents: Cents;
  /** Quantity paid to date on the previous certified application. */
  previousQuantity: number;
  originalContractCents: Cents;
  /** Earned to date on every other line of the application (work, not materials stored), cents. */
  otherEarnedToDateCents: Cents;
  steps: readonly MobilizationStep[];
}

export interface MobilizationLine {
  toDateQuantity: number;
  thisPeriodQuantity: number;
  earned: MobilizationEarned;
}

/**
 * The mobilization line of a pay application when the item is paid in steps: to date = contract quantity x the
 * step's percent (4 decimals, the stored precision). What was paid is never taken back by a later dip in the
 * other items' earnings (common practice: a step once reached stays paid), so to date is at least the previous.
 */
export function mobilizationLine(input: MobilizationLineInput): MobilizationLine {
  assertNonNegative(input.contractQuantity, ['contractQuantity']);
  assertNonNegative(input.previousQuantity, ['previousQuantity']);
  const earned = mobilizationEarned(
    input.mobilizationCents,
    input.originalContractCents,
    Math.max(0, input.otherEarnedToDateCents),
    input.steps,
  );
  const stepQuantity = roundTo((input.contractQuantity * earned.mobilizationPercent) / 100, 4);
  const toDateQuantity = Math.max(stepQuantity, input.previousQuantity);
  return { toDateQuantity, thisPeriodQuantity: roundTo(toDateQuantity - input.previousQuantity, 4), earned };
}
