import type { Logger as BetterAuthLogger } from 'better-auth';
import type { Logger } from './logger';

const EMAIL = /[^\s@'"<>(),;:]+@[^\s@'"<>(),;:]+/g;
/** A failed query's text as drizzle and the pg drivers write it: "Failed query: ...\nparams: a@b.test,42". */
const QUERY_PARAMS = /(params:)[^\n]*/gi;

/** A log argument as text with no e-mail address and no query parameters (those carry people's data). */
export function scrubLogText(text: string): string {
  return text.replace(QUERY_PARAMS, '$1 [redacted]').replace(EMAIL, '[e-mail]');
}

function describe(arg: unknown): unknown {
  if (arg instanceof Error) {
    const cause = arg.cause instanceof Error ? { cause: scrubLogText(`${arg.cause.name}: ${arg.cause.message}`) } : {};
    return { name: arg.name, message: scrubLogText(arg.message), ...cause };
  }
  if (typeof arg === 'string') return scrubLogText(arg);
  if (typeof arg === 'number' || typeof arg === 'boolean') return arg;
  return '[object]';
}

/**
 * better-auth's log lines through our pino logger (its redaction applies, and nothing goes to stderr on its own).
 * Messages and arguments lose e-mail addresses and query parameters first: better-auth logs failed queries with
 * their parameters and some messages with the address typed. Without a logger, better-auth stays silent.
 */
export function authLogger(logger: Logger | undefined): BetterAuthLogger {
  if (!logger) return { disabled: true };
  const auth = logger.child({ component: 'better-auth' });
  return {
    // 'info', not 'warn': at warn, error or debug better-auth also prints every refused request (an APIError's
    // message) through its own console logger, beside this one (better-auth 1.7, api/index onError).
    level: 'info',
    log: (level, message, ...args) => {
      const fields = args.length > 0 ? { details: args.map(describe) } : {};
      auth[level === 'debug' ? 'debug' : level](fields, scrubLogText(message));
    },
  };
}
