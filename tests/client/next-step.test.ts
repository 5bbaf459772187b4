import { describe, expect, it } from 'vitest';
import { changeOrderNextStep } from '@/features/change-orders/components/next-step';
import { waiverNextStep } from '@/features/lien-waivers/components/next-step';
import { nextStepSentence } from '@/features/pay-apps/components/next-step';
import { tallyNextStep } from '@/features/tallies/components/next-step';
import { PAY_APP_STATUSES, type PayAppStatus } from '@/shared/constants';
import { changeOrderCan } from '@/shared/policies/change-orders';
import { payAppCan } from '@/shared/policies/pay-apps';
import { tallyCan } from '@/shared/policies/tallies';

// Issue 14 item 2: each pay application says where it stands in a sentence, and whose step comes next.
// The sentence follows what the reader may do (`can`, from the shared policy), here for each seat.
const SUB = (status: PayAppStatus) => payAppCan(['subcontractor'], status);
const GC = (status: PayAppStatus) => payAppCan(['general_contractor'], status);
const OWNER = (status: PayAppStatus) => payAppCan(['owner'], status);

describe('the next step of a pay application', () => {
  it('has a sentence for every status and seat, never a status code', () => {
    for (const status of PAY_APP_STATUSES) {
      for (const seats of [SUB, GC, OWNER]) {
        const s = nextStepSentence(status, seats(status), 2_509_609);
        expect(s).toMatch(/^[A-Z].*\.$/);
        expect(s).not.toMatch(/_/);
      }
    }
  });

  it('tells the person whose step it is what to do, and the others whom it waits on', () => {
    expect(nextStepSentence('draft', SUB('draft'), 0)).toMatch(/submit it/);
    expect(nextStepSentence('draft', GC('draft'), 0)).toMatch(/waits on the subcontractor/);
    expect(nextStepSentence('in_review', GC('in_review'), 0)).toMatch(/Waits on your review/);
    expect(nextStepSentence('returned', SUB('returned'), 0)).toMatch(/answer each one/);
    expect(nextStepSentence('returned', OWNER('returned'), 0)).toMatch(/Waits on the subcontractor/);
    expect(nextStepSentence('certified', OWNER('certified'), 2_509_609)).toBe(
      'Certified: $25,096.09 waits on your payment. Pay it below by card or ACH.',
    );
    expect(nextStepSentence('certified', SUB('certified'), 2_509_609)).toMatch(/waits on the owner’s payment/);
  });
});

describe('the next step of a change order', () => {
  // Issue 14 item 2, on the change order page: the decision when it is the reader's, or whom it waits on.
  const base = {
    ownerApprovalRequired: true,
    gcApproval: null,
    ownerApproval: null,
    decidedAt: null,
    amountDeltaCents: 1_160_000,
  };
  const proposed = { status: 'proposed' as const, gcApprovedAt: null, ownerApprovedAt: null };

  it('asks the deciding side for its decision, naming the side and the effect on the contract sum', () => {
    const can = changeOrderCan(['general_contractor'], proposed, true);
    expect(changeOrderNextStep({ ...base, status: 'proposed', can })).toBe(
      'Waits on your decision for the general contractor: approve or reject it below (it adds $11,600.00 to the contract sum).',
    );
  });

  it('tells the others whom it waits on, and stops naming a side once it has approved', () => {
    const can = changeOrderCan(['subcontractor'], proposed, true);
    expect(changeOrderNextStep({ ...base, status: 'proposed', can })).toMatch(
      /^Proposed: waits on the general contractor and the owner to decide/,
    );
    const gcApproval = { by: { userId: 'u1', name: 'Owen Halvorsen' }, at: '2026-11-03T15:00:00Z' };
    expect(changeOrderNextStep({ ...base, gcApproval, status: 'proposed', can })).toMatch(
      /^Proposed: waits on the owner to decide/,
    );
  });

  it('says a decided change order is settled, with its date', () => {
    const can = changeOrderCan(['owner'], { ...proposed, status: 'approved' }, true);
    const decided = { ...base, decidedAt: '2026-11-04T15:00:00Z', can };
    expect(changeOrderNextStep({ ...decided, status: 'approved' })).toMatch(
      /^Approved Nov 4, 2026: part of the contract/,
    );
    expect(changeOrderNextStep({ ...decided, status: 'rejected', amountDeltaCents: -500 })).toBe(
      'Rejected Nov 4, 2026: the contract stays as it was.',
    );
  });
});

describe('the next step of a tally', () => {
  // Issue 14 item 2, on the tally page: what the reader does next, and a missing evidence file said before review.
  const draft = { status: 'draft' as const, evidenceCount: 0 };

  it('asks its author to mark a draft ready, and says a file is missing', () => {
    const can = tallyCan(['subcontractor'], { status: 'draft', payAppStatus: null });
    expect(tallyNextStep({ ...draft, can })).toBe(
      'Draft: check the quantity and its files, then mark it ready to bill. It has no evidence file yet: a line without one is flagged in review.',
    );
  });

  it('tells the other side whom a draft waits on, and that a billed tally no longer changes', () => {
    const gc = tallyCan(['general_contractor'], { status: 'draft', payAppStatus: null });
    expect(tallyNextStep({ ...draft, evidenceCount: 2, can: gc })).toBe(
      'Draft: waits on the subcontractor to mark it ready to bill.',
    );
    const billed = tallyCan(['subcontractor'], { status: 'billed', payAppStatus: 'certified' });
    expect(tallyNextStep({ status: 'billed', evidenceCount: 1, can: billed })).toMatch(/^Billed on a pay application/);
  });
});

describe('the next step of an application on the Waivers tab', () => {
  // Issue 14 item 2: the waiver due now and for how much, or whom it waits on, or why nothing is due yet.
  const conditional = {
    kind: 'conditional_progress' as const,
    allowed: true,
    code: null,
    reason: null,
    amountCents: 2_509_609,
    paymentId: null,
  };
  const unconditional = {
    kind: 'unconditional_progress' as const,
    allowed: false,
    code: 'WAIVER_PAYMENT_NOT_SETTLED' as const,
    reason: 'Offered once the payment has settled.',
    amountCents: 2_509_609,
    paymentId: null,
  };

  it('asks the subcontractor to sign what is due, and tells the others it waits on the subcontractor', () => {
    const app = { options: [conditional, unconditional] };
    expect(waiverNextStep(app, [], true)).toBe(
      'Ready for your signature: the conditional waiver on progress payment ($25,096.09). Sign it below.',
    );
    expect(waiverNextStep(app, [], false)).toBe(
      'Waits on the subcontractor to sign the conditional waiver on progress payment ($25,096.09).',
    );
  });

  it("gives the server's reason when nothing is due, and says when all is signed", () => {
    const app = { options: [{ ...conditional, allowed: false, reason: 'Already issued.' }, unconditional] };
    expect(waiverNextStep(app, [], true)).toBe('Nothing to sign yet. Already issued.');
    expect(waiverNextStep(app, [{ kind: 'conditional_progress' }], true)).toBe(
      'Nothing more to sign for this application now.',
    );
  });
});
