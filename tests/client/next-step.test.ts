import { describe, expect, it } from 'vitest';
import { nextStepSentence } from '@/features/pay-apps/components/next-step';
import { PAY_APP_STATUSES, type PayAppStatus } from '@/shared/constants';
import { payAppCan } from '@/shared/policies/pay-apps';

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
