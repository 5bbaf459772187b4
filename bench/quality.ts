/**
 * npm run bench:quality [-- --json] [-- --only NAME]: the measured budgets of the API, the client and the server
 * (bench/quality/). Prints the same JSON line as bench/run.ts; exits 1 when a budget is missed.
 */
import type { BenchResult } from './types';
import { qualityBenches } from './quality/index';

const args = process.argv.slice(2);
const json = args.includes('--json');
const only = args.includes('--only') ? args[args.indexOf('--only') + 1] : undefined;

function print(r: BenchResult): void {
  if (json) return void console.log(JSON.stringify(r));
  console.log(`${r.ok ? 'ok  ' : 'MISS'} ${r.name.padEnd(28)} ${String(r.seconds).padStart(9)}   ${r.baseline}   ratio ${r.ratio} / budget ${r.budget}   peak ${r.peakMemoryMB} MB`);
}

async function main(): Promise<void> {
  const chosen = only ? qualityBenches.filter((b) => b.name === only) : qualityBenches;
  if (chosen.length === 0) {
    console.error(`No benchmark named ${only}. Known: ${qualityBenches.map((b) => b.name).join(', ')}`);
    process.exit(2);
  }
  let failed = false;
  for (const bench of chosen) {
    const r = await bench.measure();
    print(r);
    failed ||= !r.ok;
  }
  process.exit(failed ? 1 : 0);
}

main().catch((e: unknown) => {
  console.error(e);
  process.exit(2);
});
