import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, signedInAgent, type TestApp } from '../setup/test-app';
import { makeBidItem, makeWorld } from '../setup/factories';
import { makeTally } from '../setup/pay-cycle-factories';

// RFC 9110 sections 8.8.3 (ETag) and 13.1.2 (If-None-Match): an unchanged pay application answers 304 with no body;
// any change to what the application shows gives a new tag.
let t: TestApp;
let w: Awaited<ReturnType<typeof makeWorld>>;
beforeAll(async () => {
  t = await createTestApp();
  w = await makeWorld(t.database.db, t.auth);
});
afterAll(() => t.close());

describe('GET /api/pay-apps/:payAppId with ETag and If-None-Match', () => {
  it('answers 304 while the application is unchanged, and 200 with a new tag once it changes', async () => {
    const item = await makeBidItem(t.database.db, w.home.id);
    await makeTally(t.database.db, { projectId: w.home.id, bidItemId: item.id, authorUserId: w.people.subcontractor.id, measuredOn: '2026-10-05', quantity: 10, status: 'ready' });
    const sub = await signedInAgent(t.app, w.people.subcontractor.email);
    const made = await sub.post(`/api/projects/${w.home.id}/pay-apps`).send({ periodStart: '2026-10-01', periodEnd: '2026-10-31', isFinal: false });
    expect(made.status).toBe(201);
    const id = made.body.payApp.id;
    const first = await sub.get(`/api/pay-apps/${id}`);
    expect(first.status).toBe(200);
    const tag = first.headers.etag as string;
    expect(tag).toBeTruthy();
    expect(first.headers['cache-control']).toBe('private, no-cache');
    const again = await sub.get(`/api/pay-apps/${id}`).set('If-None-Match', tag);
    expect(again.status).toBe(304);
    expect(again.text).toBe('');
    const submitted = await sub.post(`/api/pay-apps/${id}/submit`).send({});
    expect(submitted.status).toBe(200);
    const changed = await sub.get(`/api/pay-apps/${id}`).set('If-None-Match', tag);
    expect(changed.status).toBe(200);
    expect(changed.headers.etag).not.toBe(tag);
    expect(changed.body.payApp.status).not.toBe(first.body.payApp.status);
  });
});
