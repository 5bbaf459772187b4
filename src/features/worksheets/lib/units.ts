import type { LengthUnit, UnitSystem } from '@/shared/constants';
import { areaUnitOf, volumeUnitOf } from '@/shared/domain/earthwork/units';
import { formatNumber } from '@/shared/format';

export function lengthUnitOf(system: UnitSystem): LengthUnit {
  return system === 'metric' ? 'm' : 'ft';
}

/** The labels a worksheet prints beside its numbers. */
export function unitLabels(unit: LengthUnit) {
  return { length: unit, area: areaUnitOf(unit), volume: volumeUnitOf(unit) };
}

/** "1,234.57" (two decimals, separators, the shared formatter); a dash for a missing number. */
export function fmt2(value: number | null | undefined): string {
  return value === null || value === undefined ? '–' : formatNumber(value, 2);
}
