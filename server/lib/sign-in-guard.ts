/**
 * Per-account limit on failed sign-ins, beside better-auth's per-IP rate limit (OWASP ASVS 4.0.3 2.2.1:
 * anti-automation, at most 100 failed attempts per hour on one account; soft lock-out with back-off).
 *
 * After FREE_FAILURES consecutive failures, each further attempt must wait 2^(n - FREE_FAILURES) seconds,
 * capped at MAX_BACKOFF_SECONDS; at MAX_FAILURES_PER_HOUR failures in a rolling hour the account refuses sign-in
 * until the oldest one ages out. A successful sign-in ends the back-off but not the hourly count. The state lives
 * in the process's memory (one server per data folder); a restart clears it.
 */
export const FREE_FAILURES = 5;
export const MAX_BACKOFF_SECONDS = 60;
export const MAX_FAILURES_PER_HOUR = 100;
const HOUR_MS = 60 * 60 * 1000;
const MAX_TRACKED_ACCOUNTS = 50_000;

type Entry = { failures: number[]; streak: number; lastFailure: number };

export type SignInGuard = {
  /** Seconds to wait before this account may try again, or 0. */
  retryAfter: (account: string) => number;
  recordFailure: (account: string) => void;
  recordSuccess: (account: string) => void;
};

export function createSignInGuard(now: () => number = Date.now): SignInGuard {
  const entries = new Map<string, Entry>();
  const key = (account: string) => account.trim().toLowerCase();
  const fresh = (account: string): Entry | undefined => {
    const entry = entries.get(key(account));
    if (!entry) return undefined;
    const since = now() - HOUR_MS;
    entry.failures = entry.failures.filter((t) => t > since);
    if (entry.failures.length === 0 && entry.streak === 0) entries.delete(key(account));
    return entry;
  };
  return {
    retryAfter(account) {
      const entry = fresh(account);
      if (!entry) return 0;
      const t = now();
      if (entry.failures.length >= MAX_FAILURES_PER_HOUR) {
        return Math.max(1, Math.ceil((entry.failures[0]! + HOUR_MS - t) / 1000));
      }
      if (entry.streak < FREE_FAILURES) return 0;
      const backoffMs = Math.min(2 ** (entry.streak - FREE_FAILURES), MAX_BACKOFF_SECONDS) * 1000;
      return Math.max(0, Math.ceil((entry.lastFailure + backoffMs - t) / 1000));
    },
    recordFailure(account) {
      const k = key(account);
      const entry = fresh(account) ?? { failures: [], streak: 0, lastFailure: 0 };
      if (!entries.has(k) && entries.size >= MAX_TRACKED_ACCOUNTS) entries.delete(entries.keys().next().value!);
      entry.failures.push(now());
      entry.streak += 1;
      entry.lastFailure = now();
      entries.set(k, entry);
    },
    recordSuccess(account) {
      const entry = fresh(account);
      if (entry) entry.streak = 0;
    },
  };
}
