import { DomainError, assertFinite, assertNonNegative } from './domain-error';
import { fmt, type Trail } from './earthwork/trail';
import { lineAmountCents, percentOfCents, subtractCents, sumCents, type Cents } from './money';
import { addDecimals, roundTo } from './rounding';

const roundHalfAwayFromZero = (value: number) => roundTo(value, 0);

export interface PayAppLineInput {
  unitPriceCents: Cents;
  contractQuantity: number;
  previousQuantity: number;
  /** May be negative to correct an earlier period, as long as the to-date quantity stays at or above 0. */
  thisPeriodQuantity: number;
  /**
   * Amount to date on the previous certified application, as certified (cents). Given, it stands as the previous
   * amount whatever today's unit price is: a price change applies only to quantities paid after it. Absent, the
   * previous amount is previous quantity x unit price.
   */
  previousAmountCents?: Cents;
}

export interface PayAppInput {
  /** Retainage withheld on every line, percent (10 for 10 %). */
  retainagePercent: number;
  /** Sum of the amounts certified on earlier applications, cents. */
  previousCertifiedCents: Cents;
  lines: readonly PayAppLineInput[];
  /**
   * Optional reduction: once the work is this far complete (earned to date / contract amount, percent), every
   * line's retainage is taken at `reducedPercent` instead (e.g. 5 % after 50 % complete).
   */
  retainageReduction?: { afterPercentComplete: number; reducedPercent: number };
}

export interface PayAppLineResult {
  toDateQuantity: number;
  contractAmountCents: Cents;
  previousAmountCents: Cents;
  amountToDateCents: Cents;
  /** Amount to date - previous amount, so the columns always add across. */
  thisPeriodAmountCents: Cents;
  /** Retainage held to date on the line. */
  retainageCents: Cents;
}

export interface PayAppResult {
  lines: PayAppLineResult[];
  contractAmountCents: Cents;
  earnedToDateCents: Cents;
  thisPeriodCents: Cents;
  retainageCents: Cents;
  /** Rate applied (percent), after any reduction. */
  retainagePercentApplied: number;
  percentComplete: number | null;
  /** Earned to date - retainage to date - previous certified (negative: a credit). */
  currentDueCents: Cents;
  trail: Trail;
}

function checkLine(line: PayAppLineInput, i: number): void {
  assertFinite(line.unitPriceCents, ['lines', i, 'unitPriceCents']);
  if (!Number.isSafeInteger(line.unitPriceCents))
    throw new DomainError('INVALID_NUMBER', 'Unit price is whole cents', ['lines', i, 'unitPriceCents']);
  assertNonNegative(line.contractQuantity, ['lines', i, 'contractQuantity']);
  assertNonNegative(line.previousQuantity, ['lines', i, 'previousQuantity']);
  assertFinite(line.thisPeriodQuantity, ['lines', i, 'thisPeriodQuantity']);
  if (line.previousAmountCents !== undefined && !Number.isSafeInteger(line.previousAmountCents)) {
    throw new DomainError('INVALID_NUMBER', 'Amounts are whole cents', ['lines', i, 'previousAmountCents']);
  }
  if (line.previousQuantity + line.thisPeriodQuantity < 0) {
    throw new DomainError('INVALID_QUANTITY', 'The quantity to date cannot go below 0', [
      'lines',
      i,
      'thisPeriodQuantity',
    ]);
  }
}

/**
 * Pay application arithmetic in integer cents (dinero.js). Per line: to-date quantity = previous + this period;
 * amount to date = to-date quantity x unit price, rounded to the cent once; retainage on the line's amount to
 * date, rounded once. Totals are sums of the line figures, so they always equal the sum of their lines. Current
 * due = earned to date - retainage to date - previous certified.
 */
export function payApplication(input: PayAppInput): PayAppResult {
  assertNonNegative(input.retainagePercent, ['retainagePercent']);
  assertFinite(input.previousCertifiedCents, ['previousCertifiedCents']);
  if (!Number.isSafeInteger(input.previousCertifiedCents))
    throw new DomainError('INVALID_NUMBER', 'Amounts are whole cents', ['previousCertifiedCents']);
  input.lines.forEach(checkLine);
  const priced = input.lines.map((l) => {
    const toDateQuantity = addDecimals(l.previousQuantity, l.thisPeriodQuantity);
    const previousAtPrice = lineAmountCents(l.previousQuantity, l.unitPriceCents);
    const previousAmountCents = l.previousAmountCents ?? previousAtPrice;
    // This period at today's price = to date at today's price - previous at today's price (each rounded once),
    // so with an unchanged price the amount to date is the to-date quantity x price rounded once.
    const thisPeriodAtPrice = subtractCents(lineAmountCents(toDateQuantity, l.unitPriceCents), previousAtPrice);
    // A correction (negative quantity) after a price change takes back at the average price it was paid at.
    const takenBack = previousAmountCents !== previousAtPrice && l.thisPeriodQuantity < 0 && l.previousQuantity > 0;
    const amountToDateCents = takenBack
      ? roundHalfAwayFromZero((previousAmountCents * toDateQuantity) / l.previousQuantity)
      : sumCents([previousAmountCents, thisPeriodAtPrice]);
    return {
      toDateQuantity,
      contractAmountCents: lineAmountCents(l.contractQuantity, l.unitPriceCents),
      previousAmountCents,
      amountToDateCents,
    };
  });
  const contractAmountCents = sumCents(priced.map((p) => p.contractAmountCents));
  const earnedToDateCents = sumCents(priced.map((p) => p.amountToDateCents));
  const percentComplete = contractAmountCents > 0 ? (earnedToDateCents / contractAmountCents) * 100 : null;
  const reduction = input.retainageReduction;
  const reduced =
    reduction !== undefined && percentComplete !== null && percentComplete >= reduction.afterPercentComplete;
  const rate = reduced ? reduction!.reducedPercent : input.retainagePercent;
  const lines: PayAppLineResult[] = priced.map((p) => ({
    ...p,
    thisPeriodAmountCents: subtractCents(p.amountToDateCents, p.previousAmountCents),
    retainageCents: percentOfCents(p.amountToDateCents, rate),
  }));
  const retainageCents = sumCents(lines.map((l) => l.retainageCents));
  const thisPeriodCents = sumCents(lines.map((l) => l.thisPeriodAmountCents));
  const currentDueCents = subtractCents(subtractCents(earnedToDateCents, retainageCents), input.previousCertifiedCents);
  const $ = (c: number) => `$${fmt(c / 100)}`;
  const trail: Trail = [
    `${lines.length} lines: amount to date = previous amount as certified + this period at the current unit price (to date x price - previous x price, each rounded once to the cent)`,
    `Earned to date = sum of lines = ${$(earnedToDateCents)} of ${$(contractAmountCents)} contract${percentComplete === null ? '' : ` (${fmt(percentComplete, 2)} % complete)`}`,
    reduced
      ? `Retainage reduced to ${fmt(rate, 2)} % after ${fmt(reduction!.afterPercentComplete, 2)} % complete; per line, rounded once: ${$(retainageCents)}`
      : `Retainage ${fmt(rate, 2)} % per line, rounded once: ${$(retainageCents)}`,
    `Current due = earned to date - retainage to date - previous certified = ${$(earnedToDateCents)} - ${$(retainageCents)} - ${$(input.previousCertifiedCents)} = ${$(currentDueCents)}`,
  ];
  return {
    lines,
    contractAmountCents,
    earnedToDateCents,
    thisPeriodCents,
    retainageCents,
    retainagePercentApplied: rate,
    percentComplete,
    currentDueCents,
    trail,
  };
}
