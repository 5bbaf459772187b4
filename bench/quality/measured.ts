import type { BenchResult } from '../types';

/**
 * A benchmark that measures itself (a server under load, a browser, a bundle on disk) and reports in the same
 * JSON line as the engine's entries. Absolute budgets are written as a ratio to the budget: ratio = measured /
 * limit, ok when ratio <= 1; `baseline` states the limit and the measured figure in words.
 */
export interface MeasuredBench {
  name: string;
  measure(): Promise<BenchResult>;
}

export function withinLimit(name: string, measuredSeconds: number, limitSeconds: number, text: string): BenchResult {
  const ratio = measuredSeconds / limitSeconds;
  return {
    name,
    seconds: Number(measuredSeconds.toPrecision(4)),
    baseline: text,
    baselineSeconds: limitSeconds,
    ratio: Math.round(ratio * 100) / 100,
    budget: 1,
    ok: ratio <= 1,
    peakMemoryMB: Math.round(process.resourceUsage().maxRSS / 1024),
  };
}
