import type { RequestHandler } from 'express';
import { AppError } from '../lib/app-error';

type Options = {
  /** Paths (below the mount point) that read their own bodies, e.g. better-auth's. */
  skip: RegExp[];
  /** Upload routes: they take a multipart form instead (a `[method, path]` pair: that method only). */
  multipart: (RegExp | [string, RegExp])[];
};

const unsupported = (message: string) => new AppError(415, 'UNSUPPORTED_MEDIA_TYPE', message);

/**
 * A request with a body must send JSON, in UTF-8, or a multipart form to an upload route; anything else answers 415
 * before a route could treat the unread body as empty (OWASP ASVS 4.0.3 13.1.5: unexpected or missing content
 * types are refused; RFC 8259 section 8.1: JSON exchanged between systems is UTF-8). A request without a body passes.
 */
export function jsonBodiesOnly({ skip, multipart }: Options): RequestHandler {
  return (req, _res, next) => {
    if (skip.some((re) => re.test(req.path))) return next();
    // No body: req.is answers null without one, and a fetch() POST with none says Content-Length: 0.
    if (req.get('content-length') === '0' && !req.get('transfer-encoding')) return next();
    const kind = req.is(['application/json', 'multipart/form-data']);
    if (kind === null) return next();
    if (kind === 'application/json') {
      const charset = /;\s*charset="?([^";\s]+)"?/i.exec(req.get('content-type') ?? '')?.[1]?.toLowerCase();
      if (charset === undefined || charset === 'utf-8' || charset === 'utf8') return next();
      throw unsupported(`The body is in ${charset}; send JSON in UTF-8.`);
    }
    const takesForm = (m: RegExp | [string, RegExp]) =>
      Array.isArray(m) ? m[0] === req.method && m[1].test(req.path) : m.test(req.path);
    if (kind === 'multipart/form-data' && multipart.some(takesForm)) return next();
    const type = req.get('content-type');
    throw unsupported(
      type
        ? `This route takes a JSON body (application/json), not ${type.split(';')[0]}.`
        : 'The body has no Content-Type; send application/json.',
    );
  };
}
