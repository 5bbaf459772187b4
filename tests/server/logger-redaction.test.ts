import { Writable } from 'node:stream';
import { describe, expect, it } from 'vitest';
import { createLogger, redactUrl } from '../../server/lib/logger';

function capture() {
  const lines: string[] = [];
  const stream = new Writable({
    write(chunk, _enc, done) {
      lines.push(String(chunk));
      done();
    },
  });
  return { logger: createLogger('info', stream), text: () => lines.join('') };
}

// OWASP ASVS 4.0.3 7.1.1 (no credentials or payment details in logs) and 7.1.2 (no other sensitive data).
describe('log redaction', () => {
  it('never writes passwords, tokens, cookies, signatures or card data from a logged request', () => {
    const { logger, text } = capture();
    logger.info(
      {
        req: {
          method: 'POST',
          url: '/api/auth/reset-password?token=tok-SECRET-1&lang=en',
          headers: {
            cookie: 'better-auth.session_token=COOKIE-SECRET-2',
            authorization: 'Bearer BEARER-SECRET-3',
            'stripe-signature': 't=1,v1=SIG-SECRET-4',
            'user-agent': 'vitest',
          },
        },
        res: { headers: { 'set-cookie': 'better-auth.session_token=COOKIE-SECRET-5' } },
        body: {
          password: 'PASSWORD-SECRET-6',
          newPassword: 'PASSWORD-SECRET-7',
          reauthPassword: 'PASSWORD-SECRET-8',
          payment: { card: { number: '4242424242424242', cvc: '123', exp_month: 12 } },
          bank: { account_number: '000123456789', routing_number: '110000000' },
        },
        token: 'TOP-LEVEL-TOKEN-9',
        client_secret: 'pi_123_secret_SECRET-10',
      },
      'request received',
    );
    const out = text();
    for (const secret of [
      'SECRET-1',
      'SECRET-2',
      'SECRET-3',
      'SECRET-4',
      'SECRET-5',
      'SECRET-6',
      'SECRET-7',
      'SECRET-8',
      'TOKEN-9',
      'SECRET-10',
      '4242424242424242',
      '000123456789',
      '110000000',
    ]) {
      expect(out).not.toContain(secret);
    }
    expect(out).toContain('[redacted]');
    expect(out).toContain('"user-agent":"vitest"');
    expect(out).toContain('lang=en');
    expect(JSON.parse(out).msg).toBe('request received');
  });

  it('cuts token-like query parameters from URLs', () => {
    expect(redactUrl('/verify?token=abc&x=1&signature=zz')).toBe('/verify?token=[redacted]&x=1&signature=[redacted]');
  });
});

describe("better-auth's own log lines", () => {
  it('go through pino (not stderr) without e-mail addresses or query parameters', async () => {
    const { createAuth } = await import('../../server/auth');
    const { authLogger } = await import('../../server/lib/auth-logger');
    const { logger, text } = capture();
    const log = authLogger(logger).log!;
    const failed = new Error(
      'Failed query: insert into "user" ("email") values ($1)\nparams: victim@example.test,abc123',
    );
    log('error', 'Failed to create user', failed);
    log('info', 'Sign-up attempt for existing email: victim@example.test');
    expect(text()).toContain('Failed to create user');
    expect(text()).toContain('"component":"better-auth"');
    expect(text()).not.toContain('victim@example.test');
    expect(text()).not.toContain('abc123');
    // Wired into createAuth: its logger is ours, not better-auth's console logger.
    const auth = createAuth({
      db: {} as never,
      secret: 'x'.repeat(32),
      baseURL: 'http://localhost:3000',
      trustedOrigins: [],
      secureCookies: false,
      logger,
    });
    expect(auth.options.logger?.log).toBeTypeOf('function');
    expect(authLogger(undefined)).toEqual({ disabled: true });
  });
});

describe("better-auth's refusals", () => {
  it('print nothing on stderr or stdout of their own', async () => {
    const { createTestApp, TEST_ORIGIN } = await import('../setup/test-app');
    const { default: request } = await import('supertest');
    const t = await createTestApp();
    const written: string[] = [];
    const spies: (() => void)[] = [process.stderr, process.stdout].map((stream) => {
      const original = stream.write.bind(stream);
      stream.write = ((chunk: unknown, ...rest: unknown[]) => {
        written.push(String(chunk));
        return (original as (...a: unknown[]) => boolean)(chunk, ...rest);
      }) as typeof stream.write;
      return () => {
        stream.write = original;
      };
    });
    for (const method of ['log', 'info', 'warn', 'error', 'debug'] as const) {
      const original = console[method];
      console[method] = (...args: unknown[]) => void written.push(args.map(String).join(' '));
      spies.push(() => {
        console[method] = original;
      });
    }
    try {
      await request(t.app)
        .post('/api/auth/sign-in/email')
        .set('Origin', TEST_ORIGIN)
        .send({ email: 'someone@example.test', password: 'not-the-password' });
      await request(t.app)
        .post('/api/auth/sign-up/email')
        .set('Origin', TEST_ORIGIN)
        .send({ email: 'someone@example.test', password: 'password1234', name: 'S' });
    } finally {
      spies.forEach((restore) => restore());
      await t.close();
    }
    expect(written.join('')).not.toMatch(/Better Auth|someone@example\.test/);
  });
});
