import { and, eq } from 'drizzle-orm';
import { formatQuantity } from '../../../src/shared/format';
import type { EditDisputeInput } from '../../../src/shared/schemas/pay-app';
import type { AppContext } from '../../app-context';
import { disputeComments, disputes, payAppLines } from '../../db/schema';
import type { Actor } from '../../lib/actor';
import { AppError, forbidden, notFound } from '../../lib/app-error';
import { recordAudit } from '../audit/audit.repository';
import { enqueueEmail } from '../notifications/outbox';
import { loadPayAppAccess } from './pay-app-access';
import { disputeStepMail } from './pay-app-emails';
import { mayTake } from '../../../src/shared/policies/pay-apps';
import { payAppDetail } from './pay-apps.service';
import * as repo from './pay-apps.repository';
import { seatAddresses } from '../members/members.repository';

/** 400 COUNTER_ABOVE_CLAIM: the reviewer accepts at most what was claimed; more is a comment and a revised claim. */
export function counterAboveClaim(path: string, itemNumber: string, counter: number, claimed: number) {
  return new AppError(
    400,
    'COUNTER_ABOVE_CLAIM',
    `The counter quantity for item ${itemNumber} (${counter}) is above the ${claimed} claimed this period. If more was done, say so in the reason; the subcontractor revises its claim.`,
    [{ path, message: `At most the claimed ${claimed}` }],
  );
}

/**
 * An open dispute the reviewer may still change: the application is returned and the subcontractor has not
 * answered. 404 off the project, 403 for a role that does not review, 409 once answered.
 */
async function loadOpenDispute(ctx: AppContext, actor: Actor, disputeId: string) {
  const found = /^[0-9a-f-]{36}$/i.test(disputeId) ? await repo.findDispute(ctx.db, disputeId) : undefined;
  if (!found) throw notFound('The dispute');
  const access = await loadPayAppAccess(ctx.db, actor, found.d.payAppId).catch((err: unknown) => {
    throw err instanceof AppError && err.status === 404 ? notFound('The dispute') : err;
  });
  if (!mayTake('return', access.roles))
    throw forbidden('Only the reviewer of the pay application changes its disputes.');
  if (found.d.status !== 'open' || access.app.status !== 'returned') {
    throw new AppError(
      409,
      'DISPUTE_ANSWERED',
      'This dispute was answered or closed; it can no longer be changed. Comment on its thread instead.',
    );
  }
  const [line] = await ctx.db.select().from(payAppLines).where(eq(payAppLines.id, found.d.lineId));
  return { ...access, dispute: found.d, line: line! };
}

/** The reviewer corrects the reason or counter quantity of an open dispute: a thread entry, an audit event, a mail. */
export async function editDispute(ctx: AppContext, actor: Actor, disputeId: string, input: EditDisputeInput) {
  const { app, project, dispute, line, roles } = await loadOpenDispute(ctx, actor, disputeId);
  if (input.counterQuantity !== undefined && input.counterQuantity > line.thisPeriodQuantity) {
    throw counterAboveClaim('counterQuantity', line.itemNumber, input.counterQuantity, line.thisPeriodQuantity);
  }
  const next = {
    reason: input.reason ?? dispute.reason,
    counterQuantity: input.counterQuantity ?? dispute.counterQuantity,
  };
  const body = [
    next.counterQuantity !== dispute.counterQuantity
      ? `Counter quantity changed from ${formatQuantity(dispute.counterQuantity, line.payUnit)} to ${formatQuantity(next.counterQuantity, line.payUnit)}.`
      : '',
    next.reason !== dispute.reason ? `Reason now: ${next.reason}` : '',
  ]
    .filter(Boolean)
    .join(' ');
  await ctx.db.transaction(async (tx) => {
    const [row] = await tx
      .update(disputes)
      .set(next)
      .where(and(eq(disputes.id, disputeId), eq(disputes.status, 'open')))
      .returning();
    if (!row) throw new AppError(409, 'DISPUTE_ANSWERED', 'This dispute was answered meanwhile; reload it.');
    await tx
      .insert(disputeComments)
      .values({ disputeId, authorUserId: actor.userId, body: body || 'Dispute saved unchanged.' });
    await recordAudit(tx, {
      projectId: project.id,
      actorUserId: actor.userId,
      objectType: 'dispute',
      objectId: disputeId,
      action: 'dispute.edited',
      before: { reason: dispute.reason, counterQuantity: dispute.counterQuantity },
      after: next,
    });
    await enqueueEmail(
      tx,
      disputeStepMail(mailFacts(ctx, project, app, actor), await seatAddresses(tx, project, ['subcontractor']), {
        itemNumber: line.itemNumber,
        what: 'changed',
        body,
      }),
    );
  });
  void ctx.outbox.flush(); // after commit, off the answer: a slow mail server never delays it
  return payAppDetail(ctx.db, app.id, roles);
}

/** The reviewer withdraws an open dispute: the line is approved as claimed; thread entry, audit event, mail. */
export async function withdrawDispute(ctx: AppContext, actor: Actor, disputeId: string, note: string) {
  const { app, project, dispute, line, roles } = await loadOpenDispute(ctx, actor, disputeId);
  const body = `Dispute withdrawn; the claimed ${formatQuantity(line.thisPeriodQuantity, line.payUnit)} stands. ${note}`;
  await ctx.db.transaction(async (tx) => {
    const [row] = await tx
      .update(disputes)
      .set({
        status: 'resolved',
        resolution: 'withdrawn',
        resolutionNote: note,
        resolvedByUserId: actor.userId,
        resolvedAt: new Date(),
      })
      .where(and(eq(disputes.id, disputeId), eq(disputes.status, 'open')))
      .returning();
    if (!row) throw new AppError(409, 'DISPUTE_ANSWERED', 'This dispute was answered meanwhile; reload it.');
    await tx.update(payAppLines).set({ reviewStatus: 'approved' }).where(eq(payAppLines.id, line.id));
    await tx.insert(disputeComments).values({ disputeId, authorUserId: actor.userId, body });
    await recordAudit(tx, {
      projectId: project.id,
      actorUserId: actor.userId,
      objectType: 'dispute',
      objectId: disputeId,
      action: 'dispute.withdrawn',
      before: { status: dispute.status, counterQuantity: dispute.counterQuantity },
      after: { status: 'resolved', resolution: 'withdrawn', note },
    });
    await enqueueEmail(
      tx,
      disputeStepMail(mailFacts(ctx, project, app, actor), await seatAddresses(tx, project, ['subcontractor']), {
        itemNumber: line.itemNumber,
        what: 'withdrawn',
        body,
      }),
    );
  });
  void ctx.outbox.flush(); // after commit, off the answer: a slow mail server never delays it
  return payAppDetail(ctx.db, app.id, roles);
}

export const mailFacts = (
  ctx: AppContext,
  project: { id: string; name: string },
  app: repo.PayAppRow,
  actor: Actor,
) => ({
  appUrl: ctx.appUrl,
  projectId: project.id,
  projectName: project.name,
  payAppId: app.id,
  number: app.number,
  revision: app.revision,
  periodStart: app.periodStart,
  periodEnd: app.periodEnd,
  currentDueCents: app.currentDueCents,
  actorName: actor.name,
});
