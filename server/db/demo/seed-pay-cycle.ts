import { DEFAULT_FEE_RATES } from '../../../src/shared/domain/payment-fees';
import { eq, inArray } from 'drizzle-orm';
import type { AppContext } from '../../app-context';
import { readCache } from '../../lib/read-cache';
import type { Storage } from '../../integrations/storage/storage';
import type { Actor } from '../../lib/actor';
import { createLogger } from '../../lib/logger';
import { approveChangeOrder } from '../../modules/change-orders/change-order-decisions.service';
import { proposeChangeOrder } from '../../modules/change-orders/change-orders.service';
import { certifyPayApp, reviewPayApp, submitPayApp } from '../../modules/pay-apps/pay-app-actions.service';
import { createPayApp } from '../../modules/pay-apps/pay-apps.service';
import { addEvidence } from '../../modules/tallies/evidence.service';
import { createTally, markReady } from '../../modules/tallies/tallies.service';
import { draftVarianceChangeOrder, setForecast } from '../../modules/variance/forecasts.service';
import { roundTo } from '../../../src/shared/domain/rounding';
import type { Db } from '../client';
import { bidItems, companies, companyMembers, emailOutbox, payApps, user } from '../schema';
import { DemoClock, scenarioTime } from './demo-clock';
import { markPaid } from './demo-payment';
import {
  DEMO_CHANGE_ORDER,
  DEMO_DISPUTE,
  DEMO_FORECASTS,
  DEMO_PAY_CYCLE,
  demoChangeOrder,
  type DemoPeriod,
} from './pay-cycle-data';

export async function actorOf(db: Db, email: string): Promise<Actor> {
  const [row] = await db
    .select({
      id: user.id,
      name: user.name,
      email: user.email,
      companyId: companies.id,
      kind: companies.kind,
      companyName: companies.name,
      isAdmin: companyMembers.isAdmin,
    })
    .from(user)
    .innerJoin(companyMembers, eq(companyMembers.userId, user.id))
    .innerJoin(companies, eq(companies.id, companyMembers.companyId))
    .where(eq(user.email, email));
  if (!row) throw new Error(`demo person ${email} is missing`);
  return {
    userId: row.id,
    name: row.name,
    email: row.email,
    companyId: row.companyId,
    companyKind: row.kind,
    companyName: row.companyName,
    isAdmin: row.isAdmin,
  };
}

/** The period's tallies through the tally service (the engine computes each worksheet), evidence, ready. */
async function tallyPeriod(
  db: Db,
  storage: Storage,
  sub: Actor,
  projectId: string,
  period: DemoPeriod,
  itemIds: Map<string, string>,
) {
  for (const t of period.tallies) {
    const { evidence, itemNumber, ...fields } = t;
    const tally = await createTally(db, sub, projectId, {
      ...fields,
      bidItemId: itemIds.get(itemNumber)!,
    } as Parameters<typeof createTally>[3]);
    if (evidence) {
      await addEvidence(db, storage, sub, tally.id, [
        { fileName: evidence.fileName, contentType: 'text/csv', kind: 'csv', bytes: Buffer.from(evidence.csv, 'utf8') },
      ]);
    }
    await markReady(db, sub, tally.id);
  }
}

/**
 * Three pay periods of the demo through the real services: one certified and paid, one certified awaiting the
 * owner's payment, one submitted and reviewed with one disputed line; then forecasts with one item beyond its
 * band and its drafted change order. Runs once: skipped when the demo project already has a pay application.
 */
export async function seedPayCycle(db: Db, storage: Storage, projectId: string): Promise<boolean> {
  const [existing] = await db.select({ id: payApps.id }).from(payApps).where(eq(payApps.projectId, projectId)).limit(1);
  if (existing) return false;
  const [sub, gc] = await Promise.all([actorOf(db, 'sub@tallyard.test'), actorOf(db, 'gc@tallyard.test')]);
  const items = await db
    .select({ id: bidItems.id, itemNumber: bidItems.itemNumber })
    .from(bidItems)
    .where(eq(bidItems.projectId, projectId));
  const itemIds = new Map(items.map((i) => [i.itemNumber, i.id]));
  const outboxBefore = new Set((await db.select({ id: emailOutbox.id }).from(emailOutbox)).map((r) => r.id));
  // The seed acts for the demo people without sessions: nothing to re-authenticate.
  const noReauth = { take: () => async () => {}, paymentAboveCents: Number.MAX_SAFE_INTEGER, paymentWindowHours: 0 };
  const ctx: AppContext = {
    db,
    storage,
    outbox: { flush: async () => {}, poll: () => () => {} },
    logger: createLogger('silent'),
    appUrl: '',
    feeRates: DEFAULT_FEE_RATES,
    recentAuth: noReauth,
    payAppReads: readCache(),
  };

  // Each step is dated in the scenario, in the days after its period ends (demo-clock.ts).
  const clock = new DemoClock(db);
  for (const [index, period] of DEMO_PAY_CYCLE.entries()) {
    const day = (after: number, time: string) => scenarioTime(period.periodEnd, after, time);
    await clock.step(day(-3, '15:30'), () => tallyPeriod(db, storage, sub, projectId, period, itemIds));
    const draft = await clock.step(day(1, '08:40'), () =>
      createPayApp(db, sub, projectId, {
        periodStart: period.periodStart,
        periodEnd: period.periodEnd,
        isFinal: false,
      }),
    );
    const submitted = await clock.step(day(2, '10:15'), () =>
      submitPayApp(ctx, sub, draft.id, { note: 'Quantities from this month’s tallies.' }),
    );
    const disputed = index === 2 ? submitted.lines.find((l) => l.itemNumber === DEMO_DISPUTE.itemNumber) : undefined;
    const lines = submitted.lines.map((l) =>
      l === disputed
        ? {
            lineId: l.id,
            decision: 'dispute' as const,
            reason: DEMO_DISPUTE.reason,
            counterQuantity: roundTo(l.thisPeriodQuantity * DEMO_DISPUTE.counterQuantityShare, 1),
          }
        : { lineId: l.id, decision: 'approve' as const },
    );
    const reviewed = await clock.step(day(6, '14:40'), () =>
      reviewPayApp(ctx, gc, draft.id, { expectedRevision: submitted.revision, lines }),
    );
    if (index === 2) break;
    const certified = await clock.step(day(8, '09:20'), () =>
      certifyPayApp(ctx, gc, draft.id, {
        expectedRevision: reviewed.revision,
        note: 'Checked against the tallies and evidence.',
        acknowledgedFlags: reviewed.flags.map((f) => f.key),
      }),
    );
    if (index === 0) {
      const ownerId = (await actorOf(db, 'owner@tallyard.test')).userId;
      await clock.step(day(33, '11:05'), () =>
        markPaid(db, projectId, certified.id, certified.currentDueCents, ownerId),
      );
    }
    // Between the second and third periods the borrow area grows and dewatering is added by change order.
    if (index === 1) {
      const co = await clock.step(day(9, '13:00'), () =>
        proposeChangeOrder(ctx, sub, projectId, demoChangeOrder(itemIds)),
      );
      await clock.step(day(14, '10:30'), () => approveChangeOrder(ctx, gc, co.id, DEMO_CHANGE_ORDER.approvalNote));
    }
  }

  const last = DEMO_PAY_CYCLE[DEMO_PAY_CYCLE.length - 1]!.periodEnd;
  await clock.step(scenarioTime(last, 18, '15:00'), async () => {
    for (const f of DEMO_FORECASTS) {
      await setForecast(db, sub, itemIds.get(f.itemNumber)!, { forecastQuantity: f.forecastQuantity, note: f.note });
    }
    await draftVarianceChangeOrder(ctx, sub, itemIds.get(DEMO_FORECASTS[0]!.itemNumber)!);
  });
  // The demo's past hand-offs are history: their e-mails are not sent to the demo addresses.
  const queued = (await db.select({ id: emailOutbox.id }).from(emailOutbox))
    .map((r) => r.id)
    .filter((id) => !outboxBefore.has(id));
  if (queued.length > 0) {
    await db
      .update(emailOutbox)
      .set({ status: 'sent', lastError: 'Demo history: not delivered' })
      .where(inArray(emailOutbox.id, queued));
  }
  return true;
}
