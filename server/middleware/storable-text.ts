import type { RequestHandler } from 'express';
import type { ApiErrorDetail } from '../../src/shared/schemas/api-error';
import { validationFailed } from '../lib/app-error';

const LONE_SURROGATE = /[\ud800-\udbff](?![\udc00-\udfff])|(?<![\ud800-\udbff])[\udc00-\udfff]/;
const MAX_DETAILS = 20;

function problem(text: string): string | null {
  if (text.includes('\u0000')) return 'holds a NUL character (U+0000), which cannot be saved';
  if (LONE_SURROGATE.test(text)) return 'holds an unpaired surrogate (U+D800 to U+DFFF), which is not a Unicode character';
  return null;
}

/** Every string and key in a parsed JSON value that cannot be stored as sent, with its dotted path (iterative: bodies may nest deeply). */
export function unstorableText(value: unknown): ApiErrorDetail[] {
  const details: ApiErrorDetail[] = [];
  const stack: { value: unknown; path: string }[] = [{ value, path: '' }];
  while (stack.length > 0 && details.length < MAX_DETAILS) {
    const { value: v, path } = stack.pop()!;
    if (typeof v === 'string') {
      const why = problem(v);
      if (why) details.push({ path: path || '(body)', message: `The text ${why}.` });
    } else if (v !== null && typeof v === 'object') {
      for (const [key, child] of Object.entries(v)) {
        const at = path ? `${path}.${key}` : key;
        const why = problem(key);
        if (why) details.push({ path: path || '(body)', message: `A field name ${why}.` });
        else stack.push({ value: child, path: at });
      }
    }
  }
  return details;
}

/**
 * Refuses a JSON body with text that PostgreSQL cannot store as sent, before any route reads it: NUL, which text and
 * jsonb columns cannot hold (PostgreSQL documentation, 8.3 Character Types and 8.14 JSON Types), and unpaired
 * surrogates, which have no UTF-8 form (RFC 8259 section 8.2) and would be saved as U+FFFD or fail in jsonb.
 * 400 VALIDATION_FAILED naming each field (OWASP ASVS 4.0.3 5.1.3). Mount after the JSON parser.
 */
export const refuseUnstorableText: RequestHandler = (req, _res, next) => {
  const details = unstorableText(req.body);
  if (details.length > 0) throw validationFailed(details, 'Some text holds characters that cannot be saved; nothing was saved.');
  next();
};
