import type { AccessRole, ChangeOrderStatus } from '../constants';

/** Either contractor proposes a change order. */
export const canProposeChangeOrder = (roles: AccessRole[]) =>
  roles.includes('subcontractor') || roles.includes('general_contractor');

export type ApprovalSide = 'gc' | 'owner';

/**
 * The side an actor decides for: the general contractor always, the owner only where the project asks for the
 * owner's approval too. Null when the actor's roles decide nothing.
 */
export function decisionSides(roles: AccessRole[], ownerApproves: boolean): ApprovalSide[] {
  const sides: ApprovalSide[] = [];
  if (roles.includes('general_contractor')) sides.push('gc');
  if (ownerApproves && roles.includes('owner')) sides.push('owner');
  return sides;
}

export const canDecideChangeOrder = (ownerApproves: boolean) => (roles: AccessRole[]) =>
  decisionSides(roles, ownerApproves).length > 0;

/** Approved once the general contractor has approved, and the owner too where the project requires it. */
export function isFullyApproved(
  o: { gcApprovedAt: Date | null; ownerApprovedAt: Date | null },
  ownerApproves: boolean,
) {
  return o.gcApprovedAt !== null && (!ownerApproves || o.ownerApprovedAt !== null);
}

/** Attaching a document: those who propose or decide change orders on the project (the owner only where it decides). */
export const canAttachChangeOrderDocument = (ownerApproves: boolean) => (roles: AccessRole[]) =>
  canProposeChangeOrder(roles) || canDecideChangeOrder(ownerApproves)(roles);

/** Documents are attached while the change order is proposed; a decided one keeps the documents it was decided on. */
export const documentsOpen = (status: ChangeOrderStatus) => status === 'proposed';

/** What the reader of a change order may do now; the presenter attaches it, the screen shows only these. */
export type ChangeOrderCan = {
  /** Approve or reject it, for the side named in `decideAs`. */
  decide: boolean;
  decideAs: ApprovalSide | null;
  attachDocuments: boolean;
};

type Decidable = { status: ChangeOrderStatus; gcApprovedAt: Date | null; ownerApprovedAt: Date | null };

export function changeOrderCan(roles: AccessRole[], co: Decidable, ownerApproves: boolean): ChangeOrderCan {
  const proposed = documentsOpen(co.status);
  const pending = decisionSides(roles, ownerApproves).find((side) =>
    side === 'gc' ? co.gcApprovedAt === null : co.ownerApprovedAt === null,
  );
  const decideAs = proposed ? (pending ?? null) : null;
  return {
    decide: decideAs !== null,
    decideAs,
    attachDocuments: proposed && canAttachChangeOrderDocument(ownerApproves)(roles),
  };
}
