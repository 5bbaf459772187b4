import { isFrozen } from '../../../src/shared/domain/pay-app-status';
import type { IssueLienWaiverInput, LienWaiverView, ProjectLienWaiversView } from '../../../src/shared/schemas/payment';
import type { AppContext } from '../../app-context';
import type { Actor } from '../../lib/actor';
import { AppError, forbidden, notFound, validationFailed } from '../../lib/app-error';
import { recordAudit } from '../audit/audit.repository';
import { isUuid, loadProjectAccess } from '../projects/project-access';
import { canReadProject } from '../../../src/shared/policies/projects';
import { canSeePayApp } from '../../../src/shared/policies/pay-apps';
import { findPayApp } from '../payments/payments.repository';
import { renderWaiverPdf } from './lien-waiver-pdf';
import { canIssueWaiver, waiverOptions } from '../../../src/shared/policies/lien-waivers';
import { presentWaiver } from './lien-waivers.presenter';
import * as repo from './lien-waivers.repository';
import { exceptionsFor } from './waiver-exceptions.service';
import { waiverSignedMail } from './waiver-emails';
import { enqueueEmail } from '../notifications/outbox';
import { seatAddresses } from '../members/members.repository';

const rethrowAs = (what: string) => (err: unknown) => {
  throw err instanceof AppError && err.status === 404 ? notFound(what) : err;
};

/** The pay application with the same visibility as the application itself: hidden from the owner's side until certified. */
async function loadPayApp(ctx: AppContext, actor: Actor, payAppId: string, rule = canReadProject) {
  const app = isUuid(payAppId) ? await findPayApp(ctx.db, payAppId) : undefined;
  if (!app) throw notFound('The pay application');
  const access = await loadProjectAccess(ctx.db, actor, app.projectId).catch(rethrowAs('The pay application'));
  if (!canSeePayApp(access.roles, app.status)) throw notFound('The pay application');
  if (!rule(access.roles)) throw forbidden();
  return { app, ...access };
}

export async function listForProject(
  ctx: AppContext,
  actor: Actor,
  projectId: string,
): Promise<ProjectLienWaiversView> {
  const { project } = await loadProjectAccess(ctx.db, actor, projectId);
  const apps = (await repo.payAppsOf(ctx.db, projectId)).filter((a) => isFrozen(a.status));
  const waivers = await repo.listWaivers(ctx.db, { projectId });
  const numbers = new Map(apps.map((a) => [a.id, a.number]));
  const payApps = [];
  for (const a of apps) {
    const options = waiverOptions(
      a,
      await repo.paymentsOf(ctx.db, a.id),
      waivers.filter((w) => w.payAppId === a.id),
    );
    const exceptions = await exceptionsFor(ctx.db, a);
    payApps.push({
      id: a.id,
      number: a.number,
      status: a.status,
      periodEnd: a.periodEnd,
      isFinal: a.isFinal,
      options,
      exceptions,
    });
  }
  return { state: project.state, payApps, waivers: waivers.map((w) => presentWaiver(w, numbers.get(w.payAppId) ?? 0)) };
}

const sameName = (a: string, b: string) =>
  a.normalize('NFC').replace(/\s+/g, ' ').trim().toLowerCase() ===
  b.normalize('NFC').replace(/\s+/g, ' ').trim().toLowerCase();

/**
 * The signer: a person of the subcontractor company holding its seat (accessRoles counts a seat only while the
 * person belongs to the company that fills it), signing under the name of their own account. The typed name is
 * the act of signing and must be that name; the waiver records the account's name, never free text.
 */
function signerName(actor: Actor, project: { subcontractorCompanyId: string }, typed: string): string {
  if (actor.companyId !== project.subcontractorCompanyId)
    throw new AppError(
      403,
      'SIGNER_NOT_OF_SUBCONTRACTOR',
      'Only a person of the subcontractor company signs its lien waivers.',
    );
  if (!sameName(typed, actor.name)) {
    throw validationFailed(
      [{ path: 'signedName', message: `Type your name as it is on your account (${actor.name}) to sign.` }],
      'The typed name is not the name of your account.',
    );
  }
  return actor.name;
}

/**
 * The subcontractor issues one waiver: the form must be allowed now (unconditional only after the payment
 * settled), the PDF is rendered and stored, then the row and its audit event are written in one transaction.
 */
export async function issueWaiver(
  ctx: AppContext,
  actor: Actor,
  payAppId: string,
  input: IssueLienWaiverInput,
): Promise<LienWaiverView> {
  const { app, project } = await loadPayApp(ctx, actor, payAppId, canIssueWaiver);
  const signedName = signerName(actor, project, input.signedName);
  const issued = await repo.listWaivers(ctx.db, { payAppId });
  const option = waiverOptions(app, await repo.paymentsOf(ctx.db, app.id), issued).find((o) => o.kind === input.kind);
  if (!option)
    throw new AppError(
      409,
      app.isFinal ? 'WAIVER_FINAL_APPLICATION' : 'WAIVER_NOT_FINAL_PAYMENT',
      app.isFinal
        ? 'This is the final application: use the final waiver forms.'
        : 'A final waiver goes only with the final payment (the final application); use the progress waiver forms.',
    );
  if (!option.allowed) throw new AppError(409, option.code!, option.reason!);
  const exceptions = await exceptionsFor(ctx.db, app, input.exceptions ?? []);
  const signedAt = new Date();
  const [claimant, customer, owner] = await Promise.all([
    repo.companyName(ctx.db, project.subcontractorCompanyId),
    repo.companyName(ctx.db, project.generalContractorCompanyId),
    repo.companyName(ctx.db, project.ownerCompanyId),
  ]);
  const pdf = await renderWaiverPdf({
    kind: input.kind,
    state: project.state,
    project: project.name,
    location: project.location,
    claimant,
    customer,
    owner,
    payAppNumber: app.number,
    amountCents: option.amountCents,
    throughDate: app.periodEnd,
    signedName,
    signedByEmail: actor.email,
    signedAt,
    paymentRef: option.paymentId,
    exceptions,
  });
  const stored = await ctx.storage.put(pdf, 'lien-waivers');
  try {
    const row = await ctx.db.transaction(async (tx) => {
      const row = await repo.insertWaiver(tx, {
        projectId: app.projectId,
        payAppId: app.id,
        paymentId: option.paymentId,
        kind: input.kind,
        amountCents: option.amountCents,
        throughDate: app.periodEnd,
        signedName,
        signedByUserId: actor.userId,
        signedAt,
        storageKey: stored.key,
        exceptions,
      });
      await recordAudit(tx, {
        projectId: app.projectId,
        actorUserId: actor.userId,
        objectType: 'lien_waiver',
        objectId: row.id,
        action: 'lien_waiver.issued',
        after: {
          kind: row.kind,
          amountCents: row.amountCents,
          throughDate: row.throughDate,
          signedName: row.signedName,
          paymentId: row.paymentId,
          exceptions: row.exceptions,
          sha256: stored.sha256,
        },
      });
      await enqueueEmail(
        tx,
        waiverSignedMail(
          { appUrl: ctx.appUrl, project, payAppNumber: app.number },
          await seatAddresses(tx, project, ['general_contractor', 'owner']),
          row,
        ),
      );
      return row;
    });
    void ctx.outbox.flush(); // after commit, off the answer: a slow mail server never delays it
    return presentWaiver(row, app.number);
  } catch (err) {
    await ctx.storage.remove(stored.key);
    throw err;
  }
}

export async function waiverPdf(ctx: AppContext, actor: Actor, waiverId: string) {
  const row = isUuid(waiverId) ? await repo.findWaiver(ctx.db, waiverId) : undefined;
  if (!row) throw notFound('The lien waiver');
  await loadProjectAccess(ctx.db, actor, row.projectId).catch(rethrowAs('The lien waiver'));
  const app = (await findPayApp(ctx.db, row.payAppId))!;
  return {
    bytes: await ctx.storage.get(row.storageKey),
    filename: `lien-waiver-pa${app.number}-${row.kind.replace(/_/g, '-')}.pdf`,
  };
}
