import { DomainError, assertNonNegative } from '../domain-error';
import { lineAmountCents, type Cents } from '../money';
import { roundTo } from '../rounding';

/**
 * Stored materials (23 CFR 635.122): materials delivered and stored but not yet built in may be paid on a paid
 * invoice, up to what the job needs, at invoice cost (no overhead and profit). A running account per material:
 * previously stored, added, used (built in), remaining.
 */
export interface StoredMaterialAccount {
  /** Invoice cost per unit, cents. */
  unitCostCents: Cents;
  /** Quantity the job needs, in the material's unit. */
  neededQuantity: number;
}

export interface StoredMovement {
  /** `added`: delivered to storage; `used`: taken out and built in. */
  kind: 'added' | 'used';
  quantity: number;
  /** Pay period the movement belongs to (1, 2, ...). */
  period: number;
}

export interface StoredPeriodAccount {
  previousQuantity: number;
  addedQuantity: number;
  usedQuantity: number;
  remainingQuantity: number;
  /** Remaining quantity payable: the part of it the job still needs. */
  payableQuantity: number;
  /** Payable quantity x invoice unit cost, rounded once to the cent. */
  payableCents: Cents;
}

const DECIMALS = 4;

/** The account as at the end of `period`. Using more than is stored is refused with the movement that does it. */
export function storedAccount(
  account: StoredMaterialAccount,
  movements: readonly StoredMovement[],
  period: number,
): StoredPeriodAccount {
  assertNonNegative(account.unitCostCents, ['unitCostCents']);
  assertNonNegative(account.neededQuantity, ['neededQuantity']);
  let previous = 0;
  let added = 0;
  let used = 0;
  let usedToDate = 0;
  const ordered = movements.map((m, i) => ({ ...m, i })).sort((a, b) => a.period - b.period || a.i - b.i);
  let onHand = 0;
  for (const m of ordered) {
    assertNonNegative(m.quantity, ['movements', m.i, 'quantity']);
    if (m.period > period) continue;
    const signed = m.kind === 'added' ? m.quantity : -m.quantity;
    onHand = roundTo(onHand + signed, DECIMALS);
    if (onHand < 0) {
      throw new DomainError('INVALID_QUANTITY', 'More is used than was stored', ['movements', m.i, 'quantity']);
    }
    if (m.kind === 'used') usedToDate = roundTo(usedToDate + m.quantity, DECIMALS);
    if (m.period < period) previous = roundTo(previous + signed, DECIMALS);
    else if (m.kind === 'added') added = roundTo(added + m.quantity, DECIMALS);
    else used = roundTo(used + m.quantity, DECIMALS);
  }
  const stillNeeded = Math.max(0, roundTo(account.neededQuantity - usedToDate, DECIMALS));
  const payableQuantity = Math.min(onHand, stillNeeded);
  return {
    previousQuantity: previous,
    addedQuantity: added,
    usedQuantity: used,
    remainingQuantity: onHand,
    payableQuantity,
    payableCents: lineAmountCents(payableQuantity, account.unitCostCents),
  };
}
