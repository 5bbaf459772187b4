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
 * A successful sign-in ends its address's back-off but not the hourly count. The state lives in the process's
 * memory (one server per data folder); a restart clears it.
 */
export const FREE_FAILURES = 5;
export const MAX_BACKOFF_SECONDS = 60;
export const MAX_FAILURES_PER_HOUR = 100;
export const KNOWN_ADDRESS_DAYS = 30;
const HOUR_MS = 60 * 60 * 1000;
const KNOWN_MS = KNOWN_ADDRESS_DAYS * 24 * HOUR_MS;
const MAX_TRACKED = 50_000;

type Streak = { streak: number; lastFailure: number };

export type SignInGuard = {
  /** Seconds before this account may try again from this address, or 0. */
  retryAfter: (account: string, address: string) => number;
  recordFailure: (account: string, address: string) => void;
  recordSuccess: (account: string, address: string) => void;
};

/** A Map that forgets its oldest entry past MAX_TRACKED (a flood of made-up addresses cannot grow memory). */
function bounded<V>() {
  const map = new Map<string, V>();
  return {
    get: (k: string) => map.get(k),
    delete: (k: string) => map.delete(k),
    set(k: string, v: V) {
      map.delete(k);
      map.set(k, v);
      if (map.size > MAX_TRACKED) map.delete(map.keys().next().value!);
    },
  };
}

export function createSignInGuard(now: () => number = Date.now): SignInGuard {
  const streaks = bounded<Streak>();
  const hourly = bounded<number[]>();
  const known = bounded<Map<string, number>>();
  const acct = (account: string) => account.trim().toLowerCase();
  const pair = (account: string, address: string) => `${acct(account)}\n${address}`;
  const failuresThisHour = (account: string): number[] => {
    const since = now() - HOUR_MS;
    const list = (hourly.get(acct(account)) ?? []).filter((t) => t > since);
    if (list.length === 0) hourly.delete(acct(account));
    return list;
  };
  const isKnown = (account: string, address: string) => {
    const at = known.get(acct(account))?.get(address);
    return at !== undefined && at > now() - KNOWN_MS;
  };
  return {
    retryAfter(account, address) {
      const t = now();
      const failures = failuresThisHour(account);
      if (failures.length >= MAX_FAILURES_PER_HOUR && !isKnown(account, address)) {
        return Math.max(1, Math.ceil((failures[0]! + HOUR_MS - t) / 1000));
      }
      const entry = streaks.get(pair(account, address));
      if (!entry || entry.streak < FREE_FAILURES) return 0;
      const backoffMs = Math.min(2 ** (entry.streak - FREE_FAILURES), MAX_BACKOFF_SECONDS) * 1000;
      return Math.max(0, Math.ceil((entry.lastFailure + backoffMs - t) / 1000));
    },
    recordFailure(account, address) {
      const t = now();
      const failures = failuresThisHour(account);
      failures.push(t);
      hourly.set(acct(account), failures);
      const entry = streaks.get(pair(account, address)) ?? { streak: 0, lastFailure: 0 };
      streaks.set(pair(account, address), { streak: entry.streak + 1, lastFailure: t });
    },
    recordSuccess(account, address) {
      streaks.delete(pair(account, address));
      const addresses = known.get(acct(account)) ?? new Map<string, number>();
      addresses.delete(address);
      addresses.set(address, now());
      if (addresses.size > 20) addresses.delete(addresses.keys().next().value!);
      known.set(acct(account), addresses);
    },
  };
}
