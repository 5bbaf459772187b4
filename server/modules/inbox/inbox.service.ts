import type { AccessRole } from '../../../src/shared/constants';
import type { InboxEntryView, InboxView } from '../../../src/shared/schemas/inbox';
import type { Db } from '../../db/client';
import type { Actor } from '../../lib/actor';
import { balanceCents } from '../../../src/shared/policies/payments';
import { accessRoles } from '../../../src/shared/policies/projects';
import { listVisibleProjects, rolesByProject, type ProjectRow } from '../projects/projects.repository';
import { presentCounts, presentEntry, type EntryDraft } from './inbox.presenter';
import {
  changeOrderWaits,
  followsInvitations,
  payAppStep,
  paymentDue,
  paymentDueAt,
  waiverStep,
} from '../../../src/shared/policies/inbox';
import * as repo from './inbox.repository';

type Scope = { project: ProjectRow; roles: AccessRole[] };

/**
 * What waits on the actor across every job the actor can see: each project's rows are judged with the actor's
 * roles on that project only, so nothing of a job the actor is not on is ever read.
 */
export async function inboxFor(db: Db, actor: Actor, now = new Date()): Promise<InboxView> {
  const projects = await listVisibleProjects(db, actor.userId, actor.isAdmin ? actor.companyId : null);
  const roleRows = await rolesByProject(
    db,
    actor.userId,
    projects.map((p) => p.id),
  );
  const scopes = new Map<string, Scope>(
    projects.map((project) => {
      const mine = roleRows.filter((r) => r.projectId === project.id).map((r) => r.role);
      return [project.id, { project, roles: accessRoles(actor, project, mine) }];
    }),
  );
  const ids = [...scopes.keys()];
  // Sequential: on the embedded database the queries share one connection anyway.
  const apps = await repo.unfinishedPayApps(db, ids);
  const paidApps = await repo.paidPayApps(db, ids);
  const appIds = [...apps, ...paidApps].map((a) => a.id);
  const attempts = await repo.paymentsOf(db, appIds);
  const waivers = await repo.waiversOf(db, appIds);
  const changeOrders = await repo.proposedChangeOrders(db, ids);
  const invitations = await repo.unacceptedInvitations(db, ids);

  const entries: InboxEntryView[] = [];
  const add = (scope: Scope, e: EntryDraft) => entries.push(presentEntry(scope.project, e, now));
  const pathOf = (s: Scope) => `/projects/${s.project.id}`;

  for (const app of apps) {
    const scope = scopes.get(app.projectId)!;
    const label = `pay application ${app.number}`;
    const step = payAppStep(app.status, scope.roles, app.openDisputes);
    if (step) {
      const since = toDate(app.enteredAt) ?? (app.status === 'submitted' ? app.submittedAt : null) ?? app.createdAt;
      const title = {
        pay_app_submit: `Submit ${label}`,
        pay_app_review: `Review ${label}`,
        pay_app_certify: `Certify ${label}`,
        pay_app_revise: `Revise and resubmit ${label}`,
        pay_app_answer: `Answer the disputes on ${label}`,
      }[step as 'pay_app_submit'];
      const detail =
        step === 'pay_app_answer'
          ? `${app.openDisputes} disputed ${app.openDisputes === 1 ? 'line' : 'lines'}, returned at revision ${app.revision}`
          : app.revision > 0
            ? `Revision ${app.revision}`
            : '';
      add(scope, {
        id: `${step}:${app.id}`,
        kind: step,
        title,
        detail,
        amountCents: app.currentDueCents,
        period: { start: app.periodStart, end: app.periodEnd },
        since,
        href: `${pathOf(scope)}/pay-apps/${app.id}`,
      });
    }
    const mine = attempts.filter((a) => a.payAppId === app.id);
    if (app.certifiedAt && paymentDue(app, scope.roles, mine)) {
      add(scope, {
        id: `payment_due:${app.id}`,
        kind: 'payment_due',
        title: `Payment due on ${label}`,
        detail: app.paidCents > 0 ? 'Balance left after a partial payment' : 'Certified for payment',
        amountCents: balanceCents(app, 0),
        period: { start: app.periodStart, end: app.periodEnd },
        since: app.certifiedAt,
        dueAt: paymentDueAt(app.certifiedAt, scope.project.paymentTermsDays),
        // The owner pays from the application itself, whose payment card takes the payment.
        href: `${pathOf(scope)}/pay-apps/${app.id}`,
      });
    }
  }

  for (const app of [...apps, ...paidApps]) {
    const scope = scopes.get(app.projectId)!;
    const paid = attempts.filter((a) => a.payAppId === app.id);
    const issued = waivers.filter((w) => w.payAppId === app.id);
    for (const w of waiverStep(app, scope.roles, paid, issued)) {
      const settled = paid.filter((p) => p.status === 'succeeded').at(-1);
      const unconditional = w.waiver.startsWith('unconditional');
      const since = unconditional ? (settled?.settledAt ?? settled?.createdAt) : app.certifiedAt;
      add(scope, {
        id: `${w.kind}:${w.waiver}:${app.id}`,
        kind: w.kind,
        title: `${w.kind === 'waiver_sign' ? 'Sign' : 'Ask for'} the ${WAIVER_WORDS[w.waiver]} on pay application ${app.number}`,
        detail: unconditional ? 'The payment has settled' : 'The application is certified',
        amountCents: w.amountCents,
        since: since ?? now,
        href: `${pathOf(scope)}/waivers`,
      });
    }
  }

  for (const co of changeOrders) {
    const scope = scopes.get(co.projectId)!;
    if (!changeOrderWaits(co, scope.roles, scope.project.ownerApprovesChangeOrders)) continue;
    add(scope, {
      id: `change_order_decide:${co.id}`,
      kind: 'change_order_decide',
      title: `Decide change order ${co.number}: ${co.title}`,
      detail: co.gcApprovedAt
        ? `Proposed by ${co.proposedBy}; the general contractor has approved`
        : `Proposed by ${co.proposedBy}`,
      amountCents: null,
      since: co.createdAt,
      href: `${pathOf(scope)}/change-orders/${co.id}`,
    });
  }

  for (const inv of invitations) {
    const scope = scopes.get(inv.projectId)!;
    if (!followsInvitations(scope.roles, inv.role)) continue;
    const expired = inv.expiresAt.getTime() <= now.getTime();
    add(scope, {
      id: `invitation_pending:${inv.id}`,
      kind: 'invitation_pending',
      title: expired
        ? `Invitation to ${inv.email} expired: send a new one`
        : `Invitation to ${inv.email} not accepted yet`,
      detail: `Invited as ${ROLE_WORDS[inv.role]}`,
      amountCents: null,
      since: inv.createdAt,
      dueAt: inv.expiresAt,
      href: `${pathOf(scope)}/people`,
    });
  }

  entries.sort((a, b) => Number(b.overdue) - Number(a.overdue) || a.since.localeCompare(b.since));
  return { entries, counts: presentCounts(entries) };
}

const toDate = (v: Date | string | null) => (v === null ? null : v instanceof Date ? v : new Date(v));

const WAIVER_WORDS = {
  conditional_progress: 'conditional progress waiver',
  unconditional_progress: 'unconditional progress waiver',
  conditional_final: 'conditional final waiver',
  unconditional_final: 'unconditional final waiver',
} as const;

const ROLE_WORDS = {
  subcontractor: 'subcontractor',
  general_contractor: 'general contractor',
  owner: 'owner',
} as const;
