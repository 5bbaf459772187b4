import { createHash, randomUUID } from 'node:crypto';
import { createWriteStream, mkdirSync } from 'node:fs';
import { rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { Transform } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { Request, RequestHandler } from 'express';
import multer from 'multer';
import { AppError } from './app-error';
import { readableMultipart } from './multipart';

/** Limits of the upload path: one request's total, one project's stored files, and where files wait meanwhile. */
export type UploadLimits = { requestMaxBytes: number; projectQuotaBytes: number; tempDir: string };

export const DEFAULT_UPLOAD_REQUEST_MAX_BYTES = 100 * 1024 * 1024;
export const DEFAULT_PROJECT_QUOTA_BYTES = 5 * 1024 * 1024 * 1024;

export function uploadLimits(o: Partial<UploadLimits> = {}): UploadLimits {
  return {
    requestMaxBytes: o.requestMaxBytes ?? DEFAULT_UPLOAD_REQUEST_MAX_BYTES,
    projectQuotaBytes: o.projectQuotaBytes ?? DEFAULT_PROJECT_QUOTA_BYTES,
    tempDir: o.tempDir ?? path.join(os.tmpdir(), 'tallyard-uploads'),
  };
}

/** A file as it arrived: in a temp file (removed when the response ends), with its size and SHA-256. */
export type UploadedFile = Express.Multer.File & { path: string; size: number; sha256: string };

/** Bytes for a message: `5 GB`, `19.9 MB`, `512 bytes` (decimal units, as a person reads them). */
export function formatBytes(n: number): string {
  if (n >= 1e9) return `${Number((n / 1e9).toFixed(2))} GB`;
  if (n >= 1e6) return `${Number((n / 1e6).toFixed(1))} MB`;
  if (n >= 1e3) return `${Number((n / 1e3).toFixed(1))} kB`;
  return `${n} bytes`;
}

type RequestState = { total: number; paths: string[]; closed: boolean };
const STATE = new WeakMap<Request, RequestState>();

/**
 * multer storage that streams each part to a temp file, hashing it (SHA-256) on the way and counting the request's
 * total; past `requestMaxBytes` the upload stops with 413 UPLOAD_TOO_LARGE. Nothing is held in memory.
 */
function tempFileStorage(limits: UploadLimits): multer.StorageEngine {
  mkdirSync(limits.tempDir, { recursive: true });
  return {
    _handleFile(req, file, cb) {
      const state = STATE.get(req)!;
      const target = path.join(limits.tempDir, randomUUID());
      state.paths.push(target);
      const hash = createHash('sha256');
      let size = 0;
      const meter = new Transform({
        transform(chunk: Buffer, _enc, done) {
          state.total += chunk.length;
          if (state.total > limits.requestMaxBytes) return done(tooLarge(limits.requestMaxBytes));
          size += chunk.length;
          hash.update(chunk);
          done(null, chunk);
        },
      });
      // A write that ends after the response closed (the client went away) removes its own file.
      const late = () => (state.closed ? rm(target, { force: true }).catch(() => undefined) : undefined);
      pipeline(file.stream, meter, createWriteStream(target, { flags: 'wx' })).then(
        () => (late(), cb(null, { path: target, size, sha256: hash.digest('hex') } as Partial<UploadedFile>)),
        (err: unknown) => (late(), cb(err as Error)),
      );
    },
    _removeFile(_req, file, cb) {
      rm(file.path, { force: true }).then(() => cb(null), cb);
    },
  };
}

function tooLarge(max: number): AppError {
  const message = `One upload may carry at most ${formatBytes(max)} in all; send fewer or smaller files at a time.`;
  return new AppError(413, 'UPLOAD_TOO_LARGE', message, [{ path: 'files', message }]);
}

/** The app's limits (set by createApp from its deps or the environment), or the defaults. */
export function limitsOf(req: Request): UploadLimits {
  return (req.app.locals.uploadLimits as UploadLimits | undefined) ?? DEFAULT_LIMITS;
}
const DEFAULT_LIMITS = uploadLimits();

/**
 * The one entry point of every upload route: reads the multipart body (`pick` chooses multer's `.array` or
 * `.single`), streams files to temp files, and removes every temp file of the request when its response ends,
 * whatever happened (stored files were copied to storage by then). Limits come from the app (`limitsOf`).
 */
export function streamedUpload(
  pick: (m: multer.Multer) => RequestHandler,
  perFile: multer.Options['limits'],
): RequestHandler {
  const built = new WeakMap<UploadLimits, RequestHandler>();
  return (req, res, next) => {
    const limits = limitsOf(req);
    let handler = built.get(limits);
    if (!handler) {
      handler = readableMultipart(pick(multer({ storage: tempFileStorage(limits), limits: perFile })));
      built.set(limits, handler);
    }
    const state: RequestState = { total: 0, paths: [], closed: false };
    STATE.set(req, state);
    res.once('close', () => {
      state.closed = true;
      void Promise.all(state.paths.map((p) => rm(p, { force: true }).catch(() => undefined)));
    });
    handler(req, res, next);
  };
}

/** 413 PROJECT_QUOTA_EXCEEDED when the new files would take a project past its storage quota. */
export function assertProjectQuota(usedBytes: number, addingBytes: number, quotaBytes: number): void {
  if (usedBytes + addingBytes <= quotaBytes) return;
  const message = `This project stores ${formatBytes(usedBytes)} of its ${formatBytes(quotaBytes)} allowance; these files (${formatBytes(addingBytes)}) would take it past that. Remove files no longer needed or ask the administrator to raise PROJECT_STORAGE_QUOTA_BYTES.`;
  throw new AppError(413, 'PROJECT_QUOTA_EXCEEDED', message, [{ path: 'files', message }]);
}
