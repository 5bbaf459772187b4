import { and, eq, inArray } from 'drizzle-orm';
import type { AccessRole, PayAppStatus } from '../../../src/shared/constants';
import type { PayAppActionInput, ReviewPayAppInput, RevisePayAppInput } from '../../../src/shared/schemas/pay-app';
import type { AppContext } from '../../app-context';
import type { Executor } from '../../db/client';
import { disputeComments, disputes, payAppLines } from '../../db/schema';
import type { Actor } from '../../lib/actor';
import type { ConfirmRecentAuth } from '../../middleware/require-recent-auth';
import { AppError, validationFailed } from '../../lib/app-error';
import { recordAudit } from '../audit/audit.repository';
import { queueWaiverRequest } from '../lien-waivers/waiver-requests';
import { enqueueEmail } from '../notifications/outbox';
import type { ProjectRow } from '../projects/projects.repository';
import { loadPayAppAccess } from './pay-app-access';
import { recomputeLines } from './pay-app-build';
import { answeredMail, certifiedMail, returnedMail, submittedMail, type MailFacts } from './pay-app-emails';
import { counterAboveClaim } from './disputes.service';
import { formatQuantity } from '../../../src/shared/format';
import { checkAction, moveStatus } from './pay-app-transition';
import { payAppDetail } from './pay-apps.service';
import * as repo from './pay-apps.repository';
import { seatAddresses } from '../members/members.repository';

const facts = (ctx: AppContext, project: ProjectRow, app: repo.PayAppRow, actor: Actor): MailFacts => ({
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

const audit = (tx: Executor, actor: Actor, app: repo.PayAppRow, action: string, before: unknown, after: unknown) =>
  recordAudit(tx, {
    projectId: app.projectId,
    actorUserId: actor.userId,
    objectType: 'pay_app',
    objectId: app.id,
    action,
    before,
    after,
  });

const state = (a: repo.PayAppRow) => ({ status: a.status, revision: a.revision, currentDueCents: a.currentDueCents });

/**
 * Separation of duties (product brief): whoever submitted an application, at any revision, does not review or
 * certify it, even after moving to the general contractor's seat.
 */
async function refuseSubmitter(ctx: AppContext, actor: Actor, app: repo.PayAppRow) {
  if ((await repo.submitterIds(ctx.db, app.id)).includes(actor.userId)) {
    throw new AppError(
      403,
      'SUBMITTER_CANNOT_REVIEW',
      `You submitted pay application ${app.number}; another person of the general contractor reviews and certifies it.`,
    );
  }
}

/** Runs the change in one transaction, then starts sending the mail it queued (never inside the transaction). */
async function commit(ctx: AppContext, payAppId: string, roles: AccessRole[], work: (tx: Executor) => Promise<void>) {
  await ctx.db.transaction(work);
  void ctx.outbox.flush(); // after commit, off the answer: a slow mail server never delays it
  return payAppDetail(ctx.db, payAppId, roles);
}

export async function submitPayApp(ctx: AppContext, actor: Actor, payAppId: string, input: PayAppActionInput) {
  const { app, roles, project } = await loadPayAppAccess(ctx.db, actor, payAppId);
  const to = checkAction(app, 'submit', roles, input.expectedRevision);
  return commit(ctx, app.id, roles, async (tx) => {
    const row = await moveStatus(
      tx,
      app,
      [{ from: app.status, to }],
      actor.userId,
      { submittedAt: new Date() },
      input.note,
    );
    await audit(tx, actor, app, 'pay_app.submitted', state(app), state(row));
    await enqueueEmail(
      tx,
      submittedMail(facts(ctx, project, row, actor), await seatAddresses(tx, project, ['general_contractor'])),
    );
  });
}

/** `confirmRecentAuth` runs after the access and state checks, so only someone who may certify is asked to sign in again. */
export async function certifyPayApp(
  ctx: AppContext,
  actor: Actor,
  payAppId: string,
  input: PayAppActionInput,
  confirmRecentAuth?: ConfirmRecentAuth,
) {
  const { app, roles, project } = await loadPayAppAccess(ctx.db, actor, payAppId);
  const to = checkAction(app, 'certify', roles, input.expectedRevision);
  await refuseSubmitter(ctx, actor, app);
  const lines = await repo.listLines(ctx.db, app.id);
  const unapproved = lines.filter((l) => l.reviewStatus !== 'approved');
  if (unapproved.length > 0) {
    throw new AppError(
      409,
      'PAY_APP_LINES_NOT_APPROVED',
      `Every line must be approved before certifying; ${unapproved.length} is not.`,
      unapproved.map((l) => ({ path: `lines.${l.id}`, message: `Item ${l.itemNumber} is ${l.reviewStatus}` })),
    );
  }
  // Flags before money moves: each line beyond the band or billed without evidence is acknowledged by key.
  const { flags } = await payAppDetail(ctx.db, app.id, roles);
  const acknowledged = new Set(input.acknowledgedFlags ?? []);
  const unseen = flags.filter((f) => !acknowledged.has(f.key));
  if (unseen.length > 0) {
    throw new AppError(
      409,
      'FLAGS_NOT_ACKNOWLEDGED',
      `Acknowledge each flag before certifying; ${unseen.length} ${unseen.length === 1 ? 'is' : 'are'} not.`,
      unseen.map((f) => ({ path: `acknowledgedFlags.${f.key}`, message: f.message })),
    );
  }
  await confirmRecentAuth?.();
  return commit(ctx, app.id, roles, async (tx) => {
    const row = await moveStatus(
      tx,
      app,
      [{ from: app.status, to }],
      actor.userId,
      { certifiedAt: new Date(), certifiedByUserId: actor.userId },
      input.note,
    );
    const acknowledgedFlags = flags.map((f) => ({
      key: f.key,
      kind: f.kind,
      itemNumber: f.itemNumber,
      message: f.message,
    }));
    await audit(tx, actor, app, 'pay_app.certified', state(app), {
      ...state(row),
      certifiedAt: row.certifiedAt,
      acknowledgedFlags,
    });
    await enqueueEmail(
      tx,
      certifiedMail(
        facts(ctx, project, row, actor),
        await seatAddresses(tx, project, ['subcontractor']),
        project.paymentTermsDays,
      ),
    );
    await enqueueEmail(
      tx,
      certifiedMail(
        facts(ctx, project, row, actor),
        await seatAddresses(tx, project, ['owner']),
        project.paymentTermsDays,
      ),
    );
    // Certified, the conditional waiver for the balance is due (the waiver policy's timing).
    await queueWaiverRequest(tx, ctx, project, row, 'conditional');
  });
}

export async function reviewPayApp(ctx: AppContext, actor: Actor, payAppId: string, input: ReviewPayAppInput) {
  const { app, roles, project } = await loadPayAppAccess(ctx.db, actor, payAppId);
  const disputed = input.lines.filter((l) => l.decision === 'dispute');
  // First review: submitted -> in_review; any dispute then returns it.
  const steps: { from: PayAppStatus; to: PayAppStatus }[] =
    app.status === 'submitted'
      ? [{ from: app.status, to: checkAction(app, 'start_review', roles, input.expectedRevision) }]
      : [];
  const reviewFrom = steps.at(-1)?.to ?? app.status;
  if (disputed.length > 0)
    steps.push({
      from: reviewFrom,
      to: checkAction({ ...app, status: reviewFrom }, 'return', roles, input.expectedRevision),
    });
  if (steps.length === 0) checkAction(app, 'return', roles, input.expectedRevision); // in_review, approvals only: same checks
  await refuseSubmitter(ctx, actor, app);
  const lines = new Map((await repo.listLines(ctx.db, app.id)).map((l) => [l.id, l]));
  const seen = new Set<string>();
  const bad = input.lines.flatMap((l, i) => {
    if (!lines.has(l.lineId)) return [{ path: `lines.${i}.lineId`, message: 'Not a line of this pay application' }];
    if (seen.has(l.lineId)) return [{ path: `lines.${i}.lineId`, message: 'This line is reviewed twice' }];
    seen.add(l.lineId);
    return [];
  });
  if (bad.length > 0) throw validationFailed(bad);
  input.lines.forEach((l, i) => {
    const claimed = lines.get(l.lineId)!;
    if (l.decision === 'dispute' && l.counterQuantity! > claimed.thisPeriodQuantity) {
      throw counterAboveClaim(
        `lines.${i}.counterQuantity`,
        claimed.itemNumber,
        l.counterQuantity!,
        claimed.thisPeriodQuantity,
      );
    }
  });
  return commit(ctx, app.id, roles, async (tx) => {
    const row = await moveStatus(tx, app, steps, actor.userId);
    for (const decision of ['approve', 'dispute'] as const) {
      const ids = input.lines.filter((l) => l.decision === decision).map((l) => l.lineId);
      if (ids.length)
        await tx
          .update(payAppLines)
          .set({ reviewStatus: decision === 'approve' ? 'approved' : 'disputed' })
          .where(and(eq(payAppLines.payAppId, app.id), inArray(payAppLines.id, ids)));
    }
    if (disputed.length > 0) {
      await tx.insert(disputes).values(
        disputed.map((d) => ({
          payAppId: app.id,
          lineId: d.lineId,
          revision: app.revision,
          reason: d.reason!,
          counterQuantity: d.counterQuantity!,
          claimedQuantity: lines.get(d.lineId)!.thisPeriodQuantity,
          openedByUserId: actor.userId,
        })),
      );
      const listed = disputed.map((d) => ({
        ...d,
        itemNumber: lines.get(d.lineId)!.itemNumber,
        payUnit: lines.get(d.lineId)!.payUnit,
        reason: d.reason!,
        counterQuantity: d.counterQuantity!,
      }));
      await enqueueEmail(
        tx,
        returnedMail(facts(ctx, project, row, actor), await seatAddresses(tx, project, ['subcontractor']), listed),
      );
    }
    await audit(tx, actor, app, 'pay_app.reviewed', state(app), { ...state(row), lines: input.lines });
  });
}

export async function revisePayApp(ctx: AppContext, actor: Actor, payAppId: string, input: RevisePayAppInput) {
  const { app, roles, project } = await loadPayAppAccess(ctx.db, actor, payAppId);
  const to = checkAction(app, 'revise', roles, input.expectedRevision);
  const open = await repo.openDisputes(ctx.db, app.id);
  const answers = new Map(input.lines.map((l) => [l.lineId, l]));
  const missing = open.filter((d) => !answers.has(d.lineId));
  const strays = input.lines.flatMap((l, i) =>
    open.some((d) => d.lineId === l.lineId)
      ? []
      : [{ path: `lines.${i}.lineId`, message: 'This line has no open dispute' }],
  );
  if (missing.length > 0 || strays.length > 0) {
    throw validationFailed([
      ...missing.map((d) => ({
        path: 'lines',
        message: `Answer the dispute on line ${d.lineId}: accept its counter quantity or reply`,
      })),
      ...strays,
    ]);
  }
  const lineRows = new Map((await repo.listLines(ctx.db, app.id)).map((l) => [l.id, l]));
  return commit(ctx, app.id, roles, async (tx) => {
    // The counter taken, or the subcontractor's own proposal; a reply keeps the claim.
    const quantities = new Map(
      open.flatMap((d): [string, number][] => {
        const a = answers.get(d.lineId)!;
        if (a.action === 'accept') return [[d.lineId, d.counterQuantity]];
        return a.action === 'propose' ? [[d.lineId, a.proposedQuantity!]] : [];
      }),
    );
    const totals = await recomputeLines(tx, project, app, quantities);
    const row = await moveStatus(tx, app, [{ from: app.status, to }], actor.userId, {
      ...totals,
      revision: app.revision + 1,
    });
    const told: { itemNumber: string; text: string }[] = [];
    for (const d of open) {
      const a = answers.get(d.lineId)!;
      const line = lineRows.get(d.lineId)!;
      const q = (n: number) => formatQuantity(n, line.payUnit);
      const text =
        a.action === 'accept'
          ? `Took the counter quantity ${q(d.counterQuantity)} (claimed ${q(line.thisPeriodQuantity)}).${a.comment ? ` ${a.comment}` : ''}`
          : a.action === 'propose'
            ? `Proposes ${q(a.proposedQuantity!)} instead of the claimed ${q(line.thisPeriodQuantity)} and the counter ${q(d.counterQuantity)}: ${a.comment}`
            : `Keeps the claimed ${q(line.thisPeriodQuantity)}: ${a.comment}`;
      const resolution =
        a.action === 'accept' ? 'counter_accepted' : a.action === 'propose' ? 'quantity_proposed' : 'answered';
      await tx
        .update(disputes)
        .set({
          status: 'resolved',
          resolution,
          resolutionNote: a.comment ?? null,
          resolvedByUserId: actor.userId,
          resolvedAt: new Date(),
        })
        .where(eq(disputes.id, d.id));
      await tx.insert(disputeComments).values({ disputeId: d.id, authorUserId: actor.userId, body: text });
      await tx.update(payAppLines).set({ reviewStatus: 'pending' }).where(eq(payAppLines.id, d.lineId));
      told.push({ itemNumber: line.itemNumber, text });
    }
    if (told.length > 0)
      await enqueueEmail(
        tx,
        answeredMail(facts(ctx, project, row, actor), await seatAddresses(tx, project, ['general_contractor']), told),
      );
    await audit(
      tx,
      actor,
      app,
      'pay_app.revised',
      { ...state(app), earnedToDateCents: app.earnedToDateCents },
      { ...state(row), earnedToDateCents: row.earnedToDateCents, answers: input.lines },
    );
  });
}
