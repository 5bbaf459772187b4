import type { LengthUnit, UnitSystem } from '@/shared/constants';
import { areaUnitOf, volumeUnitOf } from '@/shared/domain/earthwork/units';

export function lengthUnitOf(system: UnitSystem): LengthUnit {
  return system === 'metric' ? 'm' : 'ft';
}

/** The labels a worksheet prints beside its numbers. */
export function unitLabels(unit: LengthUnit) {
  return { length: unit, area: areaUnitOf(unit), volume: volumeUnitOf(unit) };
}

const numberFormat = new Intl.NumberFormat('en-US', { minimumFractionDigits: 2, maximumFractionDigits: 2 });

/** "1,234.57" (two decimals, separators); a dash for a missing number. */
export function fmt2(value: number | null | undefined): string {
  return value === null || value === undefined || !Number.isFinite(value) ? '–' : numberFormat.format(value);
}
