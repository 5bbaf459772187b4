import { fork } from 'node:child_process';
import { loadavg } from 'node:os';
import { fileURLToPath } from 'node:url';
import { benchModules } from './registry';
import type { AnyBench, BenchCheck, BenchEntry, BenchResult } from './types';
import { check, keep } from './types';

/**
 * npm run bench [-- --json] [-- --only NAME] [-- --list]
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

const peakMB = (sampled = 0) => Math.round(Math.max(sampled / 2 ** 20, process.resourceUsage().maxRSS / 1024));

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
  const peakMemoryMB = peakMB(sampled);
  const checks: BenchCheck[] = [check('time / baseline', seconds / baselineSeconds, 'x', '<=', entry.budget)];
  if (entry.memoryBudgetMB !== undefined) checks.push(check('peak memory', peakMemoryMB, 'MB', '<=', entry.memoryBudgetMB));
  return result(entry.name, checks, entry.baseline, { seconds: round(seconds), baselineSeconds: round(baselineSeconds) }, peakMemoryMB);
}

function result(name: string, checks: BenchCheck[], baseline: string, figures: Record<string, number>, peakMemoryMB: number): BenchResult {
  return { name, ok: checks.every((c) => c.ok), checks, baseline, figures, peakMemoryMB, loadAverage: Math.round(loadavg()[0]! * 100) / 100 };
}

function round(s: number): number {
  return Number(s.toPrecision(4));
}

function runChild(name: string): Promise<BenchResult> {
  return new Promise((resolve, reject) => {
    // No --expose-gc: a forced full collection between runs threw away optimised code and slowed the next run
    // twentyfold, so memory is what the process really holds at its peak.
    const proc = fork(fileURLToPath(import.meta.url), ['--child', name], { stdio: ['ignore', 'inherit', 'inherit', 'ipc'] });
    let outcome: BenchResult | undefined;
    proc.on('message', (m) => (outcome = m as BenchResult));
    proc.on('error', reject);
    proc.on('exit', (code) => (outcome ? resolve(outcome) : reject(new Error(`benchmark ${name} exited with ${code}`))));
  });
}

const describe = (c: BenchCheck) => `${c.figure} ${c.value} ${c.unit} (budget ${c.op} ${c.budget} ${c.unit})`;

function print(r: BenchResult): void {
  if (json) {
    console.log(JSON.stringify(r));
    return;
  }
  const figures = Object.entries(r.figures).map(([k, v]) => `${k} ${v}`).join(', ');
  console.log(`${r.ok ? 'ok  ' : 'MISS'} ${r.name.padEnd(28)} ${r.checks.map(describe).join('; ')}`);
  console.log(`     ${''.padEnd(28)} ${figures}; ${r.baseline}; peak ${r.peakMemoryMB} MB; load ${r.loadAverage}`);
}

async function main(): Promise<void> {
  const entries = await allEntries();
  if (child) {
    const entry = entries.find((e) => e.name === child);
    if (!entry) throw new Error(`no benchmark ${child}`);
    let r: BenchResult;
    if ('measure' in entry) {
      const m = await entry.measure();
      r = result(entry.name, m.checks, m.baseline, m.figures, peakMB());
    } else {
      r = await measure(entry);
    }
    // Exit once the line is sent: a handle a benchmark left open (a socket, a timer) must not keep it alive.
    process.send!(r, () => process.exit(0));
    return;
  }
  if (args.includes('--list')) {
    for (const e of entries) console.log(e.name);
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
