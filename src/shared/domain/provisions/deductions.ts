import { dinero, multiply } from 'dinero.js';
import { USD } from 'dinero.js/currencies';
import { FUEL_GALLONS_PER_CY, type FuelWorkKind } from '../../constants';
import { DomainError, assertNonNegative } from '../domain-error';
import { toCents, toScaled, usd, type Cents } from '../money';

/**
 * Liquidated damages: days of overrun times the daily amount, deducted on its own line (23 CFR 635.127).
 * Returned as a negative amount.
 */
export function liquidatedDamagesCents(daysOverrun: number, dailyCents: Cents): Cents {
  assertNonNegative(daysOverrun, ['daysOverrun']);
  assertNonNegative(dailyCents, ['dailyCents']);
  if (!Number.isInteger(daysOverrun)) throw new DomainError('INVALID_NUMBER', 'Days are whole days', ['daysOverrun']);
  return 0 - toCents(multiply(usd(dailyCents), daysOverrun)) || 0;
}

function dayNumber(date: string, path: string): number {
  const match = /^(\d{4})-(\d{2})-(\d{2})$/.exec(date);
  const t = match ? Date.UTC(Number(match[1]), Number(match[2]) - 1, Number(match[3])) : NaN;
  if (!match || Number.isNaN(t) || new Date(t).toISOString().slice(0, 10) !== date) {
    throw new DomainError('VALIDATION_FAILED', `Not a date (YYYY-MM-DD): ${date}`, [path]);
  }
  return t / 86_400_000;
}

/** Calendar days after the completion date until the work was complete (0 when on time). */
export function daysOverrun(completionDate: string, completedOn: string): number {
  return Math.max(0, dayNumber(completedOn, 'completedOn') - dayNumber(completionDate, 'completionDate'));
}

export interface FuelAdjustmentInput {
  kind: FuelWorkKind;
  /** Quantity of the item placed this period, CY. */
  quantityCy: number;
  /** Fuel price index at bid and for the period, dollars per gallon (up to 4 decimals). */
  baseIndex: number;
  currentIndex: number;
  /** Only a change of more than this percent of the base index is adjusted (0: any change). */
  triggerPercent?: number;
}

export interface FuelAdjustment {
  gallons: number;
  /** Positive: paid to the contractor; negative: deducted. */
  amountCents: Cents;
  applies: boolean;
}

/**
 * Fuel price adjustment: quantity x gallons per CY (0.20 excavation, 0.27 embankment: Iowa DOT 2120; FHWA T
 * 5080.3) x (current - base index), rounded once to the cent. Worked in exact scaled integers.
 */
export function fuelAdjustment(input: FuelAdjustmentInput): FuelAdjustment {
  assertNonNegative(input.quantityCy, ['quantityCy']);
  assertNonNegative(input.baseIndex, ['baseIndex'], true);
  assertNonNegative(input.currentIndex, ['currentIndex']);
  const trigger = input.triggerPercent ?? 0;
  assertNonNegative(trigger, ['triggerPercent']);
  const factor = FUEL_GALLONS_PER_CY[input.kind];
  const gallonsScaled = toScaled(factor);
  const quantity = toScaled(input.quantityCy);
  const base = toScaled(input.baseIndex);
  const current = toScaled(input.currentIndex);
  // Index difference in ten-thousandths of a dollar (scale 4 of USD).
  const diff = current.amount * 10 ** (4 - current.scale) - base.amount * 10 ** (4 - base.scale);
  const gallons = Number(
    ((quantity.amount * gallonsScaled.amount) / 10 ** (quantity.scale + gallonsScaled.scale)).toFixed(6),
  );
  const changePercentTimesBase = Math.abs(diff) * 100;
  const applies = changePercentTimesBase > trigger * base.amount * 10 ** (4 - base.scale);
  if (!applies) return { gallons, amountCents: 0, applies };
  const product = Math.abs(diff) * quantity.amount * gallonsScaled.amount;
  if (!Number.isSafeInteger(product)) {
    throw new DomainError('INVALID_QUANTITY', 'Quantity too large for an exact fuel adjustment', ['quantityCy']);
  }
  const amount = multiply(multiply(dinero({ amount: diff, currency: USD, scale: 4 }), quantity), gallonsScaled);
  return { gallons, amountCents: toCents(amount) || 0, applies }; // || 0: no -0 on a zero quantity
}
