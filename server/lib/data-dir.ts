import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import lockfile from 'proper-lockfile';

export type DataDirLayout = { root: string; db: string; uploads: string };

export function dataDirLayout(dataDir: string): DataDirLayout {
  const root = path.resolve(dataDir);
  return { root, db: path.join(root, 'db'), uploads: path.join(root, 'uploads') };
}

/**
 * Holds an exclusive lock on the data folder for the life of the process. PGlite has no lock of its own, and a
 * second process on the same folder would silently lose committed rows, so a second server refuses to start.
 * A lock left by a killed process goes stale after a few seconds and is taken over.
 */
export async function lockDataDir(layout: DataDirLayout): Promise<() => Promise<void>> {
  mkdirSync(layout.root, { recursive: true });
  try {
    return await lockfile.lock(layout.root, {
      lockfilePath: path.join(layout.root, 'tallyard.lock'),
      stale: 4000,
      update: 1000,
      retries: { retries: 6, minTimeout: 1000, maxTimeout: 1000, factor: 1 },
      realpath: false,
    });
  } catch (err) {
    if ((err as { code?: string }).code === 'ELOCKED') {
      throw new Error(
        `Another Tallyard process is using the data folder ${layout.root}. Stop it first, or start this one with a ` +
          'different DATA_DIR. (Two processes on one embedded database would lose data.)',
        { cause: err },
      );
    }
    throw err;
  }
}

/** The auth secret from the environment, or one generated on first start and kept in the data folder. */
export function authSecret(layout: DataDirLayout, fromEnv: string | undefined): string {
  if (fromEnv) return fromEnv;
  const file = path.join(layout.root, 'auth-secret');
  if (existsSync(file)) return readFileSync(file, 'utf8').trim();
  mkdirSync(layout.root, { recursive: true });
  const secret = randomBytes(32).toString('hex');
  writeFileSync(file, `${secret}\n`, { mode: 0o600 });
  return secret;
}
