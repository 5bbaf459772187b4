import pino, { type DestinationStream } from 'pino';

/** Field names whose values never reach a log line, wherever they sit (OWASP ASVS 4.0.3 7.1.1, 7.1.2). */
const SECRET_KEYS = [
  'password',
  'newPassword',
  'currentPassword',
  'reauthPassword',
  'token',
  'accessToken',
  'refreshToken',
  'secret',
  'apiKey',
  'client_secret',
  'clientSecret',
  'card',
  'cardNumber',
  'number',
  'cvc',
  'cvv',
  'exp_month',
  'exp_year',
  'iban',
  'account_number',
  'routing_number',
];
const SECRET_HEADERS = ['cookie', 'authorization', 'set-cookie', 'stripe-signature', 'x-api-key'];

const redactPaths = [
  ...SECRET_KEYS.flatMap((k) => [k, `*.${k}`, `*.*.${k}`, `*.*.*.${k}`]),
  ...SECRET_HEADERS.flatMap((h) => [`headers["${h}"]`, `*.headers["${h}"]`]),
];

/** Query parameters that carry a token (password reset, e-mail verification) are cut from logged URLs. */
export function redactUrl(url: string): string {
  return url.replace(/([?&](?:token|code|key|secret|signature|password)[^=&]*=)[^&#]*/gi, '$1[redacted]');
}

/** Structured logs; secrets, tokens, cookies and card data never reach them. */
export function createLogger(level: string, destination?: DestinationStream) {
  return pino(
    {
      level,
      redact: { paths: redactPaths, censor: '[redacted]' },
      serializers: {
        req: (req: { method?: string; url?: string; originalUrl?: string; headers?: Record<string, unknown> }) => ({
          method: req.method,
          url: redactUrl(req.originalUrl ?? req.url ?? ''),
          headers: req.headers,
        }),
        err: pino.stdSerializers.err,
      },
    },
    destination,
  );
}
export type Logger = ReturnType<typeof createLogger>;
