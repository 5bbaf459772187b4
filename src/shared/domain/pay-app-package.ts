import { formatPercentBps } from '../format';
import type { ChangeOrderSummary } from './change-order-summary';
import { lineAmountCents, subtractCents, sumCents, type Cents } from './money';

/** One pay application line as stored (amounts in cents, quantities in the item's pay unit). */
export interface PackageLineInput {
  itemNumber: string;
  description: string;
  contractQuantity: number;
  unitPriceCents: Cents;
  previousAmountCents: Cents;
  thisPeriodAmountCents: Cents;
  amountToDateCents: Cents;
  storedMaterialsCents: Cents;
  retainageCents: Cents;
}

/** A change order's force account on the application, as stored (pay_app_force_account_lines). */
export interface PackageForceAccountInput {
  changeOrderNumber: number;
  title: string;
  days: number;
  previousAmountCents: Cents;
  thisPeriodAmountCents: Cents;
  amountToDateCents: Cents;
  retainageCents: Cents;
  /**
   * The bid item the change order added as the allowance the days draw on (an item paid by force account), or
   * null: the days then stand on their own row, valued as done.
   */
  allowanceItemNumber?: string | null;
}

export interface PackageInput {
  lines: readonly PackageLineInput[];
  /** Force account lines, printed after the bid items under the change order that authorised them. */
  forceAccount?: readonly PackageForceAccountInput[];
  /** The contract sum before any change order (sum of the original quantities x original prices). */
  originalContractCents: Cents;
  changeOrders: ChangeOrderSummary;
  /** Retainage rate applied, basis points (for the label only). */
  retainageBps: number;
  /** Deductions and adjustments dated up to the period's end (negative: deducted). */
  adjustmentsCents: Cents;
  /** Sum of the amounts certified on earlier applications. */
  previousCertifiedCents: Cents;
}

/** A row of the schedule of values; the totals row has the same shape. */
export interface ScheduleRow {
  scheduledValueCents: Cents;
  previousCents: Cents;
  thisPeriodCents: Cents;
  storedMaterialsCents: Cents;
  /** Previous + this period + materials stored. */
  completedAndStoredCents: Cents;
  /** Completed and stored / scheduled value, basis points rounded down; null where nothing is scheduled. */
  percentBps: number | null;
  /** Scheduled value - completed and stored (negative where the item ran over). */
  balanceToFinishCents: Cents;
  retainageCents: Cents;
}

export type SummaryKey = (typeof SUMMARY_KEYS)[number];
export const SUMMARY_KEYS = [
  'originalContract',
  'netChangeOrders',
  'contractToDate',
  'completedAndStored',
  'retainage',
  'earnedLessRetainage',
  'adjustments',
  'previousCertified',
  'currentDue',
  'balanceToFinish',
] as const;

export interface SummaryLine {
  key: SummaryKey;
  label: string;
  amountCents: Cents;
}

export type ScheduleLine = ScheduleRow & {
  /** A bid item, or a change order's force account (time and materials, valued as done). */
  kind: 'item' | 'force_account';
  itemNumber: string;
  description: string;
};

export interface PayAppPackage {
  schedule: ScheduleLine[];
  totals: ScheduleRow;
  /** In the order the arithmetic reads: the contract, then what is earned, then what is due. */
  summary: SummaryLine[];
  changeOrders: ChangeOrderSummary & {
    /** Net amount of those approved before the previous application's cut-off. */
    beforeCents: Cents;
  };
}

/** Column titles of the schedule of values, one wording for screen, PDF and CSV. */
export const SCHEDULE_TITLES = {
  scheduledValueCents: 'Scheduled value',
  previousCents: 'Work before',
  thisPeriodCents: 'Work this period',
  storedMaterialsCents: 'Materials stored',
  completedAndStoredCents: 'Done and stored to date',
  percentBps: '% done',
  balanceToFinishCents: 'Left to finish',
  retainageCents: 'Retainage held',
} as const satisfies Record<keyof ScheduleRow, string>;

/** Labels of the summary lines (our own wording). */
export function summaryLabel(key: SummaryKey, retainageBps: number): string {
  const pct = formatPercentBps(retainageBps);
  const labels: Record<SummaryKey, string> = {
    originalContract: 'Original contract sum',
    netChangeOrders: 'Change orders approved, net',
    contractToDate: 'Contract sum to date',
    completedAndStored: 'Work done and materials stored to date',
    retainage: `Less retainage held (${pct})`,
    earnedLessRetainage: 'Earned less retainage',
    adjustments: 'Deductions and adjustments to date',
    previousCertified: 'Less amounts certified before',
    currentDue: 'Due on this application',
    balanceToFinish: 'Left to finish, retainage included',
  };
  return labels[key];
}

const percentBps = (part: Cents, whole: Cents): number | null =>
  whole > 0 ? Number((BigInt(part) * 10_000n) / BigInt(whole)) : null;

function row(
  scheduledValueCents: Cents,
  previousCents: Cents,
  thisPeriodCents: Cents,
  storedMaterialsCents: Cents,
  retainageCents: Cents,
): ScheduleRow {
  const completedAndStoredCents = sumCents([previousCents, thisPeriodCents, storedMaterialsCents]);
  return {
    scheduledValueCents,
    previousCents,
    thisPeriodCents,
    storedMaterialsCents,
    completedAndStoredCents,
    percentBps: percentBps(completedAndStoredCents, scheduledValueCents),
    balanceToFinishCents: subtractCents(scheduledValueCents, completedAndStoredCents),
    retainageCents,
  };
}

/**
 * The pay application package: schedule of values, summary lines and change order summary, computed once from
 * the stored lines (pure; the screen, the PDF and the CSV all print this). Each total is the sum of its column;
 * completed and stored = previous + this period + materials stored; current due = completed and stored -
 * retainage + adjustments - previously certified, so it equals the compiled application's own figure.
 */
export function payAppPackage(input: PackageInput): PayAppPackage {
  const forceAccount = input.forceAccount ?? [];
  const drawn = new Set<PackageForceAccountInput>();
  const items: ScheduleLine[] = input.lines.map((l) => {
    // Days drawing on the item the change order added as their allowance: shown on its row, against its value.
    const draws = forceAccount.filter((f) => f.allowanceItemNumber === l.itemNumber);
    draws.forEach((f) => drawn.add(f));
    const plus = (own: Cents, k: 'previousAmountCents' | 'thisPeriodAmountCents' | 'retainageCents') =>
      sumCents([own, ...draws.map((f) => f[k])]);
    return {
      kind: draws.length > 0 ? ('force_account' as const) : ('item' as const),
      itemNumber: l.itemNumber,
      description: draws.length > 0 ? `${l.description} (force account, ${daysWords(draws)})` : l.description,
      ...row(
        lineAmountCents(l.contractQuantity, l.unitPriceCents),
        plus(l.previousAmountCents, 'previousAmountCents'),
        plus(l.thisPeriodAmountCents, 'thisPeriodAmountCents'),
        l.storedMaterialsCents,
        plus(l.retainageCents, 'retainageCents'),
      ),
    };
  });
  const own = forceAccount.filter((f) => !drawn.has(f));
  const schedule: ScheduleLine[] = [
    ...items,
    ...own.map((f) => ({
      kind: 'force_account' as const,
      itemNumber: forceAccountNumber(f.changeOrderNumber),
      description: `Force account: ${f.title} (${daysWords([f])})`,
      ...row(f.amountToDateCents, f.previousAmountCents, f.thisPeriodAmountCents, 0, f.retainageCents),
    })),
  ];
  const total = (k: keyof Omit<ScheduleRow, 'percentBps'>) => sumCents(schedule.map((r) => r[k]));
  const totals = row(
    total('scheduledValueCents'),
    total('previousCents'),
    total('thisPeriodCents'),
    total('storedMaterialsCents'),
    total('retainageCents'),
  );
  const co = withForceAccount(input.changeOrders, own, [...drawn]);
  const contractToDate = sumCents([input.originalContractCents, co.netChangeCents]);
  const earnedLessRetainage = subtractCents(totals.completedAndStoredCents, totals.retainageCents);
  const amounts: Record<SummaryKey, Cents> = {
    originalContract: input.originalContractCents,
    netChangeOrders: co.netChangeCents,
    contractToDate,
    completedAndStored: totals.completedAndStoredCents,
    retainage: totals.retainageCents,
    earnedLessRetainage,
    adjustments: input.adjustmentsCents,
    previousCertified: input.previousCertifiedCents,
    currentDue: subtractCents(sumCents([earnedLessRetainage, input.adjustmentsCents]), input.previousCertifiedCents),
    balanceToFinish: subtractCents(contractToDate, earnedLessRetainage),
  };
  return {
    schedule,
    totals,
    summary: SUMMARY_KEYS.map((key) => ({
      key,
      label: summaryLabel(key, input.retainageBps),
      amountCents: amounts[key],
    })),
    changeOrders: { ...co, beforeCents: subtractCents(co.netChangeCents, co.sinceLastCents) },
  };
}

/** The schedule's number of a change order's force account line. */
export const forceAccountNumber = (changeOrderNumber: number) => `CO ${changeOrderNumber} FA`;

/**
 * The change order summary with force account paid to date added to the change order that authorised it: its
 * scheduled value is what its signed days came to, so the contract to date grows with it and the schedule's total
 * scheduled value stays equal to the contract sum to date. "Since the last" takes the days paid this period.
 */
export function withForceAccount(
  summary: ChangeOrderSummary,
  forceAccount: readonly PackageForceAccountInput[],
  drawnOnAllowance: readonly PackageForceAccountInput[] = [],
): ChangeOrderSummary {
  if (forceAccount.length + drawnOnAllowance.length === 0) return summary;
  const lines = summary.lines.map((l) => ({ ...l }));
  // Days drawing on an allowance item are already in the change order's amount (the item's value): named only.
  for (const f of drawnOnAllowance) {
    const line = lines.find((l) => l.number === f.changeOrderNumber);
    if (line) line.forceAccountCents = sumCents([line.forceAccountCents ?? 0, f.amountToDateCents]);
  }
  for (const f of forceAccount) {
    let line = lines.find((l) => l.number === f.changeOrderNumber);
    if (!line) {
      line = { number: f.changeOrderNumber, title: f.title, approvedAt: '', amountCents: 0 };
      lines.push(line);
    }
    line.amountCents = sumCents([line.amountCents, f.amountToDateCents]);
    line.forceAccountCents = sumCents([line.forceAccountCents ?? 0, f.amountToDateCents]);
  }
  return {
    approvedCount: lines.length,
    netChangeCents: sumCents([summary.netChangeCents, ...forceAccount.map((f) => f.amountToDateCents)]),
    sinceLastCents: sumCents([summary.sinceLastCents, ...forceAccount.map((f) => f.thisPeriodAmountCents)]),
    lines,
  };
}

const daysWords = (lines: readonly PackageForceAccountInput[]) => {
  const days = lines.reduce((t, f) => t + f.days, 0);
  return `${days === 1 ? '1 signed day' : `${days} signed days`} this period`;
};
