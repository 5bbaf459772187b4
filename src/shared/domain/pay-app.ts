import { DomainError, assertFinite, assertNonNegative } from './domain-error';
import { fmt, type Trail } from './earthwork/trail';
import { lineAmountCents, percentOfCents, subtractCents, sumCents, type Cents } from './money';
import { addExact, decimalOf, pow10 } from './decimal';
import { roundTo } from './rounding';

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
  /**
   * Materials stored for the item and not yet built in at the period's end (payable value, cents; default 0).
   * Retainage is held on work and stored materials alike.
   */
  storedMaterialsCents?: Cents;
}

export interface PayAppInput {
  /** Retainage withheld on every line, percent (10 for 10 %). */
  retainagePercent: number;
  /** Sum of the amounts certified on earlier applications, cents. */
  previousCertifiedCents: Cents;
  lines: readonly PayAppLineInput[];
  /** Deductions and adjustments dated up to the period's end, cents (negative: deducted; default 0). */
  adjustmentsToDateCents?: Cents;
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
  /** Materials stored at the period's end (as given). */
  storedMaterialsCents: Cents;
  /** Retainage held to date on the line: on amount to date + materials stored. */
  retainageCents: Cents;
}

export interface PayAppResult {
  lines: PayAppLineResult[];
  contractAmountCents: Cents;
  earnedToDateCents: Cents;
  thisPeriodCents: Cents;
  /** Sum of the lines' materials stored. */
  storedMaterialsCents: Cents;
  /** Deductions and adjustments to date (as given). */
  adjustmentsCents: Cents;
  retainageCents: Cents;
  /** Rate applied (percent), after any reduction. */
  retainagePercentApplied: number;
  percentComplete: number | null;
  /**
   * Earned to date + materials stored - retainage to date + adjustments to date - previous certified (negative:
   * a credit).
   */
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
  if (
    line.storedMaterialsCents !== undefined &&
    (!Number.isSafeInteger(line.storedMaterialsCents) || line.storedMaterialsCents < 0)
  ) {
    throw new DomainError('INVALID_NUMBER', 'Materials stored are whole cents, 0 or more', [
      'lines',
      i,
      'storedMaterialsCents',
    ]);
  }
  if (line.previousQuantity + line.thisPeriodQuantity < 0) {
    throw new DomainError('INVALID_QUANTITY', 'The quantity to date cannot go below 0', [
      'lines',
      i,
      'thisPeriodQuantity',
    ]);
  }
}

/** Sum of cents, refused as INVALID_NUMBER naming `path` when beyond a safe integer (not a RangeError). */
function checkedSum(amounts: readonly Cents[], path: (string | number)[], what: string): Cents {
  const total = amounts.reduce((sum, c) => sum + BigInt(c), 0n);
  if (total > BigInt(Number.MAX_SAFE_INTEGER) || total < -BigInt(Number.MAX_SAFE_INTEGER)) {
    throw new DomainError('INVALID_NUMBER', `${what} comes to ${total} cents, beyond the largest amount stored`, path);
  }
  return sumCents(amounts);
}

/** earned / contract x 100 >= percent, decided exactly on integers (57 % of $1,000,000 is exactly $570,000). */
export function reachesPercent(earnedCents: Cents, contractCents: Cents, percent: number): boolean {
  const p = decimalOf(percent);
  return BigInt(earnedCents) * 100n * pow10(p.scale) >= p.digits * BigInt(contractCents);
}

/**
 * Pay application arithmetic in integer cents (dinero.js). Per line: to-date quantity = previous + this period;
 * amount to date = to-date quantity x unit price, rounded to the cent once; retainage on the line's amount to
 * date plus materials stored, rounded once. Totals are sums of the line figures, so they always equal the sum of
 * their lines. Current due = earned to date + materials stored - retainage to date + adjustments to date -
 * previous certified (earlier current-due amounts already hold earlier adjustments, so adjustments count to date).
 */
export function payApplication(input: PayAppInput): PayAppResult {
  assertNonNegative(input.retainagePercent, ['retainagePercent']);
  assertFinite(input.previousCertifiedCents, ['previousCertifiedCents']);
  if (!Number.isSafeInteger(input.previousCertifiedCents))
    throw new DomainError('INVALID_NUMBER', 'Amounts are whole cents', ['previousCertifiedCents']);
  const adjustmentsCents = input.adjustmentsToDateCents ?? 0;
  if (!Number.isSafeInteger(adjustmentsCents))
    throw new DomainError('INVALID_NUMBER', 'Amounts are whole cents', ['adjustmentsToDateCents']);
  input.lines.forEach(checkLine);
  const priced = input.lines.map((l, i) => {
    // Exact decimal sum (1.00005 + 0 stays 1.00005): the quantity is priced as given, rounded once to the cent.
    const toDateQuantity = addExact(l.previousQuantity, l.thisPeriodQuantity);
    const previousAtPrice = lineAmountCents(l.previousQuantity, l.unitPriceCents, ['lines', i, 'previousQuantity']);
    const toDateAtPrice = lineAmountCents(toDateQuantity, l.unitPriceCents, ['lines', i, 'thisPeriodQuantity']);
    const previousAmountCents = l.previousAmountCents ?? previousAtPrice;
    // This period at today's price = to date at today's price - previous at today's price (each rounded once),
    // so with an unchanged price the amount to date is the to-date quantity x price rounded once. A correction
    // (negative quantity) after a price change is taken back at the average price it was paid at.
    const takenBack = previousAmountCents !== previousAtPrice && l.thisPeriodQuantity < 0 && l.previousQuantity > 0;
    const amountToDateCents = takenBack
      ? roundHalfAwayFromZero((previousAmountCents * toDateQuantity) / l.previousQuantity)
      : sumCents([previousAmountCents, subtractCents(toDateAtPrice, previousAtPrice)]);
    return {
      toDateQuantity,
      contractAmountCents: lineAmountCents(l.contractQuantity, l.unitPriceCents, ['lines', i, 'contractQuantity']),
      previousAmountCents,
      amountToDateCents,
      storedMaterialsCents: l.storedMaterialsCents ?? 0,
    };
  });
  const contractAmountCents = checkedSum(
    priced.map((p) => p.contractAmountCents),
    ['lines'],
    'The contract amount',
  );
  const earnedToDateCents = checkedSum(
    priced.map((p) => p.amountToDateCents),
    ['lines'],
    'The amount earned to date',
  );
  const percentComplete = contractAmountCents > 0 ? (earnedToDateCents / contractAmountCents) * 100 : null;
  const reduction = input.retainageReduction;
  const reduced =
    reduction !== undefined &&
    contractAmountCents > 0 &&
    reachesPercent(earnedToDateCents, contractAmountCents, reduction.afterPercentComplete);
  const rate = reduced ? reduction!.reducedPercent : input.retainagePercent;
  const ratePath = reduced ? ['retainageReduction', 'reducedPercent'] : ['retainagePercent'];
  const lines: PayAppLineResult[] = priced.map((p, i) => ({
    ...p,
    thisPeriodAmountCents: subtractCents(p.amountToDateCents, p.previousAmountCents),
    retainageCents: percentOfCents(
      checkedSum([p.amountToDateCents, p.storedMaterialsCents], ['lines', i, 'storedMaterialsCents'], 'The line'),
      rate,
      ['lines', i, ...ratePath],
    ),
  }));
  const storedMaterialsCents = checkedSum(
    lines.map((l) => l.storedMaterialsCents),
    ['lines'],
    'The materials stored',
  );
  const retainageCents = checkedSum(
    lines.map((l) => l.retainageCents),
    ['lines'],
    'The retainage',
  );
  const thisPeriodCents = checkedSum(
    lines.map((l) => l.thisPeriodAmountCents),
    ['lines'],
    'The amount this period',
  );
  const currentDue =
    BigInt(earnedToDateCents) +
    BigInt(storedMaterialsCents) -
    BigInt(retainageCents) +
    BigInt(adjustmentsCents) -
    BigInt(input.previousCertifiedCents);
  if (currentDue > BigInt(Number.MAX_SAFE_INTEGER) || currentDue < -BigInt(Number.MAX_SAFE_INTEGER)) {
    throw new DomainError('INVALID_NUMBER', 'The current amount due is beyond the largest amount stored', [
      'previousCertifiedCents',
    ]);
  }
  const currentDueCents = subtractCents(
    sumCents([earnedToDateCents, storedMaterialsCents, adjustmentsCents]),
    sumCents([retainageCents, input.previousCertifiedCents]),
  );
  const $ = (c: number) => `$${fmt(c / 100)}`;
  const trail: Trail = [
    `${lines.length} lines: amount to date = previous amount as certified + this period at the current unit price (to date x price - previous x price, each rounded once to the cent)`,
    `Earned to date = sum of lines = ${$(earnedToDateCents)} of ${$(contractAmountCents)} contract${percentComplete === null ? '' : ` (${fmt(percentComplete, 2)} % complete)`}`,
    reduced
      ? `Retainage reduced to ${fmt(rate, 2)} % after ${fmt(reduction!.afterPercentComplete, 2)} % complete; per line, rounded once: ${$(retainageCents)}`
      : `Retainage ${fmt(rate, 2)} % per line, rounded once: ${$(retainageCents)}`,
    storedMaterialsCents !== 0 || adjustmentsCents !== 0
      ? `Current due = earned to date + materials stored - retainage to date + adjustments to date - previous certified = ${$(earnedToDateCents)} + ${$(storedMaterialsCents)} - ${$(retainageCents)} + ${$(adjustmentsCents)} - ${$(input.previousCertifiedCents)} = ${$(currentDueCents)}`
      : `Current due = earned to date - retainage to date - previous certified = ${$(earnedToDateCents)} - ${$(retainageCents)} - ${$(input.previousCertifiedCents)} = ${$(currentDueCents)}`,
  ];
  return {
    lines,
    contractAmountCents,
    earnedToDateCents,
    thisPeriodCents,
    storedMaterialsCents,
    adjustmentsCents,
    retainageCents,
    retainagePercentApplied: rate,
    percentComplete,
    currentDueCents,
    trail,
  };
}
