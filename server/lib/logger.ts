import pino from 'pino';

/** Structured logs; secrets, cookies and card data never reach them. */
export function createLogger(level: string) {
  return pino({
    level,
    redact: {
      paths: [
        'req.headers.cookie',
        'req.headers.authorization',
        'res.headers["set-cookie"]',
        '*.password',
        '*.token',
        '*.secret',
        '*.card',
      ],
      censor: '[redacted]',
    },
  });
}
export type Logger = ReturnType<typeof createLogger>;
