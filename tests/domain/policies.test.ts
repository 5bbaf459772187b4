import { describe, expect, it } from 'vitest';
import { ACCESS_ROLES, PAY_APP_STATUSES, TALLY_STATUSES, type AccessRole } from '../../src/shared/constants';
import { isFrozen } from '../../src/shared/domain/pay-app-status';
import { changeOrderCan } from '../../src/shared/policies/change-orders';
import { payAppCan } from '../../src/shared/policies/pay-apps';
import { canKeepFieldRecords, signingSides } from '../../src/shared/policies/field-records';
import { changeOrderWaits, payAppStep, paymentDue, paymentDueAt } from '../../src/shared/policies/inbox';
import { canManageContract, managedSeat, personCan, projectCan } from '../../src/shared/policies/projects';
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
        setMeasurementProfile: roles.includes('general_contractor') || roles.includes('general_contractor_admin'),
        keepFieldRecords: roles.includes('subcontractor') || roles.includes('general_contractor'),
        signDailySheet: roles.includes('subcontractor') || roles.includes('general_contractor'),
        recordAdjustment: roles.includes('general_contractor') || roles.includes('general_contractor_admin'),
        managePeople: roles.some((r) => r.endsWith('_admin')),
      });
      expect(projectCan(roles).manageContract).toBe(canManageContract(roles));
    }
  });

  it("an admin manages its own company's seat only; a seat holder manages none", () => {
    expect(managedSeat(['subcontractor', 'subcontractor_admin'])).toBe('subcontractor');
    expect(managedSeat(['general_contractor_admin'])).toBe('general_contractor');
    expect(managedSeat(['owner_admin'])).toBe('owner');
    expect(managedSeat(['owner', 'general_contractor'])).toBeNull();
  });

  it("only a general contractor's people set up a job", () => {
    expect(personCan({ companyKind: 'general_contractor' })).toEqual({ createProject: true });
    for (const kind of ['subcontractor', 'owner', null] as const) {
      expect(personCan({ companyKind: kind })).toEqual({ createProject: false });
    }
  });
});

describe('field records policy', () => {
  it('each contractor signs its own side of a daily sheet; the owner and the admins sign none', () => {
    expect(signingSides(['subcontractor'])).toEqual(['contractor']);
    expect(signingSides(['general_contractor'])).toEqual(['gc']);
    expect(signingSides(['subcontractor', 'general_contractor'])).toEqual(['contractor', 'gc']);
    for (const roles of [
      ['owner'],
      ['owner_admin'],
      ['subcontractor_admin'],
      ['general_contractor_admin'],
    ] as AccessRole[][]) {
      expect(signingSides(roles)).toEqual([]);
      expect(canKeepFieldRecords(roles)).toBe(false);
    }
  });
});

describe('inbox policy', () => {
  it("the subcontractor's next move on a draft is to submit; the reviewer's on a submitted one is to review", () => {
    expect(payAppStep('draft', ['subcontractor'], 0)).toBe('pay_app_submit');
    expect(payAppStep('draft', ['general_contractor'], 0)).toBeNull();
    expect(payAppStep('submitted', ['general_contractor'], 0)).toBe('pay_app_review');
    expect(payAppStep('in_review', ['general_contractor'], 0)).toBe('pay_app_certify');
  });

  it('a returned application with open disputes asks for answers before the revision', () => {
    expect(payAppStep('returned', ['subcontractor'], 0)).toBe('pay_app_revise');
    expect(payAppStep('returned', ['subcontractor'], 2)).toBe('pay_app_answer');
  });

  it('payment falls due the terms after certification; only the payer is asked, once per open attempt', () => {
    const certified = new Date('2026-03-02T00:00:00Z');
    expect(paymentDueAt(certified, 30).toISOString()).toBe('2026-04-01T00:00:00.000Z');
    const app = { status: 'certified' as const, currentDueCents: 100_00, paidCents: 0 };
    expect(paymentDue(app, ['owner'], [])).toBe(true);
    expect(paymentDue(app, ['general_contractor'], [])).toBe(false);
    expect(paymentDue(app, ['owner'], [{ status: 'processing', amountCents: 100_00 }])).toBe(false);
    expect(paymentDue({ ...app, paidCents: 100_00 }, ['owner'], [])).toBe(false);
  });

  it('a change order waits on each deciding side that has not approved', () => {
    const open = { gcApprovedAt: null, ownerApprovedAt: null };
    expect(changeOrderWaits(open, ['general_contractor'], true)).toBe(true);
    expect(changeOrderWaits({ ...open, gcApprovedAt: new Date() }, ['general_contractor'], true)).toBe(false);
    expect(changeOrderWaits(open, ['subcontractor'], true)).toBe(false);
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
