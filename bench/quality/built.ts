import path from 'node:path';
import { buildClientIfStale } from '../../scripts/build-client';

export const DIST = path.resolve('dist');

/** Builds what the benchmarks of the built app need when it is missing or stale (untimed). */
export async function ensureBuilt(): Promise<void> {
  await buildClientIfStale();
}
