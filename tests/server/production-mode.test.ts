import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../server/db/demo/demo-data';
import { freePort, signInCookie, startServerProcess } from '../setup/server-process';

const dataDir = mkdtempSync(path.join(tmpdir(), 'tallyard-prod-'));
afterAll(() => rmSync(dataDir, { recursive: true, force: true }));

// OWASP ASVS 4.0.3 section 14.3 (unintended disclosure): development aids are off in production.
describe('the real server with NODE_ENV=production and no SMTP_URL', () => {
  it('keeps the caught mail (invitation links included) off the API and warns in its log', async () => {
    const server = await startServerProcess(dataDir, await freePort(), {
      NODE_ENV: 'production',
      SEED_DEMO: 'always',
      BETTER_AUTH_SECRET: 'production-test-secret-0123456789abcdef',
    });
    try {
      const cookie = await signInCookie(server.url, 'gc@tallyard.test', DEMO_PASSWORD);
      const res = await fetch(`${server.url}/api/dev/mailbox`, { headers: { cookie } });
      expect(res.status).toBe(404);
      expect(server.output()).toContain('no SMTP_URL in production');
    } finally {
      server.child.kill('SIGTERM');
      await server.exited;
    }
  });
});
