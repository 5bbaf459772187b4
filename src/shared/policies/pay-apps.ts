import type { AccessRole, PayAppStatus } from '../constants';
import { isFrozen, nextStatus, PAY_APP_TRANSITIONS, type PayAppAction } from '../domain/pay-app-status';
import { canIssueWaiver } from './lien-waivers';
import { canPay, PAYABLE_STATUSES } from './payments';

/** The subcontractor compiles its pay applications. */
export const canCreatePayApp = (roles: AccessRole[]) => roles.includes('subcontractor');

/** Whether the person's roles may take this action, from the transition table. */
export const mayTake = (action: PayAppAction, roles: AccessRole[]) =>
  PAY_APP_TRANSITIONS[action].by.some((r) => r !== 'system' && roles.includes(r));

const CONTRACTOR_SIDE: readonly AccessRole[] = [
  'subcontractor',
  'general_contractor',
  'subcontractor_admin',
  'general_contractor_admin',
];

/**
 * The owner's side (its seat and its admin) sees certified applications (and later states) only; the two
 * contractors' sides see every status. Everything that names an application (its audit, payments, exports,
 * waivers, the project trail) follows this rule.
 */
export function canSeePayApp(roles: AccessRole[], status: PayAppStatus): boolean {
  if (roles.some((r) => CONTRACTOR_SIDE.includes(r))) return true;
  return roles.length > 0 && isFrozen(status);
}

/** Dispute threads are between the two contractors. */
export const canComment = (roles: AccessRole[]) =>
  roles.includes('subcontractor') || roles.includes('general_contractor');

/** What the reader of a pay application may do now; the presenter attaches it, the screens show only these. */
export type PayAppCan = {
  /** Submit the draft (or the revision) to the general contractor. */
  submit: boolean;
  /** Approve or dispute lines (a dispute returns the application). */
  review: boolean;
  certify: boolean;
  /** Answer the disputes of a returned application and revise it. */
  answer: boolean;
  /** Write in the dispute threads. */
  comment: boolean;
  pay: boolean;
  /** Sign a lien waiver for it (the waiver screen says which forms are open). */
  issueWaiver: boolean;
};

const open = (status: PayAppStatus, action: PayAppAction, roles: AccessRole[]) =>
  nextStatus(status, action) !== null && mayTake(action, roles);

export function payAppCan(roles: AccessRole[], status: PayAppStatus): PayAppCan {
  return {
    submit: open(status, 'submit', roles),
    review: open(status, 'return', roles),
    certify: open(status, 'certify', roles),
    answer: open(status, 'revise', roles),
    comment: canComment(roles),
    pay: canPay(roles) && PAYABLE_STATUSES.includes(status),
    issueWaiver: canIssueWaiver(roles) && isFrozen(status),
  };
}
