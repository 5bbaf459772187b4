import { describe, expect, it } from 'vitest';
import { newPayAppBlocker } from '../../src/shared/domain/pay-app-status';

// Issue 14 item 2: an action not possible now is shown disabled with its reason before the click. The next period
// is billed only once every earlier application is certified (the server's rule, 409 PAY_APP_OPEN, same sentence).
describe('what blocks the next pay application', () => {
  it('is nothing when every application is certified or later', () => {
    expect(newPayAppBlocker([])).toBeNull();
    expect(
      newPayAppBlocker([
        { number: 1, status: 'paid' },
        { number: 2, status: 'partially_paid' },
        { number: 3, status: 'payment_processing' },
        { number: 4, status: 'certified' },
      ]),
    ).toBeNull();
  });

  it('names the earliest application not yet certified, in words', () => {
    expect(
      newPayAppBlocker([
        { number: 4, status: 'draft' },
        { number: 3, status: 'in_review' },
        { number: 2, status: 'paid' },
      ]),
    ).toBe('Pay application 3 is still in review; it must be certified before the next period is billed.');
  });
});
