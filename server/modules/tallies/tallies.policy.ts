import type { AccessRole, TallyStatus } from '../../../src/shared/constants';

/** Tallies are the subcontractor's measurements: only its people write them; everyone on the project reads. */
export const canWriteTallies = (roles: AccessRole[]) => roles.includes('subcontractor');

export const isEditableTally = (status: TallyStatus) => status === 'draft';

/**
 * Evidence may be added while the tally is a draft, and also after it was billed while its pay application is
 * back with the subcontractor (returned or revised to draft) so a dispute can be answered with more evidence.
 */
export function canAddEvidence(status: TallyStatus, payAppStatus: string | null): boolean {
  if (status === 'draft') return true;
  return status === 'billed' && (payAppStatus === 'returned' || payAppStatus === 'draft');
}
