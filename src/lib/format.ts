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

/** "Mar 4, 2026" from an ISO timestamp; the raw text when it does not parse. */
export function formatDate(iso: string): string {
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? iso : dateFormat.format(date);
}
