import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { StationInput } from '../../src/shared/domain/earthwork/end-area';
import { massHaul } from '../../src/shared/domain/earthwork/mass-haul';

const st = (station: number, cutArea: number, fillArea = 0): StationInput => ({ station, cutArea, fillArea });

/** 1,500 m3 cut over 0-20 m, carried 620 m centre to centre, placed over 620-640 m. */
const metricExample = [st(0, 0), st(10, 150), st(20, 0), st(620, 0, 0), st(630, 0, 150), st(640, 0, 0)];

describe('massHaul', () => {
  it('gives 9,000 station-m3 for 1,500 m3 hauled 600 m beyond free haul (100 m stations, reference metric example)', () => {
    const r = massHaul({ unit: 'm', stations: metricExample, freeHaul: 20 });
    expect(r.overhaulUnit).toBe('station-m3');
    expect(r.loops).toHaveLength(1);
    const loop = r.loops[0]!;
    expect(loop.direction).toBe('forward');
    expect(loop.volume).toBeCloseTo(1500, 9);
    expect(loop.averageHaulDistance!).toBeCloseTo(620, 9);
    expect(r.overhaul).toBeCloseTo(9000, 6);
    expect(loop.averageOverhaulDistance!).toBeCloseTo(600, 9);
    expect(r.balancePoints).toEqual([]);
    expect(r.ordinates.map((o) => o.ordinate)).toEqual([0, 750, 1500, 1500, 750, 0]);
  });

  it('prices overhaul once to the cent at a price per station unit (the Garber and Hoel problem\'s data is not in the reference, so only the arithmetic is checked)', () => {
    const r = massHaul({ unit: 'm', stations: metricExample, freeHaul: 20, overhaulPriceCents: 1000 });
    expect(r.overhaulAmountCents).toBe(9_000 * 10_00);
  });

  it('finds balance points where the curve crosses the balance line, with a loop each side', () => {
    // Cut then fill then cut then fill: up, down through zero, up again.
    const r = massHaul({ unit: 'ft', stations: [st(0, 27), st(100, 27), st(200, 0, 54), st(300, 0, 0), st(400, 27), st(500, 0)], freeHaul: 100 });
    expect(r.balancePoints.length).toBeGreaterThanOrEqual(1);
    expect(r.loops.some((l) => l.direction === 'backward')).toBe(true);
    expect(r.overhaulUnit).toBe('station-yd');
    expect(r.haul).toBeGreaterThan(0);
  });

  it('turns fill into the bank volume it needs with shrinkage, and leaves the unbalanced end as waste or borrow', () => {
    const r = massHaul({ unit: 'm', stations: [st(0, 10), st(100, 10), st(200, 0, 9), st(300, 0, 9)], freeHaul: 50, factor: { kind: 'shrinkage', percent: 10 } });
    expect(r.fillFactor).toBeCloseTo(0.9, 15);
    expect(r.ordinates[3]!.adjustedFill).toBeCloseTo(900 / 0.9, 9);
    // 1,000 + (500 - 450 / 0.9) - 900 / 0.9 = 0: the 10 % shrinkage balances the job.
    expect(r.ordinates.map((o) => o.ordinate)).toEqual([0, 1000, 1000, 0].map((v) => expect.closeTo(v, 9)));
    expect(r.waste + r.borrow).toBeCloseTo(0, 9);
    const short = massHaul({ unit: 'm', stations: [st(0, 10), st(100, 10), st(200, 0, 9), st(300, 0, 9)], freeHaul: 50 });
    expect(short.waste).toBeCloseTo(1000 + 500 - 450 - 900, 9);
  });

  it('is symmetric under mirroring the profile: same haul and overhaul, directions swapped (property)', () => {
    const profile = fc.array(fc.record({ gap: fc.integer({ min: 5, max: 100 }), cut: fc.nat(200), fill: fc.nat(200) }), { minLength: 2, maxLength: 25 });
    fc.assert(
      fc.property(profile, fc.integer({ min: 0, max: 500 }), (rows, freeHaul) => {
        let s = 0;
        const stations = rows.map((r) => ((s += r.gap), st(s, r.cut, r.fill)));
        const mirrored = stations.map((x) => st(-x.station, x.cutArea, x.fillArea)).reverse();
        // Mirrored, the running sum starts from the other end (M' = end - M), so the balance line moves to the end
        // ordinate and the loops change side.
        const a = massHaul({ unit: 'm', stations, freeHaul });
        const end = a.ordinates.at(-1)!.ordinate;
        const b = massHaul({ unit: 'm', stations: mirrored, freeHaul, balanceLine: end });
        expect(b.haul).toBeCloseTo(a.haul, 4);
        expect(b.overhaul).toBeCloseTo(a.overhaul, 4);
        expect(a.overhaul).toBeGreaterThanOrEqual(0);
        expect(a.overhaul).toBeLessThanOrEqual(a.haul + 1e-9);
      }),
    );
  });
});
