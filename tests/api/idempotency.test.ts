import { and, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditEvents, bidItems } from '../../server/db/schema';
import { makeWorld, sampleBidItem } from '../setup/factories';
import { createTestApp, signedInAgent, type TestApp } from '../setup/test-app';

// IETF httpapi draft "The Idempotency-Key HTTP Header Field", sections 2 and 2.6: a write repeated with the same
// key (a double click, a retry after a lost answer) is done once and the repeat gets the first answer; the same key
// with another request is 422; a key still in use is waited for.
let t: TestApp;
let w: Awaited<ReturnType<typeof makeWorld>>;
beforeAll(async () => {
  t = await createTestApp();
  w = await makeWorld(t.database.db, t.auth);
});
afterAll(() => t.close());

const as = (who: keyof typeof w.people) => signedInAgent(t.app, w.people[who].email);
const itemsNumbered = async (itemNumber: string) =>
  t.database.db
    .select()
    .from(bidItems)
    .where(and(eq(bidItems.projectId, w.home.id), eq(bidItems.itemNumber, itemNumber)));

describe('a write sent twice with the same Idempotency-Key', () => {
  it('is done once when both arrive together (a double click), and both get the same answer', async () => {
    const gc = await as('general_contractor');
    const body = sampleBidItem({ itemNumber: 'IDEM-1' });
    const send = () =>
      gc.post(`/api/projects/${w.home.id}/bid-items`).set('Idempotency-Key', 'double-click-0001').send(body);
    const [a, b] = await Promise.all([send(), send()]);
    expect([a.status, b.status]).toEqual([201, 201]);
    expect(a.body).toEqual(b.body);
    expect([a.headers['idempotent-replayed'], b.headers['idempotent-replayed']].filter(Boolean)).toEqual(['true']);
    expect(await itemsNumbered('IDEM-1')).toHaveLength(1);
    const events = await t.database.db.select().from(auditEvents).where(eq(auditEvents.objectId, a.body.bidItem.id));
    expect(events).toHaveLength(1);
  });

  it('is answered again, not redone, when sent later (a retry after a lost answer)', async () => {
    const gc = await as('general_contractor');
    const body = sampleBidItem({ itemNumber: 'IDEM-2' });
    const first = await gc
      .post(`/api/projects/${w.home.id}/bid-items`)
      .set('Idempotency-Key', 'lost-answer-0002')
      .send(body);
    const again = await gc
      .post(`/api/projects/${w.home.id}/bid-items`)
      .set('Idempotency-Key', 'lost-answer-0002')
      .send(body);
    expect(again.status).toBe(201);
    expect(again.body).toEqual(first.body);
    expect(again.headers['idempotent-replayed']).toBe('true');
    expect(await itemsNumbered('IDEM-2')).toHaveLength(1);
  });

  it('refuses the same key with another body (422), and an unreadable key (400), naming the header', async () => {
    const gc = await as('general_contractor');
    const url = `/api/projects/${w.home.id}/bid-items`;
    expect(
      (
        await gc
          .post(url)
          .set('Idempotency-Key', 'reused-key-0003')
          .send(sampleBidItem({ itemNumber: 'IDEM-3' }))
      ).status,
    ).toBe(201);
    const reused = await gc
      .post(url)
      .set('Idempotency-Key', 'reused-key-0003')
      .send(sampleBidItem({ itemNumber: 'IDEM-4' }));
    expect(reused.status).toBe(422);
    expect(reused.body.error).toMatchObject({ code: 'IDEMPOTENCY_KEY_REUSED', details: [{ path: 'Idempotency-Key' }] });
    expect(await itemsNumbered('IDEM-4')).toHaveLength(0);
    for (const key of ['short', 'has spaces in it', 'x'.repeat(129)]) {
      const bad = await gc
        .post(url)
        .set('Idempotency-Key', key)
        .send(sampleBidItem({ itemNumber: 'IDEM-5' }));
      expect(bad.status).toBe(400);
      expect(bad.body.error).toMatchObject({ code: 'IDEMPOTENCY_KEY_INVALID', details: [{ path: 'Idempotency-Key' }] });
    }
    expect(await itemsNumbered('IDEM-5')).toHaveLength(0);
  });

  it('keeps no refused answer: the same request is judged afresh when sent again', async () => {
    const gc = await as('general_contractor');
    const url = `/api/projects/${w.home.id}/bid-items`;
    const body = sampleBidItem({ itemNumber: '' });
    const first = await gc.post(url).set('Idempotency-Key', 'refused-0006').send(body);
    const again = await gc.post(url).set('Idempotency-Key', 'refused-0006').send(body);
    expect([first.status, again.status]).toEqual([400, 400]);
    expect(again.headers['idempotent-replayed']).toBeUndefined();
  });

  it("is one person's key: another person's answer is never replayed to them", async () => {
    const gc = await as('general_contractor');
    const sub = await as('subcontractor');
    const url = `/api/projects/${w.home.id}/bid-items`;
    const body = sampleBidItem({ itemNumber: 'IDEM-7' });
    expect((await gc.post(url).set('Idempotency-Key', 'shared-key-0007').send(body)).status).toBe(201);
    const other = await sub.post(url).set('Idempotency-Key', 'shared-key-0007').send(body);
    expect(other.status).toBe(403);
    expect(other.headers['idempotent-replayed']).toBeUndefined();
  });
});
