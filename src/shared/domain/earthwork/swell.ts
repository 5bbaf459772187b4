import type { MeasurementBasis } from '../../constants';
import { DomainError, assertFinite, assertNonNegative } from '../domain-error';
import { fmt, type Trail } from './trail';
import { volumeUnitOf, type LengthUnit, type VolumeUnit } from './units';

/**
 * Bank, loose and compacted measure (Nichols and Day, Moving the Earth, p. 2.51):
 *   loose = bank x (1 + swell); load factor = 1 / (1 + swell);
 *   compacted = bank x shrinkage factor, shrinkage factor = fill volume / bank volume = 1 - shrinkage.
 * Cuts are measured in bank and fills in compacted measure (US Navy EO manual, Table 4-1).
 */
export interface ConvertInput {
  volume: number;
  from: MeasurementBasis;
  to: MeasurementBasis;
  swellPercent: number;
  shrinkagePercent: number;
  /** Optional: only labels the result (CY for ft projects, m3 for metric); conversions are unit-free. */
  unit?: LengthUnit;
}

export interface ConvertResult {
  volume: number;
  from: MeasurementBasis;
  to: MeasurementBasis;
  /** Multiplier applied: result = input x factor. */
  factor: number;
  volumeUnit: VolumeUnit | 'input unit';
  trail: Trail;
}

/** Volume of one bank unit in each measure. */
export function measureFactors(swellPercent: number, shrinkagePercent: number): Record<MeasurementBasis, number> {
  return { bank: 1, loose: 1 + swellPercent / 100, compacted: 1 - shrinkagePercent / 100 };
}

export function loadFactor(swellPercent: number): number {
  return 1 / (1 + swellPercent / 100);
}

/** Swell percent from unit weights: bank / loose - 1 (3,400 and 2,700 lb/CY give 25.9 %). */
export function swellPercentFromWeights(bankWeight: number, looseWeight: number): number {
  return (bankWeight / looseWeight - 1) * 100;
}

/** Shrinkage percent from a bank volume and the compacted volume it made: (1 - compacted / bank) x 100. */
export function shrinkagePercentFromVolumes(bankVolume: number, compactedVolume: number): number {
  return (1 - compactedVolume / bankVolume) * 100;
}

function checkFactors(swellPercent: number, shrinkagePercent: number): void {
  assertNonNegative(swellPercent, ['swellPercent']);
  assertFinite(shrinkagePercent, ['shrinkagePercent']);
  if (shrinkagePercent >= 100 || shrinkagePercent <= -100) {
    throw new DomainError('INVALID_NUMBER', 'Shrinkage must be between -100 and 100 percent', ['shrinkagePercent']);
  }
}

/** Converts a volume between bank, loose and compacted measure (through bank). */
export function convertVolume(input: ConvertInput): ConvertResult {
  const { volume, from, to, swellPercent, shrinkagePercent } = input;
  assertNonNegative(volume, ['volume']);
  checkFactors(swellPercent, shrinkagePercent);
  const f = measureFactors(swellPercent, shrinkagePercent);
  const factor = f[to] / f[from];
  const bank = volume / f[from];
  const result = bank * f[to];
  const label = input.unit ? volumeUnitOf(input.unit) : 'input unit';
  const trail: Trail = [
    `Factors per bank unit (Nichols and Day, Moving the Earth, p. 2.51): loose = 1 + swell = ${fmt(f.loose, 4)}; compacted = 1 - shrinkage = ${fmt(f.compacted, 4)}`,
    from === 'bank' ? `Bank volume ${fmt(volume, 3)}` : `Bank = ${from} / ${fmt(f[from], 4)} = ${fmt(volume, 3)} / ${fmt(f[from], 4)} = ${fmt(bank, 3)}`,
    to === 'bank' ? `Result ${fmt(result, 3)} bank ${label}` : `${to} = bank x ${fmt(f[to], 4)} = ${fmt(result, 3)} ${label}`,
  ];
  return { volume: result, from, to, factor, volumeUnit: label, trail };
}
