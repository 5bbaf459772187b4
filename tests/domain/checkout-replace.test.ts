import { describe, expect, it } from 'vitest';
import { mayReplaceCheckout } from '../../src/shared/policies/payments';

// Who may end an open checkout and open a new one (common practice; the times are ours): the payer's own after a
// minute, anyone else on the payer's seat after fifteen.
describe('replacing an open checkout', () => {
  const now = Date.parse('2026-12-05T12:00:00Z');
  const open = (byUser: string, minutesAgo: number) => ({
    createdByUserId: byUser,
    createdAt: new Date(now - minutesAgo * 60_000),
  });

  it('lets the payer start again after a minute, never within it (a double click)', () => {
    expect(mayReplaceCheckout(open('u1', 0.5), 'u1', now)).toBe(false);
    expect(mayReplaceCheckout(open('u1', 1), 'u1', now)).toBe(false);
    expect(mayReplaceCheckout(open('u1', 1.01), 'u1', now)).toBe(true);
  });

  it('keeps a colleague off a checkout being filled in for fifteen minutes', () => {
    expect(mayReplaceCheckout(open('u1', 2), 'u2', now)).toBe(false);
    expect(mayReplaceCheckout(open('u1', 15), 'u2', now)).toBe(false);
    expect(mayReplaceCheckout(open('u1', 15.01), 'u2', now)).toBe(true);
  });
});
