import type { AccessRole, BaselineStatus } from '../constants';

/** The two sides that accept a surface baseline; the owner reads it. */
export type BaselineSide = 'subcontractor' | 'general_contractor';

/** The side a person accepts for: a seat of the subcontractor or of the general contractor (admins do not). */
export function baselineSideOf(roles: AccessRole[]): BaselineSide | null {
  if (roles.includes('subcontractor')) return 'subcontractor';
  if (roles.includes('general_contractor')) return 'general_contractor';
  return null;
}

/** Either measuring party records an original ground surface; it counts only once both accept it. */
export const canRecordBaseline = (roles: AccessRole[]) => baselineSideOf(roles) !== null;

/** What the reader of a baseline may do with it now; the presenter attaches it, the screen shows only these. */
export type BaselineCan = { accept: boolean };

export function baselineCan(
  roles: AccessRole[],
  b: { status: BaselineStatus; subAccepted: boolean; gcAccepted: boolean },
): BaselineCan {
  const side = baselineSideOf(roles);
  const mine = side === 'subcontractor' ? b.subAccepted : side === 'general_contractor' ? b.gcAccepted : true;
  return { accept: b.status === 'proposed' && !mine };
}
