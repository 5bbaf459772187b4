import type { RequestHandler } from 'express';
import { AppError } from '../lib/app-error';

const UNSAFE = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);
/** better-auth checks the origin on its own routes; Stripe signs its webhooks. */
const EXEMPT = [/^\/auth(\/|$)/, /^\/webhooks(\/|$)/];

const rejected = (why: string) =>
  new AppError(403, 'CSRF_REJECTED', `This request was refused because ${why}. Reload the page and try again.`);

function originOf(value: string | undefined): string | null {
  if (!value) return null;
  try {
    return new URL(value).origin;
  } catch {
    return null;
  }
}

/**
 * Refuses state-changing /api requests that another site could have made (OWASP ASVS 4.0.3 4.2.2; OWASP CSRF
 * cheat sheet, "Verifying origin with standard headers" and "Fetch Metadata"). Mount under /api. A browser's
 * Sec-Fetch-Site must be same-origin, or name a trusted origin; otherwise the Origin header (or, lacking it,
 * the Referer) must be one of the trusted origins. A request with neither is refused.
 */
export function csrfGuard(trustedOrigins: readonly string[]): RequestHandler {
  const trusted = new Set(trustedOrigins.map((o) => originOf(o)).filter((o): o is string => Boolean(o)));
  return (req, _res, next) => {
    if (!UNSAFE.has(req.method) || EXEMPT.some((re) => re.test(req.path))) return next();
    const site = req.get('sec-fetch-site');
    const origin = originOf(req.get('origin')) ?? originOf(req.get('referer'));
    if (site === 'same-origin') return next();
    if (!origin) throw rejected('it did not say which site sent it (no Origin header)');
    if (!trusted.has(origin)) throw rejected(`it came from another site (${origin})`);
    next();
  };
}
