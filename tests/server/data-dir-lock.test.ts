import { spawn } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';

const dataDir = mkdtempSync(path.join(tmpdir(), 'tallyard-lock-'));
afterAll(() => rmSync(dataDir, { recursive: true, force: true }));

function startServer(port: number) {
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    env: {
      ...process.env,
      DATA_DIR: dataDir,
      PORT: String(port),
      HOST: '127.0.0.1',
      SEED_DEMO: 'never',
      LOG_LEVEL: 'info',
      NODE_ENV: 'test',
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  child.stdout.on('data', (d) => (output += d));
  child.stderr.on('data', (d) => (output += d));
  const exited = new Promise<number | null>((resolve) => child.on('exit', resolve));
  const listening = new Promise<void>((resolve, reject) => {
    child.stdout.on('data', () => output.includes('listening') && resolve());
    void exited.then((code) => reject(new Error(`exited ${code}: ${output}`)));
  });
  listening.catch(() => {}); // only awaited for the server expected to start
  return { child, exited, listening, output: () => output };
}

describe('the data folder lock', () => {
  it('makes a second server on the same DATA_DIR refuse to start with a clear message', async () => {
    const first = startServer(0);
    await first.listening;
    const second = startServer(0);
    const code = await second.exited;
    expect(code).toBe(1);
    expect(second.output()).toMatch(/Another Tallyard process is using the data folder/);
    first.child.kill('SIGTERM');
    expect(await first.exited).toBe(0);
  }, 60_000);
});
