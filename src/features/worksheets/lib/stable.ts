import { useEffect, useMemo } from 'react';

/**
 * The value as plain JSON, with a new identity only when its content changes (form watchers hand out a new
 * object on every render). NaN comes back as null, which the shared schemas report as "expected number".
 */
export function useJsonValue<T>(value: T): T {
  const key = JSON.stringify(value);
  return useMemo(() => JSON.parse(key) as T, [key]);
}

/** Tells the screen the inputs and the engine's result when they give one, and nulls while they do not. */
export function useReportInputs(input: unknown, result: unknown, onInputs: ReportInputs) {
  useEffect(() => {
    onInputs(result ? (input as Record<string, unknown>) : null, result ? (result as Record<string, unknown>) : null);
  }, [input, result, onInputs]);
}

export type ReportInputs = (inputs: Record<string, unknown> | null, result: Record<string, unknown> | null) => void;
