/**
 * One benchmark: a setup that builds its input once, the code under test, and a baseline measured in the same
 * process on the same input. `ok` when seconds / baselineSeconds <= budget and peak memory stays under its budget.
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

export interface BenchResult {
  name: string;
  seconds: number;
  baseline: string;
  baselineSeconds: number;
  ratio: number;
  budget: number;
  ok: boolean;
  peakMemoryMB: number;
}

/**
 * A benchmark that measures itself (a server under load, a bundle on disk) and returns its own result line, for
 * budgets that are not a ratio to a baseline run here.
 */
export interface SelfMeasuredBench {
  name: string;
  measure(): Promise<BenchResult>;
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

/** Keeps a result alive so the optimiser cannot drop the work. */
export let benchSink: unknown = null;
export function keep(value: unknown): void {
  benchSink = value;
}
