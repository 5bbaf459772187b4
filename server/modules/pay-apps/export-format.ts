import { toDecimal } from 'dinero.js';
import { usd } from '../../../src/shared/domain/money';

/** "1234.50" from cents, by dinero.js (no floating point). */
export const decimal = (cents: number) => toDecimal(usd(cents));

/** "$1,234.50" (negative: "-$1,234.50"). */
export function dollars(cents: number): string {
  const d = decimal(Math.abs(cents)).replace(/\B(?=(\d{3})+(?!\d))/g, ',');
  return `${cents < 0 ? '-' : ''}$${d}`;
}

/** A quantity with separators and up to 4 decimals, at least 2: 12500 -> "12,500.00". */
export function quantityText(q: number): string {
  return new Intl.NumberFormat('en-US', { minimumFractionDigits: 2, maximumFractionDigits: 4 }).format(q);
}

export const percentText = (bps: number) => `${new Intl.NumberFormat('en-US', { maximumFractionDigits: 2 }).format(bps / 100)} %`;

/** `millbrook-commons-pay-app-03-2026-10.pdf`: project, number and the month the period ends in. */
export function exportFileName(projectName: string, number: number, periodEnd: string, ext: 'pdf' | 'csv'): string {
  const slug = projectName.toLowerCase().normalize('NFKD').replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 60) || 'project';
  return `${slug}-pay-app-${String(number).padStart(2, '0')}-${periodEnd.slice(0, 7)}.${ext}`;
}
