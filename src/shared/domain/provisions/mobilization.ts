import { DomainError, assertNonNegative } from '../domain-error';
import { percentOfCents, type Cents } from '../money';

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
