import { toDecimal } from 'dinero.js';
import { PAY_UNIT_LABELS, type PayUnit } from '@/shared/constants';
import { usd, type Cents } from '@/shared/domain/money';

const moneyFormat = new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD' });

/** "$1,234.50" from integer cents; the decimal string comes from dinero.js, Intl only adds separators. */
export function formatMoney(cents: Cents): string {
  return toDecimal(usd(cents), ({ value }) => moneyFormat.format(Number(value)));
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
