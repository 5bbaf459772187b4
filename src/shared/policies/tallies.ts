import type { AccessRole, PayAppStatus, TallyStatus } from '../constants';

/** Tallies are the subcontractor's measurements: only its people write them; everyone on the project reads. */
export const canWriteTallies = (roles: AccessRole[]) => roles.includes('subcontractor');

export const isEditableTally = (status: TallyStatus) => status === 'draft';

/**
 * Evidence may be added while the tally is a draft, and also after it was billed while its pay application is
 * back with the subcontractor (returned or revised to draft) so a dispute can be answered with more evidence.
 */
export function canAddEvidence(status: TallyStatus, payAppStatus: PayAppStatus | string | null): boolean {
  if (status === 'draft') return true;
  return status === 'billed' && (payAppStatus === 'returned' || payAppStatus === 'draft');
}

/** What the reader of a tally may do with it now; presenters attach it, screens show only these commands. */
export type TallyCan = {
  /** Change its inputs (in its worksheet or the direct-quantity form); saving keeps a revision. */
  edit: boolean;
  delete: boolean;
  markReady: boolean;
  addEvidence: boolean;
  removeEvidence: boolean;
};

export function tallyCan(
  roles: AccessRole[],
  tally: { status: TallyStatus; payAppStatus: PayAppStatus | string | null },
): TallyCan {
  const writer = canWriteTallies(roles);
  const draft = writer && isEditableTally(tally.status);
  return {
    edit: draft,
    delete: draft,
    markReady: draft,
    addEvidence: writer && canAddEvidence(tally.status, tally.payAppStatus),
    removeEvidence: draft,
  };
}
