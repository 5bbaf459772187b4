import type { LengthUnit } from './units';
import { areaUnitOf, volumeUnitOf } from './units';

/**
 * A calculation trail: readable steps, in order, that a reviewer can check by hand. Each step states the
 * formula or rule, its source where it has one, and the numbers it used. Long inputs are summarised, never
 * listed row by row (the rows are in the result itself).
 */
export type Trail = string[];

/** Fixed-decimal number with thousands separators, independent of the machine's locale: 12345.678 -> "12,345.68". */
export function fmt(value: number, decimals = 2): string {
  if (!Number.isFinite(value)) return String(value);
  const fixed = Math.abs(value).toFixed(decimals);
  const [whole = '0', fraction] = fixed.split('.');
  const grouped = whole.replace(/\B(?=(\d{3})+(?!\d))/g, ',');
  const negative = value < 0 && Number(fixed) !== 0;
  return `${negative ? '-' : ''}${grouped}${fraction ? `.${fraction}` : ''}`;
}

export function fmtVolume(volume: number, unit: LengthUnit, decimals = 2): string {
  return `${fmt(volume, decimals)} ${volumeUnitOf(unit)}`;
}

export function fmtArea(area: number, unit: LengthUnit, decimals = 2): string {
  return `${fmt(area, decimals)} ${areaUnitOf(unit)}`;
}

export function fmtLength(length: number, unit: LengthUnit, decimals = 2): string {
  return `${fmt(length, decimals)} ${unit}`;
}

/** "ft" results carry a cubic-feet step so the /27 is visible. */
export function cubicStep(cubic: number, unit: LengthUnit): string {
  return unit === 'ft'
    ? `${fmt(cubic)} cu ft / 27 = ${fmt(cubic / 27)} CY`
    : `${fmt(cubic)} m3`;
}

/** At most `max` items rendered, then "... and N more". */
export function listSome<T>(items: readonly T[], max: number, render: (item: T, index: number) => string): string[] {
  const shown = items.slice(0, max).map(render);
  if (items.length > max) shown.push(`... and ${fmt(items.length - max, 0)} more`);
  return shown;
}
