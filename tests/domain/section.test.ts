import fc from 'fast-check';
import polygonClipping, { type Polygon } from 'polygon-clipping';
import { describe, expect, it } from 'vitest';
import { DomainError } from '../../src/shared/domain/domain-error';
import { polygonArea, type Point2 } from '../../src/shared/domain/earthwork/polygon';
import { sectionAreas } from '../../src/shared/domain/earthwork/section';

describe('coordinate (shoelace) area', () => {
  it('gives 140,493.1 sq ft for the Mahun COGO traverse (Open Access COGO text, ch. H: published 140,494)', () => {
    // Points (N, E): C, D, E, A, B. The text rounds to 140,494; full precision is 140,493.1.
    const ne: Point2[] = [[406.31, 1259.97], [235.12, 1489.47], [65.81, 1126.4], [317.89, 942.04], [675.32, 1282.54]];
    const area = polygonArea(ne.map(([n, e]) => [e, n]));
    expect(area).toBeCloseTo(140_493.1, 1);
    expect(Math.abs(area - 140_494)).toBeLessThan(1);
  });
});

describe('sectionAreas', () => {
  it('gives width x depth for a rectangle section (exact identity)', () => {
    const r = sectionAreas({ unit: 'ft', ground: [[-20, 100], [20, 100]], design: [[-10, 94], [10, 94]] });
    expect(r.cutArea).toBe(20 * 6);
    expect(r.fillArea).toBe(0);
    expect(r.areaUnit).toBe('sq ft');
    expect(r.overlap).toEqual({ from: -10, to: 10 });
  });

  it('splits cut and fill at the exact crossing point of the two lines', () => {
    // Ground rises from 0 to 10 over 0..10 ft; design flat at 5: crossing at 5, two triangles of 12.5 sq ft.
    const r = sectionAreas({ unit: 'ft', ground: [[0, 0], [10, 10]], design: [[0, 5], [10, 5]] });
    expect(r.crossings).toEqual([5]);
    expect(r.cutArea).toBeCloseTo(12.5, 12);
    expect(r.fillArea).toBeCloseTo(12.5, 12);
    expect(r.regions.map((x) => x.kind)).toEqual(['fill', 'cut']);
    expect(r.trail.join('\n')).toContain('Mahun');
  });

  it('throws OFFSETS_NOT_INCREASING with the point path when offsets go back', () => {
    const bad = () => sectionAreas({ unit: 'm', ground: [[0, 1], [2, 1], [1, 1]], design: [[0, 0], [2, 0]] });
    expect(bad).toThrow(DomainError);
    try {
      bad();
    } catch (e) {
      expect((e as DomainError).code).toBe('OFFSETS_NOT_INCREASING');
      expect((e as DomainError).path).toBe('ground.2.0');
    }
  });

  it('throws NO_OVERLAP when the lines share no offsets', () => {
    expect(() => sectionAreas({ unit: 'ft', ground: [[0, 1], [1, 1]], design: [[2, 0], [3, 0]] })).toThrow(/share no offsets/);
  });
});

/**
 * Random polyline over [lo, hi] with strictly increasing offsets. Elevations are read to 0.01 (survey precision,
 * common practice): the outside check, polygon-clipping, cannot close rings whose edges differ by 1e-5 or less.
 */
function line(lo: number, hi: number) {
  return fc
    .array(fc.record({ gap: fc.double({ min: 0.5, max: 5, noNaN: true }), z: fc.integer({ min: -1000, max: 1000 }).map((c) => c / 100) }), { minLength: 1, maxLength: 12 })
    .map((steps) => {
      const total = steps.reduce((s, p) => s + p.gap, 0);
      let x = lo;
      const pts: Point2[] = [[lo, steps[0]!.z]];
      for (const p of steps) {
        x += (p.gap / total) * (hi - lo);
        pts.push([Math.min(x, hi), p.z]);
      }
      pts[pts.length - 1] = [hi, pts[pts.length - 1]![1]];
      return pts.filter((p, i) => i === 0 || p[0] > pts[i - 1]![0]);
    })
    .filter((pts) => pts.length >= 2);
}

/** The region under a line down to a floor, as a polygon-clipping ring. */
function under(pts: Point2[], floor: number): Polygon {
  return [[...pts.map((p): [number, number] => [p[0], p[1]]), [pts[pts.length - 1]![0], floor], [pts[0]![0], floor], [pts[0]![0], pts[0]![1]]]];
}

function multiArea(mp: ReturnType<typeof polygonClipping.difference>): number {
  return mp.reduce((sum, poly) => sum + poly.reduce((s, ring, k) => s + (k === 0 ? 1 : -1) * polygonArea(ring as Point2[]), 0), 0);
}

describe('sectionAreas properties', () => {
  it('agrees with polygon-clipping on random sections (outside check: ground minus design is cut)', () => {
    fc.assert(
      fc.property(line(0, 40), line(0, 40), (ground, design) => {
        const r = sectionAreas({ unit: 'ft', ground, design });
        const g = under(ground, -100);
        const d = under(design, -100);
        const cut = multiArea(polygonClipping.difference(g, d));
        const fill = multiArea(polygonClipping.difference(d, g));
        expect(r.cutArea).toBeCloseTo(cut, 6);
        expect(r.fillArea).toBeCloseTo(fill, 6);
      }),
      { numRuns: 200 },
    );
  });

  it('is symmetric under mirroring the section about its centre line, and never negative', () => {
    fc.assert(
      fc.property(line(-20, 20), line(-20, 20), (ground, design) => {
        const mirror = (pts: Point2[]) => pts.map(([x, z]): Point2 => [-x, z]).reverse();
        const a = sectionAreas({ unit: 'm', ground, design });
        const b = sectionAreas({ unit: 'm', ground: mirror(ground), design: mirror(design) });
        expect(a.cutArea).toBeGreaterThanOrEqual(0);
        expect(a.fillArea).toBeGreaterThanOrEqual(0);
        expect(b.cutArea).toBeCloseTo(a.cutArea, 9);
        expect(b.fillArea).toBeCloseTo(a.fillArea, 9);
      }),
    );
  });

  it('scales by 0.3048^2 between a section in feet and the same one in metres (exact conversion)', () => {
    fc.assert(
      fc.property(line(0, 30), line(0, 30), (ground, design) => {
        const toM = (pts: Point2[]) => pts.map(([x, z]): Point2 => [x * 0.3048, z * 0.3048]);
        const ft = sectionAreas({ unit: 'ft', ground, design });
        const m = sectionAreas({ unit: 'm', ground: toM(ground), design: toM(design) });
        expect(m.cutArea).toBeCloseTo(ft.cutArea * 0.3048 ** 2, 8);
        expect(m.fillArea).toBeCloseTo(ft.fillArea * 0.3048 ** 2, 8);
      }),
    );
  });
});
