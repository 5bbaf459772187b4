import { spawn } from 'node:child_process';
import { mkdtempSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { dataDirLayout, lockDataDir } from '../../server/lib/data-dir';
import { freePort } from '../setup/server-process';

const parent = mkdtempSync(path.join(tmpdir(), 'tallyard-lock-'));
afterAll(() => rmSync(parent, { recursive: true, force: true }));
let folders = 0;
const freshDir = () => path.join(parent, `data-${++folders}`);

function startServer(dataDir: string, port: number, env: Record<string, string> = {}) {
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    env: {
      ...process.env,
      DATA_DIR: dataDir,
      PORT: String(port),
      HOST: '127.0.0.1',
      SEED_DEMO: 'never',
      LOG_LEVEL: 'info',
      NODE_ENV: 'test',
      ...env,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  child.stdout.on('data', (d) => (output += d));
  child.stderr.on('data', (d) => (output += d));
  const exited = new Promise<number | null>((resolve) => child.on('exit', resolve));
  const waitFor = (text: string) =>
    new Promise<void>((resolve, reject) => {
      const check = () => output.includes(text) && resolve();
      check();
      child.stdout.on('data', check);
      void exited.then((code) => reject(new Error(`exited ${code}: ${output}`)));
    });
  const listening = waitFor('listening');
  listening.catch(() => {}); // only awaited for the server expected to start
  return { child, exited, listening, waitFor, output: () => output };
}

describe('the data folder lock (held by the operating system)', () => {
  it('makes a second server on the same DATA_DIR refuse to start with a clear message', async () => {
    const dataDir = freshDir();
    const first = startServer(dataDir, 0);
    await first.listening;
    const second = startServer(dataDir, 0);
    const code = await second.exited;
    expect(code).toBe(1);
    expect(second.output()).toMatch(/Another Tallyard process is using the data folder/);
    first.child.kill('SIGTERM');
    expect(await first.exited).toBe(0);
  }, 60_000);

  it('is kept by a server whose event loop is held (a long computation): a second server still refuses', async () => {
    // proper-lockfile's lock went stale 4 s after its last refresh; this server is held until the second has given up.
    const dataDir = freshDir();
    const blockFile = path.join(parent, `block-${folders}`);
    const port = await freePort();
    const first = startServer(dataDir, port, { TALLYARD_TEST_BLOCK_FILE: blockFile });
    await first.listening;
    writeFileSync(blockFile, '');
    first.child.kill('SIGUSR2');
    await first.waitFor('event loop blocked');
    const second = startServer(dataDir, 0);
    expect(await second.exited).toBe(1);
    expect(second.output()).toMatch(/Another Tallyard process is using the data folder/);
    rmSync(blockFile);
    // The first server carries on, lock and all.
    expect((await fetch(`http://127.0.0.1:${port}/api/health`)).status).toBe(200);
    first.child.kill('SIGTERM');
    expect(await first.exited).toBe(0);
  }, 90_000);

  it('is free the moment its holder is killed (kill -9): a new server starts on the folder at once', async () => {
    const dataDir = freshDir();
    const first = startServer(dataDir, 0);
    await first.listening;
    first.child.kill('SIGKILL');
    await first.exited;
    // No waiting for a lock to go stale: the kernel released it with the process.
    const unlock = await lockDataDir(dataDirLayout(dataDir));
    await unlock();
    const second = startServer(dataDir, 0);
    await second.listening;
    second.child.kill('SIGTERM');
    expect(await second.exited).toBe(0);
  }, 60_000);

  it('refuses a second lock in the same process, and for the same folder reached through a symbolic link', async () => {
    const dataDir = freshDir();
    const unlock = await lockDataDir(dataDirLayout(dataDir));
    await expect(lockDataDir(dataDirLayout(dataDir))).rejects.toThrow(/Another Tallyard process/);
    const link = path.join(parent, `link-${folders}`);
    symlinkSync(dataDir, link);
    await expect(lockDataDir(dataDirLayout(link))).rejects.toThrow(/Another Tallyard process/);
    await unlock();
    const again = await lockDataDir(dataDirLayout(dataDir));
    await again();
  });
});
