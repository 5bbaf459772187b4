import { createHash, randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, realpathSync, rmSync, writeFileSync } from 'node:fs';
import { connect, createServer, type Server } from 'node:net';
import path from 'node:path';

export type DataDirLayout = { root: string; db: string; uploads: string };

export function dataDirLayout(dataDir: string): DataDirLayout {
  const root = path.resolve(dataDir);
  return { root, db: path.join(root, 'db'), uploads: path.join(root, 'uploads') };
}

const LOCK_SOCKET = 'tallyard.lock.sock';

function listenOn(address: string): Promise<Server> {
  return new Promise((resolve, reject) => {
    const server = createServer((socket) => socket.destroy());
    server.once('error', reject);
    server.listen(address, () => {
      server.off('error', reject);
      server.unref(); // the lock never keeps the process alive
      resolve(server);
    });
  });
}

/** Whether a process answers on this socket file (a file left by a killed process refuses the connection). */
function answers(file: string): Promise<boolean> {
  return new Promise((resolve) => {
    const socket = connect(file);
    socket.once('connect', () => {
      socket.destroy();
      resolve(true);
    });
    socket.once('error', () => resolve(false));
  });
}

/**
 * The lock: a Unix socket bound exclusively for this data folder. On Linux it lives in the abstract namespace, named
 * by a hash of the folder's real path: the kernel holds it for the life of the process and frees it the moment the
 * process ends, however it ends, and nothing is left on disk. Elsewhere it is a socket file in the folder: one
 * left behind by a killed process refuses connections and is replaced.
 */
async function bindLock(root: string): Promise<Server> {
  if (process.platform === 'linux') {
    const id = createHash('sha256').update(realpathSync(root)).digest('hex').slice(0, 40);
    return listenOn(`\0tallyard-data-${id}`);
  }
  const file = path.join(root, LOCK_SOCKET);
  try {
    return await listenOn(file);
  } catch (err) {
    if ((err as { code?: string }).code !== 'EADDRINUSE' || (await answers(file))) throw err;
    rmSync(file, { force: true });
    return listenOn(file);
  }
}

/**
 * Holds an exclusive lock on the data folder for the life of the process. PGlite has no lock of its own, and a
 * second process on the same folder would silently lose committed rows, so a second server refuses to start. The
 * operating system holds the lock (bindLock): a server whose event loop is busy for minutes keeps it, and a killed
 * one frees it at once. With DATABASE_URL the app takes no lock (the database server is shared by design).
 */
export async function lockDataDir(layout: DataDirLayout): Promise<() => Promise<void>> {
  mkdirSync(layout.root, { recursive: true });
  let server: Server;
  try {
    server = await bindLock(layout.root);
  } catch (err) {
    if ((err as { code?: string }).code === 'EADDRINUSE') {
      throw new Error(
        `Another Tallyard process is using the data folder ${layout.root}. Stop it first, or start this one with a ` +
          'different DATA_DIR. (Two processes on one embedded database would lose data.)',
        { cause: err },
      );
    }
    throw err;
  }
  let released = false;
  return async () => {
    if (released) return;
    released = true;
    await new Promise<void>((resolve) => server.close(() => resolve()));
  };
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
