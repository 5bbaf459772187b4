import { useEffect, useMemo, useState } from 'react';
import type { CalcMethod } from '@/shared/constants';
import { runCalc, type CalcResult } from '@/shared/domain/calc';
import { isDomainError, type DomainIssue } from '@/shared/domain/domain-error';

export type LiveOutcome<M extends CalcMethod> =
  | { result: CalcResult<M>; issues: [] }
  | { result: null; issues: DomainIssue[] };

/** zod's words for an empty number box, put the way a person would. */
function friendly(issue: DomainIssue): DomainIssue {
  const message = /received NaN|expected number/i.test(issue.message) ? 'Enter a number' : issue.message;
  return { path: issue.path, message };
}

/** Runs the shared engine (the server runs the same function); bad input comes back as issues with paths. */
export function computeCalc<M extends CalcMethod>(method: M, input: unknown): LiveOutcome<M> {
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
