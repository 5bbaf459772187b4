import type { BenchModule } from './types';

/**
 * Benchmark modules, loaded lazily. A module exports `benchmarks`: BenchEntry items timed against a baseline, or
 * SelfMeasuredBench items that measure themselves against absolute budgets. Each benchmark runs in its own child
 * process, in this order.
 */
export const benchModules: (() => Promise<BenchModule>)[] = [
  () => import('./engine'),
  () => import('./landxml'),
  () => import('./quality/index'),
];
