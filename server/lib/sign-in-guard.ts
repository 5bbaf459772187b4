import { and, count, eq, gt, lt, max, min, sql } from 'drizzle-orm';
import type { Db } from '../db/client';
import { signInFailures, signInKnownAddresses } from '../db/schema';

/**
 * Limits on failed sign-ins, beside better-auth's per-IP rate limit (OWASP ASVS 4.0.3 2.2.1: anti-automation, at
 * most 100 failed attempts per hour on one account; soft lock-out with back-off), keyed so that someone who knows
 * an address cannot lock its owner out:
 *
 * - Per account and client address: after FREE_FAILURES consecutive failures from one address, each further
 *   attempt from it must wait 2^(n - FREE_FAILURES) seconds, capped at MAX_BACKOFF_SECONDS. Another address is
 *   not slowed, so the right password from a fresh address still works.
 * - Per account, all addresses together: at MAX_FAILURES_PER_HOUR failures in a rolling hour the account refuses
 *   sign-ins until the oldest one ages out, except from an address where it signed in successfully within
 *   KNOWN_ADDRESS_DAYS (its owner's usual places keep working during a spread-out guessing attack).
 *
 * A successful sign-in ends its address's back-off but not the hourly count. The counts live in the database
 * (tables sign_in_failures and sign_in_known_addresses), so every app server sharing it sees the same failures and
 * a restart forgets nothing; failures older than the hour are deleted, so a streak quiet for an hour starts over.
 */
export const FREE_FAILURES = 5;
export const MAX_BACKOFF_SECONDS = 60;
export const MAX_FAILURES_PER_HOUR = 100;
export const KNOWN_ADDRESS_DAYS = 30;
const HOUR_MS = 60 * 60 * 1000;
const KNOWN_MS = KNOWN_ADDRESS_DAYS * 24 * HOUR_MS;

export type SignInGuard = {
  /** Seconds before this account may try again from this address, or 0. */
  retryAfter: (account: string, address: string) => Promise<number>;
  recordFailure: (account: string, address: string) => Promise<void>;
  recordSuccess: (account: string, address: string) => Promise<void>;
};

export function createSignInGuard(db: Db, now: () => number = Date.now): SignInGuard {
  const acct = (account: string) => account.trim().toLowerCase();
  const lastSuccess = async (account: string, address: string): Promise<Date | null> => {
    const [row] = await db
      .select({ at: signInKnownAddresses.lastSuccessAt })
      .from(signInKnownAddresses)
      .where(and(eq(signInKnownAddresses.account, acct(account)), eq(signInKnownAddresses.address, address)));
    return row?.at ?? null;
  };
  return {
    async retryAfter(account, address) {
      const t = now();
      const [hour] = await db
        .select({ n: count(), first: min(signInFailures.failedAt) })
        .from(signInFailures)
        .where(and(eq(signInFailures.account, acct(account)), gt(signInFailures.failedAt, new Date(t - HOUR_MS))));
      const known = await lastSuccess(account, address);
      if (hour!.n >= MAX_FAILURES_PER_HOUR && !(known && known.getTime() > t - KNOWN_MS)) {
        return Math.max(1, Math.ceil((hour!.first!.getTime() + HOUR_MS - t) / 1000));
      }
      const [streak] = await db
        .select({ n: count(), last: max(signInFailures.failedAt) })
        .from(signInFailures)
        .where(
          and(
            eq(signInFailures.account, acct(account)),
            eq(signInFailures.address, address),
            known ? gt(signInFailures.failedAt, known) : undefined,
          ),
        );
      if (streak!.n < FREE_FAILURES) return 0;
      const backoffMs = Math.min(2 ** (streak!.n - FREE_FAILURES), MAX_BACKOFF_SECONDS) * 1000;
      return Math.max(0, Math.ceil((streak!.last!.getTime() + backoffMs - t) / 1000));
    },
    async recordFailure(account, address) {
      const t = now();
      await db.transaction(async (tx) => {
        await tx.insert(signInFailures).values({ account: acct(account), address, failedAt: new Date(t) });
        // Only the last hour counts; an old row of any account goes as new ones come (a flood of made-up
        // addresses cannot grow the table beyond an hour of failures, which better-auth's per-IP limit bounds).
        await tx.delete(signInFailures).where(lt(signInFailures.failedAt, new Date(t - HOUR_MS)));
      });
    },
    async recordSuccess(account, address) {
      const at = new Date(now());
      await db
        .insert(signInKnownAddresses)
        .values({ account: acct(account), address, lastSuccessAt: at })
        .onConflictDoUpdate({
          target: [signInKnownAddresses.account, signInKnownAddresses.address],
          set: { lastSuccessAt: sql`excluded.last_success_at` },
        });
    },
  };
}
