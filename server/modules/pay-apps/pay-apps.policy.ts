import type { AccessRole, PayAppStatus } from '../../../src/shared/constants';
import { isFrozen, PAY_APP_TRANSITIONS, type PayAppAction } from '../../../src/shared/domain/pay-app-status';

/** The subcontractor compiles its pay applications. */
export const canCreatePayApp = (roles: AccessRole[]) => roles.includes('subcontractor');

/** Whether the person's roles may take this action, from the transition table. */
export const mayTake = (action: PayAppAction, roles: AccessRole[]) => PAY_APP_TRANSITIONS[action].by.some((r) => r !== 'system' && roles.includes(r));

/** The owner sees certified applications (and later states) only; the contractors see every status. */
export function canSeePayApp(roles: AccessRole[], status: PayAppStatus): boolean {
  if (roles.some((r) => r === 'subcontractor' || r === 'general_contractor' || r === 'admin')) return true;
  return roles.includes('owner') && isFrozen(status);
}

/** Dispute threads are between the two contractors. */
export const canComment = (roles: AccessRole[]) => roles.includes('subcontractor') || roles.includes('general_contractor');
