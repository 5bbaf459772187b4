import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CALC_LIMITS } from '../../src/shared/schemas/calc';
import { makeWorld } from '../setup/factories';
import { createTestApp, signedInAgent, type TestApp } from '../setup/test-app';

let t: TestApp;
let agent: Awaited<ReturnType<typeof signedInAgent>>;
beforeAll(async () => {
  t = await createTestApp();
  const w = await makeWorld(t.database.db, t.auth);
  agent = await signedInAgent(t.app, w.people.owner.email);
});
afterAll(() => t.close());

const calc = (method: string, body: unknown) => agent.post(`/api/calc/${method}`).send(body as object);

describe('POST /api/calc/:method answers every method with the documented fields', () => {
  it('section: cut and fill areas by the coordinate method', async () => {
    const res = await calc('section', {
      unit: 'ft',
      ground: [
        [0, 10],
        [20, 10],
      ],
      design: [
        [0, 8],
        [20, 8],
      ],
    });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ cutArea: 40, fillArea: 0, areaUnit: 'sq ft' }); // rectangle 20 ft x 2 ft (geometry)
  });

  it('end-area: the US Navy EO manual example, 50 and 70 sq ft 100 ft apart = 222.22 CY', async () => {
    const stations = [
      { station: 0, cutArea: 50, fillArea: 0 },
      { station: 100, cutArea: 70, fillArea: 0 },
    ];
    const res = await calc('end-area', { unit: 'ft', stations });
    expect(res.status).toBe(200);
    expect(res.body.cut).toBeCloseTo(222.22, 2); // NAVEDTRA 14081: (50 + 70) / 2 x 100 / 27
    expect(res.body).toMatchObject({ fill: 0, volumeUnit: 'CY', segments: [{ from: 0, to: 100, length: 100 }] });
    expect(res.body.spacing).toBeDefined();
  });

  it('grid: the 3 x 3 node, 50 ft example = 740.74 CY', async () => {
    const depths = [
      [1, 1.5, 2],
      [1.5, 2, 2.5],
      [2, 2.5, 3],
    ];
    const res = await calc('grid', { unit: 'ft', spacingX: 50, spacingY: 50, depths });
    expect(res.body.cut).toBeCloseTo(740.74, 2); // reference.md section 1, grid worked example (geometry check)
    expect(res.body).toMatchObject({ fill: 0, volumeUnit: 'CY' });
  });

  it('pit, trench, convert, load-count, spoil, variance and pay-app', async () => {
    const pit = await calc('pit', { unit: 'ft', length: 20, width: 10, cornerDepths: [4, 5, 6, 5] });
    expect(pit.body).toMatchObject({ area: 200, averageDepth: 5, volumeUnit: 'CY' });
    // OSHA 29 CFR 1926 Subpart P App. B Table B-1: Type B 1:1, 10 ft deep, 4 ft bottom -> 24 ft top width
    const trench = await calc('trench', {
      unit: 'ft',
      protection: 'slope',
      soilClass: 'B',
      runs: [{ length: 100, depth: 10, bottomWidth: 4 }],
    });
    expect(trench.body.runs[0].topWidth).toBe(24);
    expect(trench.body.cautions.length).toBeGreaterThan(0);
    const convert = await calc('convert', {
      volume: 100,
      from: 'bank',
      to: 'loose',
      swellPercent: 25,
      shrinkagePercent: 10,
    });
    expect(convert.body.volume).toBe(125); // loose = bank x (1 + swell), Nichols and Day p. 2.51
    const loads = await calc('load-count', { swellPercent: 25, loads: [{ capacity: 14, count: 10 }] });
    expect(loads.body).toMatchObject({ looseVolume: 140, bankVolume: 112, payQuantity: 112 });
    const spoil = await calc('spoil', {
      unit: 'ft',
      shape: 'pile',
      bankVolume: 100,
      swellPercent: 25,
      angleOfReposeDeg: 37,
    });
    expect(spoil.body).toMatchObject({ looseVolume: 125 });
    expect(spoil.body.diameter).toBeGreaterThan(0);
    // FAR 52.211-18: 10,000 estimated, 12,000 actual -> 500 above the 115 % band
    const variance = await calc('variance', {
      contractQuantity: 10000,
      forecastQuantity: 12000,
      unitPriceCents: 100,
      band: { overPercent: 15, underPercent: 15 },
    });
    expect(variance.body).toMatchObject({ status: 'over', quantityBeyondBand: 500, amountBeyondBandCents: 50000 });
    const payApp = await calc('pay-app', {
      retainagePercent: 10,
      previousCertifiedCents: 0,
      lines: [{ unitPriceCents: 685, contractQuantity: 1000, previousQuantity: 0, thisPeriodQuantity: 100 }],
    });
    expect(payApp.body).toMatchObject({ earnedToDateCents: 68500, retainageCents: 6850, currentDueCents: 61650 });
  });

  it('mass-haul and surface answer with volumes', async () => {
    const stations = [0, 100, 200, 300].map((station, i) => ({
      station,
      cutArea: [40, 20, 0, 0][i]!,
      fillArea: [0, 0, 20, 40][i]!,
    }));
    const haul = await calc('mass-haul', { unit: 'ft', stations, freeHaul: 100 });
    expect(haul.status).toBe(200);
    const grid = (z: number) => [
      [0, 0, z],
      [10, 0, z],
      [0, 10, z],
      [10, 10, z],
    ];
    const surface = await calc('surface', { unit: 'ft', existing: grid(2), design: grid(1) });
    expect(surface.status).toBe(200);
    expect(surface.body.cut).toBeCloseTo(100 / 27, 6); // a 10 x 10 ft slab 1 ft thick (geometry)
  });
});

describe('POST /api/calc/:method refuses bad input with field paths', () => {
  it.each([
    [
      'end-area',
      {
        unit: 'ft',
        stations: [
          { station: 100, cutArea: 1, fillArea: 0 },
          { station: 50, cutArea: 1, fillArea: 0 },
        ],
      },
      'stations.1.station',
    ],
    [
      'grid',
      {
        unit: 'ft',
        spacingX: 50,
        spacingY: 50,
        depths: [
          [1, 2, 3],
          [1, 2],
        ],
      },
      'depths.1',
    ],
    ['pit', { unit: 'ft', length: -20, width: 10, cornerDepths: [1, 1, 1, 1] }, 'length'],
    ['pit', { unit: 'ft', length: 20, width: 10, cornerDepths: [1, 1, 1] }, 'cornerDepths'],
    ['trench', { unit: 'ft', protection: 'slope', runs: [{ length: 10, depth: 6, bottomWidth: 3 }] }, 'soilClass'],
    [
      'section',
      {
        unit: 'ft',
        ground: [
          [0, 'NaN'],
          [10, 1],
        ],
        design: [
          [0, 0],
          [10, 0],
        ],
      },
      'ground.0.1',
    ],
  ])('%s -> 400 naming %s', async (method, body, path) => {
    const res = await calc(method, body);
    expect(res.status).toBe(400);
    expect(res.body.error.details.map((d: { path: string }) => d.path)).toContain(path);
  });

  it('refuses arrays beyond the stated limit', async () => {
    const stations = Array.from({ length: CALC_LIMITS.stations + 1 }, (_, i) => ({
      station: i,
      cutArea: 1,
      fillArea: 0,
    }));
    const res = await calc('end-area', { unit: 'ft', stations });
    expect(res.status).toBe(400);
    expect(res.body.error.details[0].path).toBe('stations');
  });

  it('answers 400 naming the field when an amount passes the schema but is beyond a safe integer of cents (was a 500)', async () => {
    const line = {
      unitPriceCents: Number.MAX_SAFE_INTEGER,
      contractQuantity: 1e9,
      previousQuantity: 0,
      thisPeriodQuantity: 1,
    };
    const res = await calc('pay-app', { retainagePercent: 10, previousCertifiedCents: 0, lines: [line] });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('INVALID_NUMBER');
    expect(res.body.error.details[0].path).toBe('lines.0.contractQuantity');
  });

  it('returns 404 UNKNOWN_CALC_METHOD for an unknown method and 401 without a session', async () => {
    const res = await calc('volume-magic', {});
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('UNKNOWN_CALC_METHOD');
    expect((await request(t.app).post('/api/calc/grid').send({})).status).toBe(401);
  });
});
