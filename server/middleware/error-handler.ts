import type { ErrorRequestHandler, RequestHandler } from 'express';
import multer from 'multer';
import { ZodError } from 'zod';
import { isDomainError } from '../../src/shared/domain/domain-error';
import { zodIssuesToDetails } from '../../src/shared/schemas/api-error';
import { AppError } from '../lib/app-error';
import type { Logger } from '../lib/logger';

/** Unknown /api paths answer in the error shape rather than falling through to the client. */
export const apiNotFound: RequestHandler = (req, res) => {
  res.status(404).json({ error: { code: 'NOT_FOUND', message: `No API route for ${req.method} ${req.path}.` } });
};

/** The one place errors become responses: `{ error: { code, message, details } }`. */
export function errorHandler(logger: Logger): ErrorRequestHandler {
  return (err, req, res, _next) => {
    const send = (status: number, code: string, message: string, details?: unknown) =>
      res.status(status).json({ error: { code, message, ...(details ? { details } : {}) } });
    if (err instanceof AppError) {
      if (err.headers) res.set(err.headers);
      return send(err.status, err.code, err.message, err.details);
    }
    // The engine's refusals that reach a route (an amount beyond a safe integer of cents, say) are the client's
    // input, never a 500: 400 with the engine's code and field paths.
    if (isDomainError(err)) return send(400, err.code, err.message, err.issues);
    if (err instanceof ZodError) {
      return send(400, 'VALIDATION_FAILED', 'Some fields need attention.', zodIssuesToDetails(err.issues));
    }
    if (err instanceof multer.MulterError) {
      const status = err.code === 'LIMIT_FILE_SIZE' ? 413 : 400;
      return send(status, `UPLOAD_${err.code.replace(/^LIMIT_/, '')}`, uploadMessage(err), [
        { path: err.field ?? 'file', message: err.message },
      ]);
    }
    const e = err as { type?: string; status?: number; limit?: number };
    if (e.type === 'entity.too.large') {
      return send(413, 'BODY_TOO_LARGE', `The request body is larger than the limit of ${e.limit} bytes.`);
    }
    if (e.type === 'entity.parse.failed') return send(400, 'MALFORMED_JSON', 'The request body is not valid JSON.');
    if (e.type === 'encoding.unsupported') {
      return send(
        415,
        'UNSUPPORTED_ENCODING',
        'The body is compressed in a way this server does not read; send it as is, or gzip, deflate or br.',
      );
    }
    if (e.type === 'charset.unsupported')
      return send(415, 'UNSUPPORTED_CHARSET', 'The body is not in UTF-8; send JSON in UTF-8.');
    if (typeof e.status === 'number' && e.status >= 400 && e.status < 500) {
      return send(e.status, 'BAD_REQUEST', 'The request could not be read.');
    }
    logger.error({ err, method: req.method, path: req.path }, 'unhandled error');
    return send(500, 'INTERNAL', 'Something went wrong on our side. The change was not saved.');
  };
}

function uploadMessage(err: InstanceType<typeof multer.MulterError>): string {
  if (err.code === 'LIMIT_FILE_SIZE') return 'The file is larger than the upload limit.';
  if (err.code === 'LIMIT_FILE_COUNT') return 'Too many files in one upload.';
  if (err.code === 'LIMIT_UNEXPECTED_FILE') return `Unexpected file field "${err.field}".`;
  return err.message;
}
