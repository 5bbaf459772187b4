import type { AccessRole, PayAppStatus } from '../../../src/shared/constants';
import { isFrozen, PAY_APP_TRANSITIONS, type PayAppAction } from '../../../src/shared/domain/pay-app-status';

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
