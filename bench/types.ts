/**
 * One benchmark timed against a baseline: a setup that builds its input once, the code under test, and a baseline
 * measured in the same process on the same input. It passes when seconds / baselineSeconds <= budget and peak
 * memory stays under its budget.
 */
export interface BenchEntry<Ctx = unknown> {
  name: string;
  /** What the baseline is, printed beside the time. */
  baseline: string;
  /** Largest allowed ratio of the code's time to the baseline's. */
  budget: number;
  /** Largest allowed peak resident memory of the benchmark's process, MB. */
  memoryBudgetMB?: number;
  /** Timed runs of each side (the fastest counts). */
  repeats: number;
  /** Untimed runs of each side first (default 1): lets the JIT and the young heap settle. */
  warmups?: number;
  setup(): Ctx | Promise<Ctx>;
  run(ctx: Ctx): unknown;
  runBaseline(ctx: Ctx): unknown;
}

/** One figure held against its budget: `value op budget` must hold (`ratio 1.2 <= 2`, `p99 31 < 50 ms`). */
export interface BenchCheck {
  figure: string;
  value: number;
  unit: string;
  op: '<=' | '<' | '>=';
  budget: number;
  ok: boolean;
}

/** The line every benchmark prints (one JSON object a line under --json): the same fields for all. */
export interface BenchResult {
  name: string;
  /** Every check passed. */
  ok: boolean;
  checks: BenchCheck[];
  /** What the figures were measured against, in words. */
  baseline: string;
  /** The raw measurements behind the checks (seconds, requests per second, bytes...), by name. */
  figures: Record<string, number>;
  /** Peak resident memory of the benchmark's process, MB. */
  peakMemoryMB: number;
  /** The machine's 1-minute load average when the benchmark ended: figures from a loaded machine read low. */
  loadAverage: number;
}

/**
 * A benchmark that measures itself (a server under load, a browser, a bundle on disk) against absolute budgets,
 * and returns its checks; the runner adds memory and load.
 */
export interface SelfMeasuredBench {
  name: string;
  measure(): Promise<{ checks: BenchCheck[]; baseline: string; figures: Record<string, number> }>;
}

export type AnyBench = BenchEntry<unknown> | SelfMeasuredBench;

/** A module of benchmarks: bench/registry.ts lists them. */
export interface BenchModule {
  benchmarks: readonly AnyBench[];
}

/** Types an entry against its own context, then lets it sit in a list with entries of other contexts. */
export function defineBench<Ctx>(entry: BenchEntry<Ctx>): BenchEntry<unknown> {
  return entry as unknown as BenchEntry<unknown>;
}

/** A figure against its budget. */
export function check(figure: string, value: number, unit: string, op: BenchCheck['op'], budget: number): BenchCheck {
  const ok = op === '<=' ? value <= budget : op === '<' ? value < budget : value >= budget;
  return { figure, value: Number(value.toPrecision(4)), unit, op, budget, ok };
}

/** Keeps a result alive so the optimiser cannot drop the work. */
export let benchSink: unknown = null;
export function keep(value: unknown): void {
  benchSink = value;
}
