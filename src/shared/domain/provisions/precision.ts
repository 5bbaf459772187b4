import { DEFAULT_PAY_DECIMALS, MAX_PAY_DECIMALS, type PayUnit } from '../../constants';
import { DomainError } from '../domain-error';
import { roundTo } from '../rounding';

/**
 * How finely an item is measured and paid. Measurements are kept one decimal finer than the pay quantity
 * (FHWA WFL supplement to FP-14 section 109.01); the pay quantity is rounded from the measured figure, half away
 * from zero on the decimal value (so 11.35 pays 11.4, not the 11.3 that binary toFixed gives).
 */
export interface Precision {
  /** Decimals of the pay quantity (0..MAX_PAY_DECIMALS). */
  payDecimals: number;
  /** Decimals of a measurement: always payDecimals + 1. */
  measuredDecimals: number;
}

export function precisionFor(unit: PayUnit, payDecimals?: number): Precision {
  const pay = payDecimals ?? DEFAULT_PAY_DECIMALS[unit];
  if (!Number.isInteger(pay) || pay < 0 || pay > MAX_PAY_DECIMALS) {
    throw new DomainError('VALIDATION_FAILED', `Pay decimals must be a whole number from 0 to ${MAX_PAY_DECIMALS}`, [
      'payDecimals',
    ]);
  }
  return { payDecimals: pay, measuredDecimals: pay + 1 };
}

/** A measurement kept to its precision (one decimal finer than pay). */
export function measured(value: number, precision: Precision): number {
  return roundTo(value, precision.measuredDecimals);
}

/** The pay quantity: the measured figure rounded to the pay decimals. */
export function payQuantityOf(value: number, precision: Precision): number {
  return roundTo(measured(value, precision), precision.payDecimals);
}
