import { add, dinero, toDecimal, toSnapshot, type Dinero } from 'dinero.js';
import { USD } from 'dinero.js/currencies';
import { PAY_UNIT_LABELS, type PayUnit } from '@/shared/constants';

const moneyFormat = new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD' });

/** A dinero.js amount from integer cents (USD). */
export function money(cents: number): Dinero<number> {
  return dinero({ amount: cents, currency: USD });
}

/** "$1,234.50" from integer cents; the decimal string comes from dinero.js, Intl only adds separators. */
export function formatMoney(cents: number): string {
  return toDecimal(money(cents), ({ value }) => moneyFormat.format(Number(value)));
}

/** Sum of integer-cent amounts through dinero.js, back in integer cents. */
export function sumCents(amounts: readonly number[]): number {
  const total = amounts.reduce<Dinero<number>>((sum, cents) => add(sum, money(cents)), money(0));
  return toSnapshot(total).amount;
}

const COUNT_UNITS: ReadonlySet<PayUnit> = new Set<PayUnit>(['EA', 'LS']);

/** The number alone, with separators: whole numbers for counted units, two decimals for measured ones. */
export function formatQuantityNumber(quantity: number, unit: PayUnit): string {
  const whole = COUNT_UNITS.has(unit) && Number.isInteger(quantity);
  return new Intl.NumberFormat('en-US', {
    minimumFractionDigits: whole ? 0 : 2,
    maximumFractionDigits: whole ? 0 : 3,
  }).format(quantity);
}

/** "12,500.00 CY": a quantity is never shown without its unit. */
export function formatQuantity(quantity: number, unit: PayUnit): string {
  return `${formatQuantityNumber(quantity, unit)} ${unit}`;
}

const VOLUME_UNITS: ReadonlySet<PayUnit> = new Set<PayUnit>(['CY', 'm3']);

/** Only volumes are measured in bank, loose or compacted condition. */
export function isVolumeUnit(unit: PayUnit): boolean {
  return VOLUME_UNITS.has(unit);
}

export function unitLabel(unit: PayUnit): string {
  return PAY_UNIT_LABELS[unit];
}

/** "10 %" from basis points (1000 bps). */
export function formatPercentBps(bps: number): string {
  return `${new Intl.NumberFormat('en-US', { maximumFractionDigits: 2 }).format(bps / 100)} %`;
}

const dateFormat = new Intl.DateTimeFormat('en-US', { year: 'numeric', month: 'short', day: 'numeric' });

/** "Mar 4, 2026" from an ISO timestamp; the raw text when it does not parse. */
export function formatDate(iso: string): string {
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? iso : dateFormat.format(date);
}
