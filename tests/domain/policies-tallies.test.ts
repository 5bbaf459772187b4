import { describe, expect, it } from 'vitest';
import { ACCESS_ROLES, PAY_APP_STATUSES, TALLY_STATUSES, type AccessRole } from '../../src/shared/constants';
import { canManageContract, projectCan } from '../../src/shared/policies/projects';
import { canAddEvidence, tallyCan } from '../../src/shared/policies/tallies';

// Database-free checks of the tally and project rules (issue 12, item 8). The rules themselves are the house's own
// (DEVELOPERS.md, Conventions: the subcontractor measures; the general contractor's side keeps the contract).

const ALL_ROLE_SETS: AccessRole[][] = [[], ...ACCESS_ROLES.map((r) => [r]), ['subcontractor', 'subcontractor_admin']];

describe('tally policy', () => {
  it('only the subcontractor seat edits, deletes or readies a tally, and only a draft', () => {
    for (const roles of ALL_ROLE_SETS) {
      for (const status of TALLY_STATUSES) {
        const can = tallyCan(roles, { status, payAppStatus: null });
        const expected = roles.includes('subcontractor') && status === 'draft';
        expect({ roles, status, edit: can.edit, delete: can.delete, markReady: can.markReady }).toEqual({
          roles,
          status,
          edit: expected,
          delete: expected,
          markReady: expected,
        });
      }
    }
  });

  it('the subcontractor admin alone (no seat) writes nothing', () => {
    expect(Object.values(tallyCan(['subcontractor_admin'], { status: 'draft', payAppStatus: null }))).not.toContain(
      true,
    );
  });

  it('evidence goes on a draft, or on a billed tally while its application is back with the subcontractor', () => {
    for (const payAppStatus of PAY_APP_STATUSES) {
      expect(canAddEvidence('billed', payAppStatus)).toBe(payAppStatus === 'returned' || payAppStatus === 'draft');
      expect(tallyCan(['subcontractor'], { status: 'billed', payAppStatus }).addEvidence).toBe(
        payAppStatus === 'returned' || payAppStatus === 'draft',
      );
      // A billed tally's files are never removed: the application was decided on them.
      expect(tallyCan(['subcontractor'], { status: 'billed', payAppStatus }).removeEvidence).toBe(false);
      expect(tallyCan(['general_contractor'], { status: 'billed', payAppStatus }).addEvidence).toBe(false);
    }
    expect(canAddEvidence('ready', null)).toBe(false);
    expect(canAddEvidence('draft', null)).toBe(true);
  });
});

describe('project policy', () => {
  it('project.can follows the predicates for every role', () => {
    for (const roles of ALL_ROLE_SETS) {
      expect(projectCan(roles)).toEqual({
        manageContract: roles.includes('general_contractor') || roles.includes('general_contractor_admin'),
        createTally: roles.includes('subcontractor'),
      });
      expect(projectCan(roles).manageContract).toBe(canManageContract(roles));
    }
  });
});
