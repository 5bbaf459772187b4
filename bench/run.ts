import { fork } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { benchModules } from './registry';
import type { AnyBench, BenchEntry, BenchResult } from './types';
import { keep } from './types';

/**
 * npm run bench [-- --json] [-- --only NAME]
 * Each benchmark runs in its own child process so its peak memory (the process's max resident set, also sampled
 * with process.memoryUsage between runs) is its own. Exits 1 when any budget is missed.
 */
const args = process.argv.slice(2);
const json = args.includes('--json');
const only = args.includes('--only') ? args[args.indexOf('--only') + 1] : undefined;
const child = args.includes('--child') ? args[args.indexOf('--child') + 1] : undefined;

async function allEntries(): Promise<AnyBench[]> {
  const modules = await Promise.all(benchModules.map((load) => load()));
  return modules.flatMap((m) => m.benchmarks);
}

function time(fn: () => unknown): number {
  const start = performance.now();
  keep(fn());
  return (performance.now() - start) / 1000;
}

async function measure(entry: BenchEntry<unknown>): Promise<BenchResult> {
  let sampled = 0;
  const sample = () => (sampled = Math.max(sampled, process.memoryUsage().rss));
  const ctx = await entry.setup();
  sample();
  for (let i = 0; i < (entry.warmups ?? 1); i++) {
    keep(entry.runBaseline(ctx));
    keep(entry.run(ctx));
  }
  sample();
  let seconds = Infinity;
  let baselineSeconds = Infinity;
  // Alternate the two sides so a slow spell on a shared machine hits both; keep the fastest of each.
  for (let i = 0; i < entry.repeats; i++) {
    baselineSeconds = Math.min(baselineSeconds, time(() => entry.runBaseline(ctx)));
    sample();
    seconds = Math.min(seconds, time(() => entry.run(ctx)));
    sample();
  }
  const peakMemoryMB = Math.max(sampled / 2 ** 20, process.resourceUsage().maxRSS / 1024);
  const ratio = seconds / baselineSeconds;
  const memoryOk = entry.memoryBudgetMB === undefined || peakMemoryMB <= entry.memoryBudgetMB;
  return {
    name: entry.name,
    seconds: round(seconds),
    baseline: entry.baseline,
    baselineSeconds: round(baselineSeconds),
    ratio: Math.round(ratio * 100) / 100,
    budget: entry.budget,
    ok: ratio <= entry.budget && memoryOk,
    peakMemoryMB: Math.round(peakMemoryMB),
  };
}

function round(s: number): number {
  return Number(s.toPrecision(4));
}

function runChild(name: string): Promise<BenchResult> {
  return new Promise((resolve, reject) => {
    // No --expose-gc: a forced full collection between runs threw away optimised code and slowed the next run
    // twentyfold, so memory is what the process really holds at its peak.
    const proc = fork(fileURLToPath(import.meta.url), ['--child', name], { stdio: ['ignore', 'inherit', 'inherit', 'ipc'] });
    let result: BenchResult | undefined;
    proc.on('message', (m) => (result = m as BenchResult));
    proc.on('error', reject);
    proc.on('exit', (code) => (result ? resolve(result) : reject(new Error(`benchmark ${name} exited with ${code}`))));
  });
}

function print(r: BenchResult): void {
  if (json) {
    console.log(JSON.stringify(r));
    return;
  }
  const flag = r.ok ? 'ok  ' : 'MISS';
  console.log(
    `${flag} ${r.name.padEnd(28)} ${r.seconds.toFixed(4).padStart(9)} s   baseline ${r.baselineSeconds.toFixed(4).padStart(9)} s (${r.baseline})   ratio ${r.ratio.toFixed(2)} / budget ${r.budget}   peak ${r.peakMemoryMB} MB`,
  );
}

async function main(): Promise<void> {
  const entries = await allEntries();
  if (child) {
    const entry = entries.find((e) => e.name === child);
    if (!entry) throw new Error(`no benchmark ${child}`);
    process.send!('measure' in entry ? await entry.measure() : await measure(entry));
    return;
  }
  const chosen = only ? entries.filter((e) => e.name === only) : entries;
  if (chosen.length === 0) {
    console.error(`No benchmark named ${only}. Known: ${entries.map((e) => e.name).join(', ')}`);
    process.exit(2);
  }
  let failed = false;
  for (const entry of chosen) {
    const r = await runChild(entry.name);
    print(r);
    failed ||= !r.ok;
  }
  process.exitCode = failed ? 1 : 0;
}

main().catch((e: unknown) => {
  console.error(e);
  process.exit(2);
});
