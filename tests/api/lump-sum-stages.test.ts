import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditEvents, bidItemProfiles } from '../../server/db/schema';
import { makeWorld } from '../setup/factories';
import { makeProfiledItem } from '../setup/provisions-factories';
import { createTestApp, signedInAgent, type TestApp } from '../setup/test-app';

// Invented figures (test data). C-9 clearing and grubbing, 1 LS at $12,000.00, paid by a schedule of stages.
let t: TestApp;
let w: Awaited<ReturnType<typeof makeWorld>>;
let lumpSum: { id: string };
let measured: { id: string };

type Who = keyof typeof w.people;
const as = (who: Who) => signedInAgent(t.app, w.people[who].email);
const put = async (who: Who, itemId: string, body: object) =>
  (await as(who)).put(`/api/bid-items/${itemId}/lump-sum-stages`).send(body);
const settingsOf = async (itemId: string) =>
  (await t.database.db.select().from(bidItemProfiles).where(eq(bidItemProfiles.bidItemId, itemId)))[0]!.settings;

const schedule = [
  { name: 'Clear and grub west of Sta 30+00', percentOfItem: 40, completedOn: '2026-10-12' },
  { name: 'Clear and grub east of Sta 30+00', percentOfItem: 35, completedOn: '2026-11-09' },
  { name: 'Chip and haul off the brush', percentOfItem: 25, completedOn: null },
];

beforeAll(async () => {
  t = await createTestApp();
  w = await makeWorld(t.database.db, t.auth);
  lumpSum = await makeProfiledItem(
    t.database.db,
    w.home.id,
    'lump_sum',
    {
      itemNumber: 'C-9',
      description: 'Clearing and grubbing',
      payUnit: 'LS',
      unitPriceCents: 1_200_000,
      contractQuantity: 1,
    },
    { percentComplete: 10 },
  );
  measured = await makeProfiledItem(t.database.db, w.home.id, 'worksheet', { itemNumber: 'E-1' });
});
afterAll(() => t.close());

describe('the stage schedule of a lump-sum item (PUT /api/bid-items/:id/lump-sum-stages)', () => {
  it('refuses shares that do not add up to 100 %, naming the sum, and saves nothing', async () => {
    const res = await put('general_contractor', lumpSum.id, {
      stages: [schedule[0], { ...schedule[1], percentOfItem: 30 }, schedule[2]],
    });
    expect(res.status).toBe(400);
    expect(res.body.error.details).toContainEqual({
      path: 'stages',
      message: 'The stages add up to 95 %; they must add up to 100 %',
    });
    expect(await settingsOf(lumpSum.id)).toEqual({ percentComplete: 10 });
  });

  it('names the row and field of each bad cell: a blank name, a share above 100, a date not in YYYY-MM-DD', async () => {
    const res = await put('general_contractor', lumpSum.id, {
      stages: [
        { ...schedule[0], name: '  ' },
        { ...schedule[1], percentOfItem: 135 },
        { ...schedule[2], completedOn: '11/30/2026' },
      ],
    });
    expect(res.status).toBe(400);
    const paths = (res.body.error.details as { path: string }[]).map((d) => d.path);
    expect(paths).toEqual(expect.arrayContaining(['stages.0.name', 'stages.1.percentOfItem', 'stages.2.completedOn']));
  });

  it('refuses a stage done on a day still to come, naming the row', async () => {
    const res = await put('general_contractor', lumpSum.id, {
      stages: [schedule[0], schedule[1], { ...schedule[2], completedOn: '2099-01-01' }],
    });
    expect(res.status).toBe(400);
    expect(res.body.error.details[0].path).toBe('stages.2.completedOn');
  });

  it('refuses the subcontractor and the owner (403), an outsider (404), and an item not paid as a lump sum (409)', async () => {
    for (const who of ['subcontractor', 'owner'] as const)
      expect((await put(who, lumpSum.id, { stages: schedule })).status).toBe(403);
    const outsider = await signedInAgent(t.app, w.outsider.email);
    expect((await outsider.put(`/api/bid-items/${lumpSum.id}/lump-sum-stages`).send({ stages: schedule })).status).toBe(
      404,
    );
    const wrong = await put('general_contractor', measured.id, { stages: schedule });
    expect(wrong.status).toBe(409);
    expect(wrong.body.error.code).toBe('PROFILE_MISMATCH');
    expect(await settingsOf(lumpSum.id)).toEqual({ percentComplete: 10 });
  });

  it('saves the schedule for the general contractor in one audited change, replacing the percent complete', async () => {
    const res = await put('general_contractor', lumpSum.id, { stages: schedule });
    expect(res.status).toBe(200);
    // Stages done to date: 40 % + 35 % of $12,000.00 = $9,000.00.
    expect(res.body.profile).toMatchObject({ profile: 'lump_sum', earnedCents: 900_000 });
    expect(await settingsOf(lumpSum.id)).toEqual({ stages: schedule });
    const events = await t.database.db.select().from(auditEvents).where(eq(auditEvents.objectId, lumpSum.id));
    expect(events.map((e) => e.action)).toEqual(['lump_sum_stages.set']);
    expect(events[0]!.before).toEqual({ stages: [], completedStages: [] });
  });

  it('pays a stage on the application whose period holds its day done (October: 40 %; the November 35 % waits)', async () => {
    const sub = await as('subcontractor');
    const october = await sub.post(`/api/projects/${w.home.id}/pay-apps`).send({
      periodStart: '2026-10-01',
      periodEnd: '2026-10-31',
    });
    expect(october.status).toBe(201);
    const line = (app: { lines: { bidItemId: string }[] }) => app.lines.find((l) => l.bidItemId === lumpSum.id)!;
    // 0.40 LS x $12,000.00 = $4,800.00; the east half, done on 2026-11-09, waits for November.
    expect(line(october.body.payApp)).toMatchObject({ thisPeriodQuantity: 0.4, thisPeriodAmountCents: 480_000 });
  });
});
