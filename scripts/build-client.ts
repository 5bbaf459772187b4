import { existsSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';
import { build } from 'vite';

const ROOT = path.resolve(import.meta.dirname, '..');
const DIST_INDEX = path.join(ROOT, 'dist', 'index.html');

function newestMtime(entry: string): number {
  const stat = statSync(entry);
  if (!stat.isDirectory()) return stat.mtimeMs;
  return Math.max(stat.mtimeMs, ...readdirSync(entry).map((name) => newestMtime(path.join(entry, name))));
}

/** Builds the client into dist/ when it is missing or older than its sources. */
export async function buildClientIfStale(force = false): Promise<boolean> {
  const sources = ['src', 'index.html', 'vite.config.ts', 'package-lock.json'].map((p) => path.join(ROOT, p));
  if (!force && existsSync(DIST_INDEX) && statSync(DIST_INDEX).mtimeMs >= Math.max(...sources.map(newestMtime))) return false;
  console.log('Building the client (dist/)...');
  await build({ root: ROOT, logLevel: 'warn', configFile: path.join(ROOT, 'vite.config.ts') });
  return true;
}

if (import.meta.url === `file://${process.argv[1]}`) await buildClientIfStale(process.argv.includes('--force'));
