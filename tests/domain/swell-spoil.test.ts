import { unit as mathUnit } from 'mathjs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { loadCount, payQuantity } from '../../src/shared/domain/earthwork/load-count';
import { DEFAULT_MATERIALS, MATERIAL_TABLE_LABEL, materialTable } from '../../src/shared/domain/earthwork/materials';
import { conePileVolume, spoilPlan } from '../../src/shared/domain/earthwork/spoil';
import { convertVolume, loadFactor, swellPercentFromWeights } from '../../src/shared/domain/earthwork/swell';
import { CU_FT_PER_CY, M3_PER_CY, M_PER_FT, M_PER_YD, formatStation } from '../../src/shared/domain/earthwork/units';
import { roundTo } from '../../src/shared/domain/rounding';

describe('units, checked against mathjs (outside check)', () => {
  it('uses the exact international yard and foot: 1 CY = 0.764554857984 m3, 27 cu ft', () => {
    expect(mathUnit(1, 'cuyd').toNumber('m^3')).toBeCloseTo(M3_PER_CY, 15);
    expect(mathUnit(1, 'cuyd').toNumber('ft^3')).toBeCloseTo(CU_FT_PER_CY, 12);
    expect(mathUnit(1, 'yd').toNumber('m')).toBe(M_PER_YD);
    expect(mathUnit(1, 'ft').toNumber('m')).toBeCloseTo(M_PER_FT, 15);
    expect(M_PER_YD ** 3).toBeCloseTo(M3_PER_CY, 15);
  });

  it('writes stations as 100 ft stations and metric chainage (12+50.00, 1+250.000)', () => {
    expect(formatStation(1250, 'ft')).toBe('12+50.00');
    expect(formatStation(99.999, 'ft')).toBe('1+00.00');
    expect(formatStation(1250, 'm')).toBe('1+250.000');
  });

  it('rounds half away from zero on the decimal value (1.005 -> 1.01, 11.35 -> 11.4)', () => {
    expect(roundTo(1.005, 2)).toBe(1.01);
    expect(roundTo(11.35, 1)).toBe(11.4);
    expect(roundTo(-2.5, 0)).toBe(-3);
  });
});

describe('swell and shrinkage (Nichols and Day, Moving the Earth, p. 2.51)', () => {
  it('gives 26 % swell for 3,400 lb/CY bank and 2,700 lb/CY loose (published check)', () => {
    expect(swellPercentFromWeights(3400, 2700)).toBeCloseTo(25.93, 2);
    expect(Math.round(swellPercentFromWeights(3400, 2700))).toBe(26);
  });

  it('converts bank to loose and compacted, and back through bank', () => {
    const loose = convertVolume({
      volume: 100,
      from: 'bank',
      to: 'loose',
      swellPercent: 25,
      shrinkagePercent: 10,
      unit: 'ft',
    });
    expect(loose.volume).toBeCloseTo(125, 12);
    expect(loose.volumeUnit).toBe('CY');
    expect(
      convertVolume({ volume: 125, from: 'loose', to: 'compacted', swellPercent: 25, shrinkagePercent: 10 }).volume,
    ).toBeCloseTo(90, 12);
    expect(loadFactor(25)).toBeCloseTo(0.8, 15);
  });

  it('round-trips any measure through any other (property)', () => {
    const basis = fc.constantFrom('bank' as const, 'loose' as const, 'compacted' as const);
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 1e6, noNaN: true }),
        basis,
        basis,
        fc.double({ min: 0, max: 100, noNaN: true }),
        fc.double({ min: -50, max: 50, noNaN: true }),
        (v, from, to, swellPercent, shrinkagePercent) => {
          const there = convertVolume({ volume: v, from, to, swellPercent, shrinkagePercent });
          const back = convertVolume({ volume: there.volume, from: to, to: from, swellPercent, shrinkagePercent });
          expect(back.volume).toBeCloseTo(v, 6);
          expect(there.volume).toBeGreaterThanOrEqual(0);
        },
      ),
    );
  });

  it("labels the material table as editable defaults and applies a project's edits without touching them", () => {
    expect(MATERIAL_TABLE_LABEL).toMatch(/Editable defaults/);
    expect(DEFAULT_MATERIALS.find((m) => m.id === 'common-earth')!.swellPercent).toBe(25);
    const table = materialTable([
      { id: 'clay', swellPercent: 33 },
      { id: 'topsoil', name: 'Topsoil', swellPercent: 30 },
    ]);
    expect(table.find((m) => m.id === 'clay')!.swellPercent).toBe(33);
    expect(table.find((m) => m.id === 'topsoil')!.name).toBe('Topsoil');
    expect(DEFAULT_MATERIALS.find((m) => m.id === 'clay')!.swellPercent).toBe(40);
  });
});

describe('load count (truck measure: state DOT construction manual section 109.11)', () => {
  it('computes to 0.01 and pays to 0.1: 11.38 -> 11.4, 11.34 -> 11.3', () => {
    expect(payQuantity(11.38)).toBe(11.4);
    expect(payQuantity(11.34)).toBe(11.3);
  });

  it('turns loose loads into bank volume with the swell', () => {
    const r = loadCount({
      swellPercent: 25,
      loads: [
        { capacity: 14, count: 3 },
        { capacity: 10, count: 1 },
      ],
      unit: 'ft',
    });
    expect(r.looseVolume).toBe(52);
    expect(r.bankVolume).toBe(41.6);
    expect(r.payQuantity).toBe(41.6);
    expect(loadCount({ swellPercent: 12, loads: [{ capacity: 12.75, count: 1 }] }).bankVolume).toBe(11.38);
    expect(loadCount({ swellPercent: 12, loads: [{ capacity: 12.75, count: 1 }] }).payQuantity).toBe(11.4);
  });
});

describe('spoil planner', () => {
  it('matches the published stockpile table: 37 deg, 10 ft high, 26.5 ft across holds about 68 CY (68.3 computed)', () => {
    expect(conePileVolume(10, 37, 'ft')).toBeCloseTo(68.3, 1);
    const r = spoilPlan({
      unit: 'ft',
      shape: 'pile',
      bankVolume: conePileVolume(10, 37, 'ft'),
      swellPercent: 0,
      angleOfReposeDeg: 37,
    });
    expect(r.height).toBeCloseTo(10, 9);
    expect(r.diameter!).toBeCloseTo(26.5, 1);
    expect(r.footprintArea).toBeCloseTo(Math.PI * (r.diameter! / 2) ** 2, 9);
  });

  it('sizes a spoil bank as a triangular prism, B = sqrt(4A / tan a) (derivation; textbook form from memory)', () => {
    const r = spoilPlan({
      unit: 'm',
      shape: 'bank',
      bankVolume: 80,
      swellPercent: 25,
      angleOfReposeDeg: 45,
      length: 50,
    });
    expect(r.looseVolume).toBe(100);
    expect(r.width!).toBeCloseTo(Math.sqrt(4 * 2), 12);
    expect(r.height).toBeCloseTo(Math.sqrt(2), 12);
    expect((r.width! * r.height) / 2).toBeCloseTo(2, 12);
  });

  it('keeps the toe 2 ft (0.6096 m, exact) from the edge (29 CFR 1926.651(j)(2))', () => {
    const ft = spoilPlan({ unit: 'ft', shape: 'pile', bankVolume: 10, swellPercent: 25, angleOfReposeDeg: 34 });
    expect(ft.setback).toBe(2);
    expect(ft.centerFromEdge).toBeCloseTo(2 + ft.diameter! / 2, 12);
    expect(
      spoilPlan({ unit: 'm', shape: 'pile', bankVolume: 10, swellPercent: 25, angleOfReposeDeg: 34 }).setback,
    ).toBe(0.6096);
    expect(ft.cautions[0]).toMatch(/2 ft \(0\.6096 m\)/);
  });
});
