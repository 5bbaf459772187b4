import { describe, expect, it } from 'vitest';
import { reconcileMethods } from '@/shared/domain/earthwork/method-reconciliation';

// Average end area V = L (A1 + A2) / 2 (FHWA FP Section 109; US Army FM 5-233 ch. 4) and the prismoidal formula
// V = L (A1 + 4 Am + A2) / 6 (surveying texts;
// reference.md section 1); 27 cu ft to the CY; amounts rounded to the cent once, half away from zero (common
// practice for pay estimates). Expected figures by hand.
const stations = [
  { station: 0, cutArea: 100, fillArea: 0 },
  { station: 50, cutArea: 200, fillArea: 0 },
  { station: 100, cutArea: 100, fillArea: 0 },
];

describe('method reconciliation: sections against surfaces', () => {
  it('puts average end area, prismoidal and surface side by side with differences in percent and dollars', () => {
    const rows = reconcileMethods({ unit: 'ft', stations, surfaceVolume: 600, part: 'cut', unitPriceCents: 720 });
    expect(rows.map((r) => r.method)).toEqual(['average-end-area', 'prismoidal', 'surface']);
    const [aea, prism, surface] = rows;
    // AEA: 50 (100 + 200) / 2 + 50 (200 + 100) / 2 = 15,000 cu ft = 555.5556 CY; x $7.20 = $4,000.00.
    expect(aea!.volume).toBeCloseTo(15_000 / 27, 9);
    expect(aea!.amountCents).toBe(400_000);
    expect(aea!.differenceCents).toBe(400_000 - 432_000);
    expect(aea!.differencePercent).toBeCloseTo(((15_000 / 27 - 600) / 600) * 100, 9);
    // Prismoidal: 100 (100 + 800 + 100) / 6 = 16,666.67 cu ft = 617.2840 CY; x $7.20 = $4,444.44.
    expect(prism!.volume).toBeCloseTo(100_000 / 6 / 27, 9);
    expect(prism!.amountCents).toBe(444_444);
    expect(prism!.differenceCents).toBe(12_444);
    expect(surface).toMatchObject({ volume: 600, amountCents: 432_000, differenceCents: 0, differencePercent: 0 });
  });

  it('says why the prismoidal formula cannot be used on an even count of stations, keeping the others', () => {
    const rows = reconcileMethods({
      unit: 'ft',
      stations: stations.slice(0, 2),
      surfaceVolume: 100,
      part: 'fill',
      unitPriceCents: 100,
    });
    expect(rows[0]).toMatchObject({ volume: 0, amountCents: 0, differenceCents: -10_000, differencePercent: -100 });
    expect(rows[1]!.volume).toBeNull();
    expect(rows[1]!.reason).toMatch(/odd count/);
  });
});
