import type { RequestHandler } from 'express';
import multer from 'multer';
import { AppError } from './app-error';

/**
 * Runs a multer handler and answers a multipart body that cannot be read (a cut-off form, a bad part header) with
 * 400 UPLOAD_MALFORMED; multer's own limit errors pass on to the error handler (413 for a file over the limit).
 */
export function readableMultipart(handler: RequestHandler): RequestHandler {
  return (req, res, next) => {
    handler(req, res, (err?: unknown) => {
      if (!err || err instanceof multer.MulterError || err instanceof AppError) return next(err);
      const message = `The upload could not be read as a multipart form: ${err instanceof Error ? err.message : String(err)}.`;
      next(new AppError(400, 'UPLOAD_MALFORMED', message, [{ path: 'file', message }]));
    });
  };
}
