import { describe, expect, it } from 'vitest';
import { ACCESS_ROLES, PAY_APP_STATUSES, TALLY_STATUSES, type AccessRole } from '../../src/shared/constants';
import { isFrozen } from '../../src/shared/domain/pay-app-status';
import { changeOrderCan } from '../../src/shared/policies/change-orders';
import { payAppCan } from '../../src/shared/policies/pay-apps';
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
      const owner = roles.includes('owner') || roles.includes('owner_admin');
      expect(projectCan(roles)).toEqual({
        manageContract: roles.includes('general_contractor') || roles.includes('general_contractor_admin'),
        createTally: roles.includes('subcontractor'),
        createPayApp: roles.includes('subcontractor'),
        seeDraftPayApps: roles.length > 0 && !owner,
        pay: roles.includes('owner'),
        issueWaiver: roles.includes('subcontractor'),
        proposeChangeOrder: roles.includes('subcontractor') || roles.includes('general_contractor'),
      });
      expect(projectCan(roles).manageContract).toBe(canManageContract(roles));
    }
  });
});

describe('pay application policy', () => {
  // The transition table (src/shared/domain/pay-app-status.ts) says who moves an application from which status;
  // `can` must agree with it for every role and status.
  it('offers each move only to its role, from the statuses the table allows', () => {
    for (const roles of ALL_ROLE_SETS) {
      for (const status of PAY_APP_STATUSES) {
        const can = payAppCan(roles, status);
        const sub = roles.includes('subcontractor');
        const gc = roles.includes('general_contractor');
        expect(can.submit).toBe(sub && status === 'draft');
        expect(can.answer).toBe(sub && status === 'returned');
        expect(can.review).toBe(gc && (status === 'submitted' || status === 'in_review'));
        expect(can.certify).toBe(gc && (status === 'submitted' || status === 'in_review'));
        expect(can.comment).toBe(sub || gc);
        expect(can.pay).toBe(roles.includes('owner') && (status === 'certified' || status === 'partially_paid'));
        expect(can.issueWaiver).toBe(sub && isFrozen(status));
      }
    }
  });

  it('no admin role alone moves an application', () => {
    for (const admin of ['subcontractor_admin', 'general_contractor_admin', 'owner_admin'] as const) {
      for (const status of PAY_APP_STATUSES) expect(Object.values(payAppCan([admin], status))).not.toContain(true);
    }
  });
});

describe('change order policy', () => {
  const proposed = { status: 'proposed' as const, gcApprovedAt: null, ownerApprovedAt: null };
  const gcDone = { ...proposed, gcApprovedAt: new Date('2026-11-02T10:00:00Z') };

  it('the general contractor decides; the owner only where the project asks for its approval', () => {
    expect(changeOrderCan(['general_contractor'], proposed, false)).toEqual({
      decide: true,
      decideAs: 'gc',
      attachDocuments: true,
    });
    expect(changeOrderCan(['owner'], proposed, false)).toEqual({
      decide: false,
      decideAs: null,
      attachDocuments: false,
    });
    expect(changeOrderCan(['owner'], proposed, true)).toEqual({
      decide: true,
      decideAs: 'owner',
      attachDocuments: true,
    });
    expect(changeOrderCan(['subcontractor'], proposed, true)).toEqual({
      decide: false,
      decideAs: null,
      attachDocuments: true,
    });
  });

  it('a side that has approved decides no more; the other side still does', () => {
    expect(changeOrderCan(['general_contractor'], gcDone, true).decide).toBe(false);
    expect(changeOrderCan(['owner'], gcDone, true).decideAs).toBe('owner');
  });

  it('a decided change order takes no decision and no documents from anyone', () => {
    for (const status of ['approved', 'rejected'] as const) {
      for (const roles of ALL_ROLE_SETS) {
        expect(changeOrderCan(roles, { ...proposed, status }, true)).toEqual({
          decide: false,
          decideAs: null,
          attachDocuments: false,
        });
      }
    }
  });
});
