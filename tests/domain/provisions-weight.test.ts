import fc from 'fast-check';
import { bignumber, divide, round, type BigNumber } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { DomainError } from '../../src/shared/domain/domain-error';
import {
  bandToHalfCy,
  conversionFactor,
  moistureCorrected,
  netWeight,
  tonsToCubicYards,
} from '../../src/shared/domain/provisions/weight';

describe('scale tickets: net = gross - tare, tons to 0.01 (common practice)', () => {
  it('nets 32.47 t gross less 13.85 t tare to 18.62 t, exactly', () => {
    expect(netWeight(32.47, 13.85)).toBe(18.62);
  });
  it('refuses a tare at or above gross, naming the tare', () => {
    expect(() => netWeight(13.85, 13.85)).toThrow(expect.objectContaining({ code: 'INVALID_QUANTITY', path: 'tare' }));
  });
});

describe("ton-to-volume factor (Resident Engineer's Manual section 109.12: at least 3 loads, computed to 4, used to 3)", () => {
  const loads = [
    { netTons: 18.42, volumeCy: 12.5 },
    { netTons: 19.1, volumeCy: 13.0 },
    { netTons: 18.75, volumeCy: 12.7 },
  ];

  it('takes 56.27 t over 38.2 CY = 1.47303... as 1.4730 computed and 1.473 used (hand-worked)', () => {
    expect(conversionFactor(loads)).toEqual({ computed: 1.473, used: 1.473, loads: 3 });
    const exact = divide(bignumber('56.27'), bignumber('38.2')) as BigNumber;
    expect(Number(round(exact, 4).toString())).toBe(1.473);
  });

  it('computes to 4 and uses 3: 20.00 t over 13.0 CY = 1.538461... -> 1.5385, used 1.539 (hand-worked)', () => {
    const f = conversionFactor([
      { netTons: 5, volumeCy: 3.25 },
      { netTons: 7, volumeCy: 4.55 },
      { netTons: 8, volumeCy: 5.2 },
    ]);
    expect(f.computed).toBe(1.5385);
    expect(f.used).toBe(1.539);
  });

  it('refuses fewer than three loads', () => {
    expect(() => conversionFactor(loads.slice(0, 2))).toThrowError(/at least 3 weighed loads/);
  });
});

describe("moisture correction: net x 100 / (100 + M) above the stated moisture (Resident Engineer's Manual 109.12)", () => {
  it('corrects 20.00 t at 8 % moisture with 5 % stated to 18.52 t (2000 / 108 = 18.518..., hand-worked)', () => {
    expect(moistureCorrected(20, 8, 5)).toBe(18.52);
  });
  it('pays the net weight at or below the stated moisture, and when moisture was not measured', () => {
    expect(moistureCorrected(20, 5, 5)).toBe(20);
    expect(moistureCorrected(20, null, 5)).toBe(20);
  });
  it('never raises the weight and falls as moisture rises (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 50_000 }), fc.integer({ min: 0, max: 400 }), (cTons, tenthsM) => {
        const net = cTons / 100;
        const m = tenthsM / 10;
        const dry = moistureCorrected(net, m, 0);
        expect(dry).toBeLessThanOrEqual(net);
        expect(moistureCorrected(net, m + 1, 0)).toBeLessThanOrEqual(dry);
      }),
    );
  });
});

describe("tons to CY in 0.5 CY bands (Resident Engineer's Manual section 109.12)", () => {
  it.each([
    [10.01, 10],
    [10.24, 10],
    [10.25, 10.5],
    [10.49, 10.5],
    [10.51, 10.5],
    [10.74, 10.5],
    [10.76, 11],
    [10.99, 11],
    [10.0, 10],
  ])('bands %s CY to %s CY as the manual lists', (cy, banded) => {
    expect(bandToHalfCy(cy)).toBe(banded);
  });

  it('keeps .50 at .5 and takes .75 up to the whole (the manual leaves both open; our rule: nearest 0.5, tie up)', () => {
    expect(bandToHalfCy(10.5)).toBe(10.5);
    expect(bandToHalfCy(10.75)).toBe(11);
  });

  it('is never more than 0.25 CY from the 0.01 figure and always a multiple of 0.5 (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 10_000_000 }), (h) => {
        const banded = bandToHalfCy(h / 100);
        expect(Math.abs(banded * 100 - h)).toBeLessThanOrEqual(25);
        expect((banded * 2) % 1).toBe(0);
      }),
    );
  });

  it('turns 100 t at 1.473 t/CY into 67.89 CY computed, 68.0 CY paid (hand-worked)', () => {
    expect(tonsToCubicYards(100, 1.473)).toEqual({ computedCy: 67.89, payCy: 68 });
  });

  it('refuses a zero factor', () => {
    expect(() => tonsToCubicYards(100, 0)).toThrow(DomainError);
  });
});
