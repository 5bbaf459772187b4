import type { AccessRole, InboxKind, LienWaiverKind, PayAppStatus, PaymentStatus, ProjectRole } from '../constants';
import { nextStatus, type PayAppAction } from '../domain/pay-app-status';
import { decisionSides } from './change-orders';
import { canIssueWaiver, waiverOptions } from './lien-waivers';
import { mayTake } from './pay-apps';
import { balanceCents, canPay, PAYABLE_STATUSES } from './payments';
import { canManagePeople, managedSeat } from './projects';

/**
 * The person's own move on a pay application, read from the transition table: the first of these actions that
 * the status allows and the person's roles may take. From `submitted` the reviewer's move is to start the review
 * (certify and return are also open, but reviewing comes first); from `in_review` it is to certify.
 */
const PAY_APP_STEPS: readonly [PayAppAction, InboxKind][] = [
  ['submit', 'pay_app_submit'],
  ['start_review', 'pay_app_review'],
  ['certify', 'pay_app_certify'],
  ['revise', 'pay_app_revise'],
];

export function payAppStep(status: PayAppStatus, roles: AccessRole[], openDisputes: number): InboxKind | null {
  const step = PAY_APP_STEPS.find(([action]) => nextStatus(status, action) !== null && mayTake(action, roles));
  if (!step) return null;
  // A returned application with open disputes asks for answers before the revision.
  return step[1] === 'pay_app_revise' && openDisputes > 0 ? 'pay_app_answer' : step[1];
}

type PayState = { status: PayAppStatus; currentDueCents: number; paidCents: number };
type Attempt = { status: PaymentStatus; amountCents: number };

/**
 * The payer owes a payment when the application is payable (payments policy) with a balance left, and no
 * attempt is already open (one open attempt per application: created or processing).
 */
export function paymentDue(app: PayState, roles: AccessRole[], attempts: Attempt[]): boolean {
  if (!canPay(roles) || !PAYABLE_STATUSES.includes(app.status)) return false;
  if (attempts.some((a) => a.status === 'created' || a.status === 'processing')) return false;
  return balanceCents(app, 0) > 0;
}

/** Payment is due the project's payment terms (days) after certification. */
export function paymentDueAt(certifiedAt: Date, paymentTermsDays: number): Date {
  return new Date(certifiedAt.getTime() + paymentTermsDays * 86_400_000);
}

type WaiverApp = PayState & { isFinal: boolean };
type Paid = { id: string; amountCents: number; status: string };
type Issued = { kind: LienWaiverKind; paymentId: string | null };

/**
 * Waivers the subcontractor may sign now (waiver policy: a conditional one only while the payment has not
 * settled, an unconditional one only after). The others on the project are told that an
 * unconditional waiver is owed for a settled payment, so they can ask for it.
 */
export function waiverStep(
  app: WaiverApp,
  roles: AccessRole[],
  paid: Paid[],
  issued: Issued[],
): { kind: InboxKind; waiver: LienWaiverKind; amountCents: number }[] {
  // The policy offers a conditional form only while the payment has not settled.
  const open = waiverOptions(app, paid, issued).filter((o) => o.allowed);
  if (canIssueWaiver(roles))
    return open.map((o) => ({ kind: 'waiver_sign', waiver: o.kind, amountCents: o.amountCents }));
  if (roles.includes('owner') || roles.includes('general_contractor')) {
    return open
      .filter((o) => o.kind.startsWith('unconditional'))
      .map((o) => ({ kind: 'waiver_request', waiver: o.kind, amountCents: o.amountCents }));
  }
  return [];
}

/** Change orders wait on each deciding side (change order policy) that has not approved yet. */
export function changeOrderWaits(
  co: { gcApprovedAt: Date | null; ownerApprovedAt: Date | null },
  roles: AccessRole[],
  ownerApproves: boolean,
): boolean {
  return decisionSides(roles, ownerApproves).some((side) =>
    side === 'gc' ? co.gcApprovedAt === null : co.ownerApprovedAt === null,
  );
}

/** Unaccepted invitations are followed by the admin of the company whose seat they fill. */
export const followsInvitations = (roles: AccessRole[], seat: ProjectRole) =>
  canManagePeople(roles) && managedSeat(roles) === seat;
