import { toDecimal } from 'dinero.js';
import type { MeasurementBasis, PayUnit } from './constants';
import { usd, type Cents } from './domain/money';
import { roundTo } from './domain/rounding';

/**
 * One way to show numbers, for the screens, toasts, e-mails, the PDF and the CSV alike. Locale-independent
 * (en-US separators on every machine), so the server and the browser print the same text.
 */

/**
 * Decimals a quantity is SHOWN with, per pay unit. The data keeps its pay precision (numeric(16,4); truck measure
 * pays to 0.1): this is display only. Volumes, areas and weights to 0.01, feet to 0.1, metres to 0.01, counts whole
 * (common practice: one decimal finer than the usual pay quantity).
 */
export const QUANTITY_DISPLAY_DECIMALS: Record<PayUnit, number> = {
  CY: 2,
  m3: 2,
  SY: 2,
  m2: 2,
  TON: 2,
  t: 2,
  LF: 1,
  m: 2,
  EA: 0,
  LS: 2,
  // Time-based work: tenths of a day, hundredths of an hour (common practice, from memory).
  DAY: 1,
  HR: 2,
};

/** Digits with thousands separators: 12345.678 with 2 decimals -> "12,345.68" (half away from zero). */
export function formatNumber(value: number, decimals: number, separators = true): string {
  if (!Number.isFinite(value)) return '–';
  const fixed = Math.abs(roundTo(value, decimals)).toFixed(decimals);
  const [whole = '0', fraction] = fixed.split('.');
  const grouped = separators ? whole.replace(/\B(?=(\d{3})+(?!\d))/g, ',') : whole;
  const negative = value < 0 && Number(fixed) !== 0;
  return `${negative ? '-' : ''}${grouped}${fraction ? `.${fraction}` : ''}`;
}

/** The number alone at the unit's display precision: "2,849.78" for CY, "140.5" for LF, "3" for EA. */
export function formatQuantityNumber(quantity: number, unit: PayUnit): string {
  return formatNumber(quantity, QUANTITY_DISPLAY_DECIMALS[unit]);
}

/** "2,849.78 CY"; with a basis for volumes: "2,849.78 CY bank". A quantity is never shown without its unit. */
export function formatQuantity(quantity: number, unit: PayUnit, basis?: MeasurementBasis | null): string {
  return `${formatQuantityNumber(quantity, unit)} ${unit}${basis ? ` ${basis}` : ''}`;
}

/**
 * For CSV cells: the quantity as the data holds it (up to the stored 4 decimals, no separators), so a spreadsheet
 * reads a number and its quantity x unit price gives the amounts in the file.
 */
export function formatQuantityPlain(quantity: number): string {
  return String(roundTo(quantity, 4));
}

/** "1 file", "2 files", "1,200 loads": a count with its noun, singular or plural. */
export function formatCount(count: number, singular: string, plural = `${singular}s`): string {
  return `${formatNumber(count, 0)} ${count === 1 ? singular : plural}`;
}

/** "$1,234.50" from integer cents; the decimal string comes from dinero.js, only separators are added. */
export function formatMoney(cents: Cents): string {
  return toDecimal(usd(cents), ({ value }) => {
    const negative = value.startsWith('-');
    const [whole = '0', fraction = '00'] = (negative ? value.slice(1) : value).split('.');
    return `${negative ? '-' : ''}$${whole.replace(/\B(?=(\d{3})+(?!\d))/g, ',')}.${fraction.padEnd(2, '0')}`;
  });
}

/** For CSV cells: "1234.50", no currency sign or separators. */
export function formatMoneyPlain(cents: Cents): string {
  return toDecimal(usd(cents));
}

/** "10 %" from a percent; up to `decimals` decimals, trailing zeros dropped. */
export function formatPercent(percent: number, decimals = 2): string {
  if (!Number.isFinite(percent)) return '–';
  return `${formatNumber(percent, decimals).replace(/\.?0+$/, '')} %`;
}

/** "10 %" from basis points (1000 bps). */
export function formatPercentBps(bps: number): string {
  return formatPercent(bps / 100);
}
