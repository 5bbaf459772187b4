import type { AccessRole } from '../constants';
import { canManageContract } from './projects';

/**
 * Measurement and payment provisions (issue 15). How an item is paid is a contract term: the general contractor's
 * side (its seat or its company's admin, `canManageContract`) sets it. Field records (trucks,
 * tickets, sources, daily sheets, stored materials) are kept by either contractor; the owner reads them.
 * Deductions and adjustments are the payer's side of the contract: the general contractor's side.
 */
export const canSetMeasurementProfile = (roles: AccessRole[]) => canManageContract(roles);

export const canKeepFieldRecords = (roles: AccessRole[]) =>
  roles.includes('subcontractor') || roles.includes('general_contractor');

export const canRecordAdjustment = (roles: AccessRole[]) => canManageContract(roles);

export type SigningSide = 'contractor' | 'gc';

/** The sides of a force account daily sheet an actor signs for: the subcontractor's and the general contractor's. */
export function signingSides(roles: AccessRole[]): SigningSide[] {
  const sides: SigningSide[] = [];
  if (roles.includes('subcontractor')) sides.push('contractor');
  if (roles.includes('general_contractor')) sides.push('gc');
  return sides;
}

export const canSignDailySheet = (roles: AccessRole[]) => signingSides(roles).length > 0;
