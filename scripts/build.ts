// `npm run build`: the client into dist/ and the server into dist-server/ (`--force` rebuilds both even when fresh).
import { buildClientIfStale } from './build-client';
import { buildServerIfStale } from './build-server';

/** Builds whichever of the client and the server is missing or older than its sources. */
export async function buildIfStale(force = false): Promise<void> {
  await buildClientIfStale(force);
  await buildServerIfStale(force);
}

if (import.meta.url === `file://${process.argv[1]}`) await buildIfStale(process.argv.includes('--force'));
