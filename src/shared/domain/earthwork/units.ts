import type { LengthUnit } from '../../constants';

export type { LengthUnit } from '../../constants';
export type VolumeUnit = 'CY' | 'm3';
export type AreaUnit = 'sq ft' | 'm2';

/** International foot and yard (1959): exact. */
export const M_PER_FT = 0.3048;
export const M_PER_YD = 0.9144;
export const CU_FT_PER_CY = 27;
/** 0.9144^3, exact in decimal: 0.764554857984 m3 per cubic yard. */
export const M3_PER_CY = 0.764554857984;

export function volumeUnitOf(unit: LengthUnit): VolumeUnit {
  return unit === 'ft' ? 'CY' : 'm3';
}

export function areaUnitOf(unit: LengthUnit): AreaUnit {
  return unit === 'ft' ? 'sq ft' : 'm2';
}

/** Cubic length units (cu ft or m3) to the result volume unit (CY or m3). */
export function cubicToVolume(cubic: number, unit: LengthUnit): number {
  return unit === 'ft' ? cubic / CU_FT_PER_CY : cubic;
}

/** Result volume unit (CY or m3) back to cubic length units (cu ft or m3). */
export function volumeToCubic(volume: number, unit: LengthUnit): number {
  return unit === 'ft' ? volume * CU_FT_PER_CY : volume;
}

/** One length in the given unit from a value in feet (thresholds published in feet, with their metric twins). */
export function lengthFor(unit: LengthUnit, feet: number, metres: number): number {
  return unit === 'ft' ? feet : metres;
}

/**
 * Station text: 100 ft stations (1250 ft -> "12+50.00"); metric chainage in km + m (1250 m -> "1+250.000").
 */
export function formatStation(station: number, unit: LengthUnit): string {
  const sign = station < 0 ? '-' : '';
  const abs = Math.abs(station);
  const size = unit === 'ft' ? 100 : 1000;
  const decimals = unit === 'ft' ? 2 : 3;
  let whole = Math.floor(abs / size);
  let rest = Number((abs - whole * size).toFixed(decimals));
  if (rest >= size) {
    whole += 1;
    rest -= size;
  }
  const width = (unit === 'ft' ? 2 : 3) + decimals + 1;
  return `${sign}${whole}+${rest.toFixed(decimals).padStart(width, '0')}`;
}
