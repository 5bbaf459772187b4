import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { payApps } from '../../server/db/schema';
import { makeWorld } from '../setup/factories';
import { makeCertifiedPayApp } from '../setup/payment-factories';
import { createTestApp, signedInAgent, type TestApp } from '../setup/test-app';

let t: TestApp;
let w: Awaited<ReturnType<typeof makeWorld>>;
beforeAll(async () => {
  t = await createTestApp();
  w = await makeWorld(t.database.db, t.auth);
});
afterAll(() => t.close());

describe('GET /api/projects/:projectId money figures', () => {
  it('shows earned and retainage held from the latest certified application and paid to date, ignoring uncertified ones', async () => {
    const db = t.database.db;
    const first = await makeCertifiedPayApp(db, w.home.id, w.people.subcontractor.id, { number: 1, status: 'paid' });
    await db.update(payApps).set({ paidCents: first.currentDueCents }).where(eq(payApps.id, first.id));
    const second = await makeCertifiedPayApp(db, w.home.id, w.people.subcontractor.id, { number: 2, lines: [{ quantity: 10, unitPriceCents: 1000 }] });
    await makeCertifiedPayApp(db, w.home.id, w.people.subcontractor.id, { number: 3, status: 'submitted', lines: [{ quantity: 99, unitPriceCents: 99 }] });
    const res = await (await signedInAgent(t.app, w.people.owner.email)).get(`/api/projects/${w.home.id}`);
    expect(res.status).toBe(200);
    expect(res.body.project.money).toEqual({
      earnedToDateCents: second.earnedToDateCents,
      retainageHeldCents: second.retainageCents,
      paidToDateCents: first.currentDueCents,
    });
  });
});
