import { describe, expect, it } from 'vitest';
import { approveRemaining, reviewBody, type ReviewDraft } from '@/features/pay-apps/components/review-draft';

// Common practice: a reviewer who disputes one line and approves the rest in one step keeps the dispute.
describe('approving the undecided lines of a review', () => {
  const lines = [
    { id: 'a', reviewStatus: 'pending' },
    { id: 'b', reviewStatus: 'pending' },
    { id: 'c', reviewStatus: 'approved' },
    { id: 'd', reviewStatus: 'disputed' },
  ];

  it('keeps a dispute being written and approves only the lines with no verdict, not the ones already approved', () => {
    const draft: ReviewDraft = { b: { decision: 'dispute', reason: 'Short on the north side', counter: '120' } };
    const next = approveRemaining(draft, lines);
    expect(next).toEqual({
      a: { decision: 'approve', reason: '', counter: '' },
      b: { decision: 'dispute', reason: 'Short on the north side', counter: '120' },
      d: { decision: 'approve', reason: '', counter: '' },
    });
    expect(reviewBody(next, (id) => id.toUpperCase()).problems).toEqual([]);
  });

  it('changes nothing when every line has a verdict', () => {
    const all = approveRemaining({}, lines);
    expect(approveRemaining(all, lines)).toEqual(all);
  });
});
