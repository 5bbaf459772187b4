import { PAY_UNIT_LABELS, type PayUnit } from '@/shared/constants';

/** Numbers, quantities, money and percents: one formatter module shared with the server (src/shared/format.ts). */
export {
  formatCount,
  formatMoney,
  formatNumber,
  formatPercent,
  formatPercentBps,
  formatQuantity,
  formatQuantityNumber,
} from '@/shared/format';

const VOLUME_UNITS: ReadonlySet<PayUnit> = new Set<PayUnit>(['CY', 'm3']);

/** Only volumes are measured in bank, loose or compacted condition. */
export function isVolumeUnit(unit: PayUnit): boolean {
  return VOLUME_UNITS.has(unit);
}

export function unitLabel(unit: PayUnit): string {
  return PAY_UNIT_LABELS[unit];
}

const dateFormat = new Intl.DateTimeFormat('en-US', { year: 'numeric', month: 'short', day: 'numeric' });
const calendarDateFormat = new Intl.DateTimeFormat('en-US', {
  year: 'numeric',
  month: 'short',
  day: 'numeric',
  timeZone: 'UTC',
});

/**
 * "Mar 4, 2026" from an ISO timestamp (in the reader's time zone) or a calendar date "2026-03-04" (that day
 * wherever the reader is: `new Date('2026-03-04')` is UTC midnight, the 3rd west of Greenwich); the raw text when
 * it does not parse.
 */
export function formatDate(iso: string): string {
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return iso;
  return /^\d{4}-\d{2}-\d{2}$/.test(iso) ? calendarDateFormat.format(date) : dateFormat.format(date);
}

/** A pay period or any span of calendar dates: "Oct 1, 2026 – Oct 31, 2026". */
export const formatDateRange = (start: string, end: string) => `${formatDate(start)} – ${formatDate(end)}`;
