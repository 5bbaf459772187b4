import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { computeCalc } from '../../src/features/worksheets/lib/live-calc';
import { previewBill } from '../../src/features/worksheets/lib/bill-preview';
import { sampleSurfaces, workSurfaces } from '../../src/features/worksheets/surface/surface-work';
import type { WorksheetMethod } from '../../src/features/worksheets/lib/types';
import type { CalcMethod, MeasurementBasis, PayUnit } from '../../src/shared/constants';
import { makeBidItem, makeWorld } from '../setup/factories';
import { createTestApp, signedInAgent, type TestApp } from '../setup/test-app';

/**
 * The worksheet's "bills N" line (client: engine + previewBill) and the saved tally (server: runWorksheet +
 * computeTally) are the same number, one case per billable method. Inputs: the worked examples of reference.md
 * where one exists, invented otherwise.
 */
let t: TestApp;
let w: Awaited<ReturnType<typeof makeWorld>>;
beforeAll(async () => {
  t = await createTestApp();
  w = await makeWorld(t.database.db, t.auth);
});
afterAll(() => t.close());

const surfaces = sampleSurfaces('ft');
const surfaceInputs = workSurfaces('ft', surfaces.existing, surfaces.design).inputs!;

type Case = {
  method: WorksheetMethod;
  payUnit: PayUnit;
  basis: MeasurementBasis;
  inputs: Record<string, unknown>;
  options?: { component?: 'cut' | 'fill'; density?: number };
};
const CASES: Case[] = [
  // US Navy EO manual example (NAVEDTRA 14081): 222.22 bank CY, billed loose with the project swell.
  {
    method: 'end-area',
    payUnit: 'CY',
    basis: 'loose',
    inputs: {
      unit: 'ft',
      stations: [
        { station: 1000, cutArea: 50, fillArea: 0 },
        { station: 1100, cutArea: 70, fillArea: 0 },
      ],
    },
  },
  // reference.md section 1 grid example, 740.74 CY, billed in m3.
  {
    method: 'grid',
    payUnit: 'm3',
    basis: 'bank',
    inputs: {
      unit: 'ft',
      spacingX: 50,
      spacingY: 50,
      depths: [
        [1, 1.5, 2],
        [1.5, 2, 2.5],
        [2, 2.5, 3],
      ],
    },
  },
  {
    method: 'pit',
    payUnit: 'CY',
    basis: 'compacted',
    inputs: { unit: 'ft', length: 40, width: 30, cornerDepths: [5, 5, 5, 5], sideSlope: 1 },
  },
  {
    method: 'trench',
    payUnit: 'LF',
    basis: 'bank',
    inputs: { unit: 'ft', protection: 'box', runs: [{ length: 100, depth: 6, bottomWidth: 11 }] },
  },
  // Truck tickets: 1,020 loose CY at 25 % swell; bank 816.0 (the worksheet and the tally must agree).
  {
    method: 'load-count',
    payUnit: 'CY',
    basis: 'bank',
    inputs: {
      swellPercent: 25,
      unit: 'ft',
      loads: [
        { capacity: 15, count: 40 },
        { capacity: 14, count: 30 },
      ],
    },
  },
  {
    method: 'load-count',
    payUnit: 'TON',
    basis: 'bank',
    inputs: { swellPercent: 25, unit: 'ft', loads: [{ capacity: 12, count: 10 }] },
    options: { density: 1.7 },
  },
  { method: 'surface', payUnit: 'CY', basis: 'compacted', inputs: surfaceInputs, options: { component: 'fill' } },
];

describe('server and client bill the same quantity, one case per method', () => {
  it.each(CASES)('$method to a $payUnit $basis item', async ({ method, payUnit, basis, inputs, options = {} }) => {
    const item = await makeBidItem(t.database.db, w.home.id, { payUnit, basis, method });
    const engine = computeCalc(method as CalcMethod, inputs);
    expect(engine.issues).toEqual([]);
    const client = previewBill(
      method,
      inputs,
      engine.result as unknown as Record<string, unknown>,
      item,
      w.home,
      options,
    );
    expect(client.problem).toBeNull();
    const agent = await signedInAgent(t.app, w.people.subcontractor.email);
    const res = await agent
      .post(`/api/projects/${w.home.id}/tallies`)
      .send({ bidItemId: item.id, measuredOn: '2026-10-20', method, inputs, ...options });
    expect(res.status).toBe(201);
    expect(res.body.tally.quantity).toBe(client.bill!.quantity);
    expect(res.body.tally.result.trail).toEqual(client.bill!.trail);
    if (method === 'load-count' && payUnit === 'CY') expect(res.body.tally.quantity).toBe(816);
  });

  it('bills a direct quantity as typed for an item paid by count', async () => {
    const item = await makeBidItem(t.database.db, w.home.id, { payUnit: 'EA', basis: 'bank', method: 'manual' });
    const agent = await signedInAgent(t.app, w.people.subcontractor.email);
    const res = await agent
      .post(`/api/projects/${w.home.id}/tallies`)
      .send({
        bidItemId: item.id,
        measuredOn: '2026-10-20',
        method: 'manual',
        quantity: 3,
        manualBasis: 'Three inlets set, see the inspector diary',
      });
    expect(res.status).toBe(201);
    expect(res.body.tally.quantity).toBe(3);
  });
});
