import { useEffect, useMemo, useState } from 'react';
import type { CalcMethod, LengthUnit } from '@/shared/constants';
import { formatStation } from '@/shared/domain/earthwork/units';
import { formatNumber } from '@/shared/format';
import { runCalc, type CalcResult } from '@/shared/domain/calc';
import { isDomainError, type DomainIssue } from '@/shared/domain/domain-error';

export type LiveOutcome<M extends CalcMethod> =
  { result: CalcResult<M>; issues: [] } | { result: null; issues: DomainIssue[] };

/** zod's words put the way a person would: an empty box, text that is not a number, a number too large. */
export function friendly(issue: DomainIssue): DomainIssue {
  const m = issue.message;
  if (/expected number, received string/i.test(m)) return { path: issue.path, message: 'Not a number' };
  const big = /too big: expected number to be <=?\s*([\d.e+]+)/i.exec(m);
  if (big) return { path: issue.path, message: `Must be at most ${formatNumber(Number(big[1]), 0)}` };
  const small = /too small: expected number to be >=?\s*(-?[\d.e+]+)/i.exec(m);
  if (small) return { path: issue.path, message: `Must be at least ${formatNumber(Number(small[1]), 0)}` };
  if (/received (NaN|null|undefined)|expected number/i.test(m)) return { path: issue.path, message: 'Enter a number' };
  return issue;
}

/** Stations typed twice, named by station and rows (row numbers from 1), before the engine's "must increase". */
function duplicateStations(method: CalcMethod, input: unknown): DomainIssue[] {
  if (method !== 'end-area' && method !== 'mass-haul') return [];
  const body = input as { unit?: LengthUnit; stations?: { station?: unknown }[] } | null;
  const seen = new Map<number, number>();
  const issues: DomainIssue[] = [];
  (body?.stations ?? []).forEach((row, i) => {
    if (typeof row?.station !== 'number' || !Number.isFinite(row.station)) return;
    const first = seen.get(row.station);
    if (first === undefined) seen.set(row.station, i);
    else
      issues.push({
        path: `stations.${i}.station`,
        message: `Station ${formatStation(row.station, body?.unit ?? 'ft')} appears twice, in rows ${first + 1} and ${i + 1}`,
      });
  });
  return issues;
}

/** Runs the shared engine (the server runs the same function); bad input comes back as issues with paths. */
export function computeCalc<M extends CalcMethod>(method: M, input: unknown): LiveOutcome<M> {
  const twice = duplicateStations(method, input);
  if (twice.length) return { result: null, issues: twice };
  try {
    return { result: runCalc(method, input), issues: [] };
  } catch (error) {
    if (isDomainError(error)) return { result: null, issues: error.issues.map(friendly) };
    return { result: null, issues: [{ path: '', message: error instanceof Error ? error.message : String(error) }] };
  }
}

/** The value, held back until it has stopped changing for `ms` (0: at once). */
export function useDebounced<T>(value: T, ms: number): T {
  const [held, setHeld] = useState(value);
  useEffect(() => {
    if (ms <= 0) return;
    const timer = setTimeout(() => setHeld(value), ms);
    return () => clearTimeout(timer);
  }, [value, ms]);
  return ms <= 0 ? value : held;
}

/** The live result as the inputs change: the same pure function the server uses, debounced for heavy ones. */
export function useLiveCalc<M extends CalcMethod>(method: M, input: unknown, delayMs = 0): LiveOutcome<M> {
  const debounced = useDebounced(input, delayMs);
  return useMemo(() => computeCalc(method, debounced), [method, debounced]);
}

/** The issue at a field path (`runs.0.depth`), if any. */
export function issueAt(issues: readonly DomainIssue[], path: string): string | undefined {
  return issues.find((i) => i.path === path)?.message;
}

/** Issues not shown beside a field: those whose path is not one of `shown` (or its prefix). */
export function otherIssues(issues: readonly DomainIssue[], shown: (path: string) => boolean): DomainIssue[] {
  return issues.filter((i) => !shown(i.path));
}
