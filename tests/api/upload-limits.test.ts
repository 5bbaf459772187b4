import { mkdtempSync, readdirSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { tallyEvidence } from '../../server/db/schema';
import { makeBidItem, makeWorld } from '../setup/factories';
import { makeTally } from '../setup/pay-cycle-factories';
import { createTestApp, signedInAgent, type TestApp } from '../setup/test-app';

// Tiny limits so the tests send little: 3,000 bytes a project, 2,000 bytes a request.
const tempDir = mkdtempSync(path.join(os.tmpdir(), 'tallyard-upload-test-'));
let t: TestApp;
let w: Awaited<ReturnType<typeof makeWorld>>;
let itemId: string;
beforeAll(async () => {
  t = await createTestApp({ uploads: { projectQuotaBytes: 3_000, requestMaxBytes: 2_000, tempDir } });
  w = await makeWorld(t.database.db, t.auth);
  itemId = (await makeBidItem(t.database.db, w.home.id, { itemNumber: 'U-1', contractQuantity: 1_000_000 })).id;
});
afterAll(() => t.close());

const draft = async () =>
  (
    await makeTally(t.database.db, {
      projectId: w.home.id,
      bidItemId: itemId,
      authorUserId: w.people.subcontractor.id,
      measuredOn: '2026-10-05',
      quantity: 1,
      status: 'draft',
    })
  ).id;
const pdf = (n: number) => Buffer.concat([Buffer.from('%PDF-1.4\n'), Buffer.alloc(n - 9, 0x20)]);
const rows = async (tallyId: string) =>
  (await t.database.db.select().from(tallyEvidence).where(eq(tallyEvidence.tallyId, tallyId))).length;
/**
 * Temp files are removed when the response closes, a moment after supertest has the answer: on a busy machine that
 * moment can pass 50 ms, so the folder is read again until it is empty (for up to a second).
 */
const noTempFiles = () => expect.poll(() => readdirSync(tempDir)).toEqual([]);

describe('uploads stream to storage within a request total and a project quota', () => {
  it('stores a file streamed through a temp file, with its SHA-256, and leaves no temp file', async () => {
    const agent = await signedInAgent(t.app, w.people.subcontractor.email);
    const id = await draft();
    const bytes = pdf(1_000);
    const res = await agent
      .post(`/api/tallies/${id}/evidence`)
      .attach('files', bytes, { filename: 'a.pdf', contentType: 'application/pdf' });
    expect(res.status).toBe(201);
    // SHA-256 of the bytes by node:crypto, the reference implementation of FIPS 180-4 here.
    const { createHash } = await import('node:crypto');
    expect(res.body.evidence[0].sha256).toBe(createHash('sha256').update(bytes).digest('hex'));
    expect(res.body.evidence[0].sizeBytes).toBe(1_000);
    expect(Buffer.compare((await agent.get(res.body.evidence[0].downloadUrl)).body as Buffer, bytes)).toBe(0);
    await noTempFiles();
  });

  it('refuses a request over its total with 413 naming the limit; nothing saved, no temp file left', async () => {
    const agent = await signedInAgent(t.app, w.people.subcontractor.email);
    const id = await draft();
    const res = await agent
      .post(`/api/tallies/${id}/evidence`)
      .attach('files', pdf(1_200), { filename: 'a.pdf', contentType: 'application/pdf' })
      .attach('files', pdf(1_200), { filename: 'b.pdf', contentType: 'application/pdf' });
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('UPLOAD_TOO_LARGE');
    expect(res.body.error.message).toContain('2 kB');
    expect(await rows(id)).toBe(0);
    await noTempFiles();
  });

  it('refuses files past the project quota with 413 PROJECT_QUOTA_EXCEEDED naming used and allowed; nothing saved', async () => {
    const agent = await signedInAgent(t.app, w.people.subcontractor.email);
    const id = await draft();
    // 1,000 bytes are stored by the first test; 1,500 more fit (2,500 of 3,000), the next 1,500 do not.
    const ok = await agent
      .post(`/api/tallies/${id}/evidence`)
      .attach('files', pdf(1_500), { filename: 'c.pdf', contentType: 'application/pdf' });
    expect(ok.status).toBe(201);
    const before = await rows(id);
    const res = await agent
      .post(`/api/tallies/${id}/evidence`)
      .attach('files', pdf(1_500), { filename: 'd.pdf', contentType: 'application/pdf' });
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('PROJECT_QUOTA_EXCEEDED');
    expect(res.body.error.message).toContain('2.5 kB');
    expect(res.body.error.message).toContain('3 kB');
    expect(await rows(id)).toBe(before);
    await noTempFiles();
  });

  it('counts only the project asked for: another project is not charged', async () => {
    const [used] = await t.database.db.select().from(tallyEvidence);
    expect(used).toBeDefined();
    const agent = await signedInAgent(t.app, w.people.subcontractor.email);
    expect(
      (
        await agent
          .post(`/api/tallies/00000000-0000-4000-8000-000000000000/evidence`)
          .attach('files', pdf(100), { filename: 'e.pdf', contentType: 'application/pdf' })
      ).status,
    ).toBe(404);
    await noTempFiles();
  });

  it('cleans the temp file of a refused CSV import too', async () => {
    const agent = await signedInAgent(t.app, w.people.general_contractor.email);
    const res = await agent
      .post(`/api/projects/${w.home.id}/bid-items/import`)
      .attach('file', Buffer.from([0xff, 0xfe, 0x41, 0x00]), { filename: 'items.csv', contentType: 'text/csv' });
    expect(res.status).toBe(400);
    await noTempFiles();
  });
});
