import { createHash } from 'node:crypto';
import { execFileSync, spawn } from 'node:child_process';
import { mkdtempSync, readdirSync } from 'node:fs';
import { createServer, type Socket } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { CreateBucketCommand, S3Client } from '@aws-sdk/client-s3';
import pg from 'pg';
import S3rver from 's3rver';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startStandin, type Standin } from '../../stripe-standin/src/index';
import { DEMO_PASSWORD } from '../../server/db/demo/demo-data';
import { startSmtpSink, type SmtpSink } from '../../server/integrations/mailer/smtp-sink';
import { cloneTemplate } from '../setup/postgres';
import { hook } from '../setup/payment-flow';
import { freePort, signInCookie, startServerProcess, type ServerProcess } from '../setup/server-process';

// Issue 16: two app processes on one PostgreSQL server and one S3-compatible store (s3rver), requests alternating
// between them. Needs the PostgreSQL pass (npm run test:postgres); the embedded database is one process by design.
const serverUrl = process.env.TEST_DATABASE_URL;
const SUB = 'sub@tallyard.test';
const OWNER = 'owner@tallyard.test';
/** Server c's lease on mail it claimed: short, so the test sees another server take it over after c dies. */
const LEASE_SECONDS = 2;

/** An SMTP server that takes connections and never greets: a send through it hangs, as on a stuck mail server. */
async function startSilentSmtp() {
  const sockets = new Set<Socket>();
  const server = createServer((socket) => {
    sockets.add(socket);
    socket.on('error', () => undefined);
    socket.on('close', () => sockets.delete(socket));
  });
  let connections = 0;
  server.on('connection', () => connections++);
  await new Promise<void>((r) => server.listen(0, '127.0.0.1', r));
  return {
    url: `smtp://127.0.0.1:${(server.address() as { port: number }).port}`,
    connections: () => connections,
    close: async () => {
      for (const socket of sockets) socket.destroy();
      await new Promise<void>((r) => server.close(() => r()));
    },
  };
}

type Delivery = { eventId: string; type: string; answers: { status: number; outcome?: string }[] };

describe.skipIf(!serverUrl)('two app servers sharing PostgreSQL and S3-compatible storage', () => {
  let clone: { url: string; drop: () => Promise<void> };
  let s3: S3rver;
  let mail: SmtpSink;
  let a: ServerProcess;
  let b: ServerProcess;
  /** A third server whose mail hangs, killed with SIGKILL mid-work by the last test. */
  let c: ServerProcess;
  let silentSmtp: Awaited<ReturnType<typeof startSilentSmtp>>;
  let standin: Standin;
  let sql: pg.Client;
  const deliveries: Delivery[] = [];
  let s3Env: Record<string, string>;
  /** Sessions made before the sign-in limiter test backs the owner off (better-auth also limits sign-ins per address). */
  let ownerCookie: string;
  let subCookie: string;

  beforeAll(async () => {
    clone = await cloneTemplate(serverUrl!);
    s3 = new S3rver({
      port: 0,
      address: '127.0.0.1',
      silent: true,
      directory: mkdtempSync(path.join(tmpdir(), 's3-')),
    });
    const { port } = await s3.run();
    const endpoint = `http://127.0.0.1:${port}`;
    const credentials = { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' };
    await new S3Client({ endpoint, region: 'us-east-1', forcePathStyle: true, credentials }).send(
      new CreateBucketCommand({ Bucket: 'tallyard-two' }),
    );
    mail = await startSmtpSink();
    silentSmtp = await startSilentSmtp();
    // One Stripe stand-in for both servers; it delivers every event to both at once, as a retrying or duplicating
    // processor behind a load balancer could.
    const webhookSecret = 'whsec_two_servers_share_this';
    standin = await startStandin({
      webhookSecret,
      achSettleMs: Infinity,
      retryDelaysMs: [],
      webhookTarget: async (payload, headers) => {
        const event = JSON.parse(payload) as { id: string; type: string };
        const answers = await Promise.all(
          [a, b].map(async (server) => {
            const res = await fetch(`${server.url}/api/webhooks/stripe`, { method: 'POST', headers, body: payload });
            const body = (await res.json().catch(() => ({}))) as { outcome?: string };
            return { status: res.status, outcome: body.outcome };
          }),
        );
        deliveries.push({ eventId: event.id, type: event.type, answers });
        return Math.max(...answers.map((x) => x.status));
      },
    });
    sql = new pg.Client({ connectionString: clone.url });
    await sql.connect();
    s3Env = {
      S3_BUCKET: 'tallyard-two',
      S3_ENDPOINT: endpoint,
      AWS_ACCESS_KEY_ID: credentials.accessKeyId,
      AWS_SECRET_ACCESS_KEY: credentials.secretAccessKey,
    };
    const shared = {
      NODE_ENV: 'development',
      DATABASE_URL: clone.url,
      BETTER_AUTH_SECRET: 'two-servers-share-this-secret-0123456789',
      SMTP_URL: mail.url,
      ...s3Env,
      OUTBOX_POLL_SECONDS: '1',
      STRIPE_SECRET_KEY: 'sk_test_two_servers',
      STRIPE_WEBHOOK_SECRET: webhookSecret,
      STRIPE_API_URL: standin.url,
      LOG_LEVEL: 'warn',
    };
    // One server seeds the demo first (its evidence files go to the bucket); the other starts on the same data.
    a = await startServerProcess(mkdtempSync(path.join(tmpdir(), 'app-a-')), await freePort(), {
      ...shared,
      LOG_LEVEL: 'info',
      SEED_DEMO: 'always',
    });
    [b, c] = await Promise.all([
      startServerProcess(mkdtempSync(path.join(tmpdir(), 'app-b-')), await freePort(), {
        ...shared,
        LOG_LEVEL: 'info',
        SEED_DEMO: 'never',
      }),
      // c looks for due mail only after its own changes (no polling), so what it claims is what it queued.
      startServerProcess(mkdtempSync(path.join(tmpdir(), 'app-c-')), await freePort(), {
        ...shared,
        LOG_LEVEL: 'info',
        SEED_DEMO: 'never',
        SMTP_URL: silentSmtp.url,
        OUTBOX_POLL_SECONDS: '3600',
        OUTBOX_LEASE_SECONDS: String(LEASE_SECONDS),
      }),
    ]);
    ownerCookie = await signInCookie(a.url, OWNER, DEMO_PASSWORD);
    subCookie = await signInCookie(b.url, SUB, DEMO_PASSWORD);
  }, 180_000);

  afterAll(async () => {
    for (const server of [a, b, c]) {
      if (server && server.child.exitCode === null && server.child.signalCode === null) {
        server.child.kill('SIGCONT');
        server.child.kill('SIGTERM');
        await server.exited;
      }
    }
    await sql?.end();
    await standin?.close();
    await silentSmtp?.close();
    await mail?.close();
    await s3?.close();
    await clone?.drop();
  });

  const get = (server: ServerProcess, route: string, cookie: string) =>
    fetch(`${server.url}${route}`, { headers: { cookie, origin: server.url } });
  const post = (server: ServerProcess, route: string, cookie: string, body: object) =>
    fetch(`${server.url}${route}`, {
      method: 'POST',
      headers: { cookie, origin: server.url, 'content-type': 'application/json' },
      body: JSON.stringify(body),
    });
  const firstProjectId = async (server: ServerProcess, cookie: string) =>
    ((await (await get(server, '/api/projects', cookie)).json()) as { projects: { id: string }[] }).projects[0]!.id;

  it('a session made on one server works on the other', async () => {
    const cookie = await signInCookie(a.url, SUB, DEMO_PASSWORD);
    const me = await get(b, '/api/me', cookie);
    expect(me.status).toBe(200);
    expect(((await me.json()) as { user: { email: string } }).user.email).toBe(SUB);
  });

  it('an evidence file stored by one server downloads through either, byte for byte', async () => {
    const cookie = await signInCookie(b.url, SUB, DEMO_PASSWORD);
    const projects = (await (await get(b, '/api/projects', cookie)).json()) as { projects: { id: string }[] };
    const projectId = projects.projects[0]!.id;
    const list = (await (await get(b, `/api/projects/${projectId}/tallies?limit=500`, cookie)).json()) as {
      items: { id: string; evidenceCount: number }[];
    };
    const withFiles = list.items.find((x) => x.evidenceCount > 0)!;
    expect(withFiles).toBeDefined();
    const detail = (await (await get(b, `/api/tallies/${withFiles.id}`, cookie)).json()) as {
      evidence: { id: string; sha256: string }[];
    };
    const file = detail.evidence[0]!;
    for (const server of [a, b]) {
      const res = await get(server, `/api/evidence/${file.id}/download`, cookie);
      expect(res.status).toBe(200);
      const bytes = Buffer.from(await res.arrayBuffer());
      expect(createHash('sha256').update(bytes).digest('hex')).toBe(file.sha256);
    }
  });

  it('sends a mail once though both servers look for it', async () => {
    mail.clear();
    const res = await fetch(`${a.url}/api/auth/request-password-reset`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', origin: a.url },
      body: JSON.stringify({ email: SUB }),
    });
    expect(res.status).toBe(200);
    await expect.poll(() => mail.messages().filter((m) => m.to.includes(SUB)).length, { timeout: 20_000 }).toBe(1);
    // Both servers look every second: three more rounds must not send it again.
    await new Promise((r) => setTimeout(r, 3000));
    expect(mail.messages().filter((m) => m.to.includes(SUB))).toHaveLength(1);
  });

  it('counts failed sign-ins across both servers: the back-off one set holds on the other', async () => {
    const attempt = (server: ServerProcess, password: string) =>
      fetch(`${server.url}/api/auth/sign-in/email`, {
        method: 'POST',
        headers: { 'content-type': 'application/json', origin: server.url },
        body: JSON.stringify({ email: 'owner@tallyard.test', password }),
      });
    for (let i = 0; i < 5; i++) expect((await attempt(i % 2 ? a : b, 'not-the-password-1')).status).toBe(401);
    // Five failures from this address, split between the servers: the sixth waits, whichever server it reaches.
    expect((await attempt(a, DEMO_PASSWORD)).status).toBe(429);
    expect((await attempt(b, DEMO_PASSWORD)).status).toBe(429);
  });

  it('backs up while both servers run: the dump plus every object the database names, from the bucket', async () => {
    const outDir = mkdtempSync(path.join(tmpdir(), 'two-backup-'));
    const backup = await new Promise<{ status: number | null; stderr: string }>((resolve) => {
      // Awaited, not spawnSync: s3rver answers from this process's event loop.
      const child = spawn(process.execPath, ['--import', 'tsx', 'scripts/backup.ts', '--out', outDir], {
        env: { ...process.env, ...s3Env, DATABASE_URL: clone.url, DATA_DIR: mkdtempSync(path.join(tmpdir(), 'bk-')) },
      });
      let stderr = '';
      child.stderr.on('data', (d) => (stderr += String(d)));
      child.on('close', (status) => resolve({ status, stderr }));
    });
    expect(backup.status, backup.stderr).toBe(0);
    const archive = path.join(
      outDir,
      readdirSync(outDir).find((n) => n.endsWith('.tar.gz'))!,
    );
    const manifest = JSON.parse(execFileSync('tar', ['-xzOf', archive, 'manifest.json'], { encoding: 'utf8' })) as {
      missingUploads: string[];
    };
    expect(manifest.missingUploads).toEqual([]);
    const look = mkdtempSync(path.join(tmpdir(), 'two-look-'));
    execFileSync('tar', ['-xzf', archive, '-C', look, 'uploads.tar']);
    const packed = new Set(
      execFileSync('tar', ['-tf', path.join(look, 'uploads.tar')], { encoding: 'utf8' })
        .split('\n')
        .map((n) => n.replace(/^\.\//, '')),
    );
    const named = await sql.query<{ k: string }>('select storage_key as k from tally_evidence');
    expect(named.rows.length).toBeGreaterThan(0);
    expect(named.rows.filter((r) => !packed.has(r.k))).toEqual([]);
  });

  it('applies a Stripe event delivered to both servers at once exactly once', async () => {
    const cookie = ownerCookie;
    const projectId = await firstProjectId(a, cookie);
    const apps = (await (await get(a, `/api/projects/${projectId}/pay-apps`, cookie)).json()) as {
      payApps: { id: string; status: string; currentDueCents: number; paidCents: number }[];
    };
    const app = apps.payApps.find((x) => x.status === 'certified')!;
    expect(app, 'the demo has a certified application awaiting payment').toBeDefined();
    const started = await post(b, `/api/pay-apps/${app.id}/payments`, cookie, { method: 'card' });
    expect(started.status).toBe(201);
    const { paymentId, url } = (await started.json()) as { paymentId: string; url: string };
    const sessionId = new URL(url).pathname.split('/').pop()!;
    deliveries.length = 0;
    // Stripe's test card that succeeds (stripe-standin/README.md): payment_intent.succeeded, then
    // checkout.session.completed, each posted to both servers at the same moment.
    expect((await hook(standin, `/checkout/sessions/${sessionId}/confirm`, { card: '4242424242424242' })).status).toBe(
      200,
    );
    await standin.idle();
    expect(deliveries.map((d) => d.type).sort()).toEqual(['checkout.session.completed', 'payment_intent.succeeded']);
    for (const d of deliveries) {
      expect(d.answers.map((x) => x.status)).toEqual([200, 200]);
      // One server acted on the event; the other found it already recorded (stripe_events, same transaction).
      expect(
        d.answers.filter((x) => x.outcome === 'duplicate'),
        JSON.stringify(d.answers),
      ).toHaveLength(1);
    }
    expect(deliveries.flatMap((d) => d.answers).filter((x) => x.outcome === 'applied')).toHaveLength(1);
    // Delivered to both once more (a retry): nothing changes.
    for (const d of [...deliveries]) await hook(standin, `/events/${d.eventId}/replay`, { times: 1 });
    await standin.idle();
    expect(deliveries.slice(2).flatMap((d) => d.answers.map((x) => x.outcome))).toEqual(Array(4).fill('duplicate'));

    const history = await sql.query<{ to_status: string }>(
      'select to_status from payment_status_history where payment_id = $1 order by created_at',
      [paymentId],
    );
    expect(history.rows.filter((r) => r.to_status === 'succeeded')).toHaveLength(1);
    const audit = await sql.query<{ action: string }>(
      "select action from audit_events where object_id = $1 and after ? 'stripeEventId'",
      [paymentId],
    );
    expect(audit.rows.map((r) => r.action)).toEqual(['payment.succeeded']);
    const after = (await (await get(a, `/api/projects/${projectId}/pay-apps`, cookie)).json()) as typeof apps;
    const paid = after.payApps.find((x) => x.id === app.id)!;
    expect(paid.paidCents).toBe(app.paidCents + app.currentDueCents);
    expect(paid.status).toBe('paid');
  });

  it('loses no acknowledged write when a server is killed mid-work, and another finishes the mail it had leased', async () => {
    const cookie = subCookie;
    const projectId = await firstProjectId(c, cookie);
    mail.clear();
    // a and b are paused (SIGSTOP) only so that c, not a poller of theirs, is the server that claims the mail.
    a.child.kill('SIGSTOP');
    b.child.kill('SIGSTOP');
    let resumed = false;
    const resume = () => {
      if (resumed) return;
      resumed = true;
      a.child.kill('SIGCONT');
      b.child.kill('SIGCONT');
    };
    try {
      const reset = await fetch(`${c.url}/api/auth/request-password-reset`, {
        method: 'POST',
        headers: { 'content-type': 'application/json', origin: c.url },
        body: JSON.stringify({ email: OWNER }),
      });
      expect(reset.status).toBe(200);
      // c claimed the mail and is stuck sending it to its silent mail server.
      await expect.poll(() => silentSmtp.connections(), { timeout: 10_000 }).toBeGreaterThan(0);

      // Writes keep arriving at c from three clients; c dies (SIGKILL) once some have been answered.
      const acknowledged: string[] = [];
      let n = 0;
      let killed = false;
      const writer = async () => {
        while (!killed) {
          const label = `K-${++n}`;
          const res = await post(c, `/api/projects/${projectId}/trucks`, cookie, {
            label,
            hauler: 'Kill test hauling',
            bedVolumeCy: 12,
            measuredBy: 'Test',
            measuredOn: '2026-10-01',
          }).catch(() => null);
          if (res?.status === 201) acknowledged.push(label);
          else if (res && !killed) throw new Error(`truck ${label}: ${res.status} ${await res.text()}`);
          if (acknowledged.length >= 12 && !killed) {
            killed = true;
            c.child.kill('SIGKILL');
          }
        }
      };
      await Promise.all([writer(), writer(), writer()]);
      expect(await c.exited).toBeNull();
      expect(c.child.signalCode).toBe('SIGKILL');
      resume();

      const trucks = (await (await get(a, `/api/projects/${projectId}/trucks`, cookie)).json()) as {
        trucks: { label: string }[];
      };
      const stored = new Set(trucks.trucks.map((t) => t.label));
      expect(acknowledged.filter((label) => !stored.has(label))).toEqual([]);
      // Each stored truck has its audit event (one transaction each): no write was half-done by the kill.
      const events = await sql.query<{ n: number }>(
        "select count(*)::int as n from audit_events where action = 'truck.registered' and project_id = $1",
        [projectId],
      );
      expect(events.rows[0]!.n).toBe(stored.size);

      // c's lease runs out and a or b sends the mail c had claimed, once.
      // Only the reset mail counts: the owner's receipts from the webhook case above may still arrive now.
      const toOwner = () => mail.messages().filter((m) => m.to.includes(OWNER) && /password/i.test(m.subject));
      await expect.poll(() => toOwner().length, { timeout: 20_000 }).toBe(1);
      const row = async () =>
        (
          await sql.query<{ status: string; attempts: number }>(
            "select status, attempts from email_outbox where to_addresses ? $1 and template = 'password-reset' order by created_at desc limit 1",
            [OWNER],
          )
        ).rows[0];
      // Marked sent after the send: one attempt, the one that delivered (c never got to record its own).
      await expect.poll(row, { timeout: 10_000 }).toEqual({ status: 'sent', attempts: 1 });
      await new Promise((r) => setTimeout(r, 2000));
      expect(toOwner()).toHaveLength(1);
    } finally {
      resume();
    }
  });
});
