import { createHash } from 'node:crypto';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { CreateBucketCommand, S3Client } from '@aws-sdk/client-s3';
import S3rver from 's3rver';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../server/db/demo/demo-data';
import { startSmtpSink, type SmtpSink } from '../../server/integrations/mailer/smtp-sink';
import { cloneTemplate } from '../setup/postgres';
import { freePort, signInCookie, startServerProcess, type ServerProcess } from '../setup/server-process';

// Issue 16: two app processes on one PostgreSQL server and one S3-compatible store (s3rver), requests alternating
// between them. Needs the PostgreSQL pass (npm run test:postgres); the embedded database is one process by design.
const serverUrl = process.env.TEST_DATABASE_URL;
const SUB = 'sub@tallyard.test';

describe.skipIf(!serverUrl)('two app servers sharing PostgreSQL and S3-compatible storage', () => {
  let clone: { url: string; drop: () => Promise<void> };
  let s3: S3rver;
  let mail: SmtpSink;
  let a: ServerProcess;
  let b: ServerProcess;

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
    const shared = {
      NODE_ENV: 'development',
      DATABASE_URL: clone.url,
      BETTER_AUTH_SECRET: 'two-servers-share-this-secret-0123456789',
      SMTP_URL: mail.url,
      S3_BUCKET: 'tallyard-two',
      S3_ENDPOINT: endpoint,
      AWS_ACCESS_KEY_ID: credentials.accessKeyId,
      AWS_SECRET_ACCESS_KEY: credentials.secretAccessKey,
      OUTBOX_POLL_SECONDS: '1',
      LOG_LEVEL: 'warn',
    };
    // One server seeds the demo first (its evidence files go to the bucket); the other starts on the same data.
    a = await startServerProcess(mkdtempSync(path.join(tmpdir(), 'app-a-')), await freePort(), {
      ...shared,
      LOG_LEVEL: 'info',
      SEED_DEMO: 'always',
    });
    b = await startServerProcess(mkdtempSync(path.join(tmpdir(), 'app-b-')), await freePort(), {
      ...shared,
      LOG_LEVEL: 'info',
      SEED_DEMO: 'never',
    });
  }, 180_000);

  afterAll(async () => {
    for (const server of [a, b]) {
      if (server && server.child.exitCode === null) {
        server.child.kill('SIGTERM');
        await server.exited;
      }
    }
    await mail?.close();
    await s3?.close();
    await clone?.drop();
  });

  const get = (server: ServerProcess, route: string, cookie: string) =>
    fetch(`${server.url}${route}`, { headers: { cookie, origin: server.url } });

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
});
