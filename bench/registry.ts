import type { BenchModule } from './types';

/**
 * Benchmark modules, loaded lazily. To add benchmarks (API round trips, client bundle size...), write a module
 * exporting `benchmarks` (BenchEntry items timed against a baseline, or SelfMeasuredBench items that return their
 * own result) and add it here. Each benchmark runs in its own child process.
 */
export const benchModules: (() => Promise<BenchModule>)[] = [() => import('./engine')];
