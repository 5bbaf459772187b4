import type { ProjectRole } from '../../../src/shared/constants';
import { AppError, conflict } from '../../lib/app-error';
import { seatCompanyId, type ProjectParties } from '../../../src/shared/policies/projects';

/** Seat names in running text ("the subcontractor seat"). */
export const SEAT_NAMES: Record<ProjectRole, string> = {
  subcontractor: 'subcontractor',
  general_contractor: 'general contractor',
  owner: 'owner',
};

/**
 * The seat rules an invitation must pass when sent and again when accepted (the person may have changed company
 * or taken another seat in between): the invitee belongs to the company that fills the seat, or to no company
 * yet (then joins it on accepting), and holds no seat on the project already.
 */
export function checkSeat(
  project: ProjectParties,
  role: ProjectRole,
  email: string,
  invitee: { companyId: string | null; seats: ProjectRole[] } | null,
) {
  if (!invitee) return;
  if (invitee.companyId && invitee.companyId !== seatCompanyId(project, role)) {
    throw new AppError(
      409,
      'INVITEE_OF_ANOTHER_COMPANY',
      `${email} belongs to a company that does not hold the ${SEAT_NAMES[role]} seat of this job; only that company's people can fill it.`,
    );
  }
  if (invitee.seats.length > 0) {
    throw conflict(
      'ALREADY_HOLDS_SEAT',
      `${email} already holds the ${SEAT_NAMES[invitee.seats[0]!]} seat of this job; one person holds one role on a job.`,
    );
  }
}
