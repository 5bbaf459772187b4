import { DomainError, assertNonNegative } from '../domain-error';
import { percentOfCents, sumCents, type Cents } from '../money';

/** One stage of a lump-sum item's schedule: its share of the item, in percent. */
export interface LumpSumStage {
  name: string;
  percentOfItem: number;
  /** The day the stage was done (YYYY-MM-DD); absent or null: not done. */
  completedOn?: string | null | undefined;
}

/**
 * The stages done as of `asOf` (YYYY-MM-DD, inclusive): those listed in `completedStages` (the older form) and those
 * whose completed date has come. Without `asOf` every dated stage counts.
 */
export function stagesDone(
  stages: readonly LumpSumStage[],
  completedStages: readonly number[] | undefined,
  asOf?: string,
): Set<number> {
  const done = new Set(completedStages ?? []);
  stages.forEach((s, i) => {
    if (s.completedOn && (asOf === undefined || s.completedOn <= asOf)) done.add(i);
  });
  return done;
}

/** A stage schedule must add up to exactly 100 % (to 0.01 %), each stage named and above 0. */
export function checkStageSchedule(stages: readonly LumpSumStage[]): void {
  if (stages.length === 0)
    throw new DomainError('VALIDATION_FAILED', 'A stage schedule needs at least one stage', ['stages']);
  let hundredths = 0;
  stages.forEach((stage, i) => {
    if (stage.name.trim() === '')
      throw new DomainError('VALIDATION_FAILED', 'Each stage needs a name', ['stages', i, 'name']);
    assertNonNegative(stage.percentOfItem, ['stages', i, 'percentOfItem'], true);
    hundredths += Math.round(stage.percentOfItem * 100);
  });
  if (hundredths !== 10_000) {
    throw new DomainError('VALIDATION_FAILED', `The stages add up to ${hundredths / 100} %, not 100 %`, ['stages']);
  }
}

/** Lump sum earned at a percent complete: value x percent, rounded once to the cent. */
export function lumpSumEarnedCents(valueCents: Cents, percentComplete: number): Cents {
  assertNonNegative(valueCents, ['valueCents']);
  assertNonNegative(percentComplete, ['percentComplete']);
  if (percentComplete > 100) {
    throw new DomainError('INVALID_QUANTITY', 'Percent complete cannot exceed 100', ['percentComplete']);
  }
  return percentOfCents(valueCents, percentComplete);
}

/**
 * Lump sum earned by stages: each completed stage earns its share, rounded to the cent; when every stage is
 * complete the item is paid in full (so the rounding of the shares never leaves or adds a cent).
 */
export function lumpSumStagesEarnedCents(
  valueCents: Cents,
  stages: readonly LumpSumStage[],
  completed: ReadonlySet<number>,
): { earnedCents: Cents; percent: number } {
  checkStageSchedule(stages);
  for (const i of completed) {
    if (!Number.isInteger(i) || i < 0 || i >= stages.length) {
      throw new DomainError('VALIDATION_FAILED', `No stage ${i} in the schedule`, ['completed']);
    }
  }
  if (completed.size === stages.length) return { earnedCents: valueCents, percent: 100 };
  const shares = stages.map((s, i) => (completed.has(i) ? percentOfCents(valueCents, s.percentOfItem) : 0));
  const hundredths = stages.reduce((t, s, i) => t + (completed.has(i) ? Math.round(s.percentOfItem * 100) : 0), 0);
  return { earnedCents: sumCents(shares), percent: hundredths / 100 };
}
