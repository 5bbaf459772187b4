import { spawn } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../server/db/demo/demo-data';
import { assertDeployable, loadEnv } from '../../server/env';
import { startSmtpSink } from '../../server/integrations/mailer/smtp-sink';
import { configurePayments } from '../../server/integrations/payments/configure';
import { createLogger } from '../../server/lib/logger';
import { freePort, SOURCE_SERVER, signInCookie, startServerProcess } from '../setup/server-process';

const dataDir = mkdtempSync(path.join(tmpdir(), 'tallyard-prod-'));
afterAll(() => rmSync(dataDir, { recursive: true, force: true }));
const SECRET = { BETTER_AUTH_SECRET: 'production-test-secret-0123456789abcdef' };

/** Runs the server and waits for it to exit on its own; its exit code and everything it printed. */
async function runToExit(env: Record<string, string>): Promise<{ code: number | null; output: string }> {
  const child = spawn(process.execPath, SOURCE_SERVER, {
    env: { ...process.env, DATA_DIR: dataDir, PORT: String(await freePort()), HOST: '127.0.0.1', ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  child.stdout.on('data', (d: Buffer) => (output += String(d)));
  child.stderr.on('data', (d: Buffer) => (output += String(d)));
  const timer = setTimeout(() => child.kill('SIGTERM'), 30_000);
  const code = await new Promise<number | null>((resolve) => child.on('exit', resolve));
  clearTimeout(timer);
  return { code, output };
}

// OWASP ASVS 4.0.3 section 14.3 (unintended disclosure) and 14.1 (build and deploy): a production server is a real
// deployment or it does not start; development aids run only in development and the labelled embedded demo.
describe('NODE_ENV=production', () => {
  it('refuses to start without APP_URL, SMTP_URL and the Stripe keys, naming each one', async () => {
    const { code, output } = await runToExit({ NODE_ENV: 'production', SEED_DEMO: 'never', ...SECRET });
    expect(code).toBe(1);
    expect(output).toContain('cannot start in production');
    for (const key of ['APP_URL', 'SMTP_URL', 'STRIPE_SECRET_KEY', 'STRIPE_WEBHOOK_SECRET'])
      expect(output).toContain(`${key}:`);
    expect(output).not.toContain('listening');
  }, 60_000);

  it('names only what is missing, and refuses the demo switch on a PostgreSQL server', () => {
    const base = { NODE_ENV: 'production', APP_URL: 'https://tallyard.example', SMTP_URL: 'smtp://mail.example:25' };
    expect(() => assertDeployable(loadEnv(base))).toThrow(/STRIPE_SECRET_KEY:[\s\S]*STRIPE_WEBHOOK_SECRET:/);
    expect(() => assertDeployable(loadEnv(base))).not.toThrow(/APP_URL:|SMTP_URL:/);
    expect(() =>
      assertDeployable(loadEnv({ ...base, STRIPE_SECRET_KEY: 'sk_test_x', STRIPE_WEBHOOK_SECRET: 'whsec_x' })),
    ).not.toThrow();
    expect(() =>
      assertDeployable(loadEnv({ NODE_ENV: 'production', TALLYARD_DEMO: 'on', DATABASE_URL: 'postgresql://x@db/x' })),
    ).toThrow(/embedded database/);
    expect(() => assertDeployable(loadEnv({ NODE_ENV: 'production', TALLYARD_DEMO: 'on' }))).not.toThrow();
    expect(() => assertDeployable(loadEnv({ NODE_ENV: 'development' }))).not.toThrow();
  });

  it('sends payments nowhere but Stripe in production: STRIPE_API_URL (a shared local stand-in) is refused', async () => {
    const keys = {
      STRIPE_SECRET_KEY: 'sk_test_x',
      STRIPE_WEBHOOK_SECRET: 'whsec_x',
      STRIPE_API_URL: 'http://127.0.0.1:12111',
    };
    await expect(
      configurePayments(loadEnv({ NODE_ENV: 'production', ...keys }), createLogger('silent')),
    ).rejects.toThrow(/STRIPE_API_URL/);
    const dev = await configurePayments(loadEnv({ NODE_ENV: 'development', ...keys }), createLogger('silent'));
    await dev.close();
  });

  it('set up for real: no Mailbox, and the session cookie is Secure because APP_URL is https', async () => {
    const sink = await startSmtpSink();
    const port = await freePort();
    const appUrl = 'https://tallyard.example';
    const server = await startServerProcess(dataDir, port, {
      NODE_ENV: 'production',
      SEED_DEMO: 'always',
      APP_URL: appUrl,
      SMTP_URL: sink.url,
      STRIPE_SECRET_KEY: 'sk_test_not_a_real_key',
      STRIPE_WEBHOOK_SECRET: 'whsec_not_a_real_secret',
      ...SECRET,
    });
    try {
      const res = await fetch(`${server.url}/api/auth/sign-in/email`, {
        method: 'POST',
        headers: { 'content-type': 'application/json', origin: appUrl },
        body: JSON.stringify({ email: 'gc@tallyard.test', password: DEMO_PASSWORD }),
      });
      expect(res.status).toBe(200);
      const cookies = res.headers.getSetCookie();
      const sessionCookie = cookies.find((c) => c.includes('session_token'))!;
      expect(sessionCookie).toMatch(/^__Secure-/);
      expect(sessionCookie).toMatch(/;\s*Secure/i);
      const cookie = cookies.map((c) => c.split(';')[0]).join('; ');
      expect((await fetch(`${server.url}/api/dev/mailbox`, { headers: { cookie } })).status).toBe(404);
    } finally {
      server.child.kill('SIGTERM');
      await server.exited;
      await sink.close();
    }
  }, 120_000);

  it('the embedded demo (`npm start`): a Mailbox labelled demo, showing each person only their own mail', async () => {
    const server = await startServerProcess(dataDir, await freePort(), {
      NODE_ENV: 'production',
      TALLYARD_DEMO: 'on',
      SEED_DEMO: 'always',
      ...SECRET,
    });
    try {
      expect(server.output()).toContain('demo mode');
      const owner = await signInCookie(server.url, 'owner@tallyard.test', DEMO_PASSWORD);
      const res = await fetch(`${server.url}/api/dev/mailbox`, { headers: { cookie: owner } });
      expect(res.status).toBe(200);
      const body = (await res.json()) as { kind: string; messages: { to: string[] }[] };
      expect(body.kind).toBe('demo');
      expect(body.messages.every((m) => m.to.includes('owner@tallyard.test'))).toBe(true);
    } finally {
      server.child.kill('SIGTERM');
      await server.exited;
    }
  }, 120_000);
});
