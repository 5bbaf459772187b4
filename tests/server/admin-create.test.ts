import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { freePort, signInCookie, startServerProcess } from '../setup/server-process';

const dataDir = mkdtempSync(path.join(tmpdir(), 'tallyard-admin-'));
afterAll(() => rmSync(dataDir, { recursive: true, force: true }));

const adminCreate = (args: string[], password: string) =>
  spawnSync(process.execPath, ['--import', 'tsx', 'scripts/admin-create.ts', ...args], {
    env: { ...process.env, DATA_DIR: dataDir, NODE_ENV: 'test', TALLYARD_ADMIN_PASSWORD: password },
    stdio: ['ignore', 'pipe', 'pipe'],
    encoding: 'utf8',
    timeout: 120_000,
  });

// The first person of a new installation (public sign-up is off): `npm run admin:create` with flags.
describe('npm run admin:create', () => {
  it('refuses a common password naming the field, then creates the administrator, who can sign in', async () => {
    const flags = [
      '--name',
      'Ines Calder',
      '--email',
      'ines@calder.example',
      '--company',
      'Calder Site Works',
      '--kind',
      'subcontractor',
    ];
    const weak = adminCreate(flags, 'password1234');
    expect(weak.status).toBe(1);
    expect(weak.stderr).toMatch(/Nothing was created[\s\S]*password: .*common passwords/);
    const made = adminCreate(flags, 'trench-box-shoring-41');
    expect(made.stderr).toBe('');
    expect(made.status).toBe(0);
    expect(made.stdout).toContain('Created ines@calder.example, administrator of Calder Site Works');
    const server = await startServerProcess(dataDir, await freePort(), { SEED_DEMO: 'never' });
    try {
      const cookie = await signInCookie(server.url, 'ines@calder.example', 'trench-box-shoring-41');
      const me = (await (await fetch(`${server.url}/api/me`, { headers: { cookie } })).json()) as {
        isAdmin: boolean;
        company: { kind: string };
      };
      expect(me.isAdmin).toBe(true);
      expect(me.company.kind).toBe('subcontractor');
    } finally {
      server.child.kill('SIGTERM');
      await server.exited;
    }
  }, 240_000);
});
