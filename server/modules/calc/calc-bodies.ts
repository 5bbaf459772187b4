import { MessageChannel, type MessagePort } from 'node:worker_threads';
import { createBrotliDecompress, createGunzip, createInflate } from 'node:zlib';
import type { Readable } from 'node:stream';
import type { Request, Response } from 'express';
import type { CalcMethod } from '../../../src/shared/constants';
import { AppError } from '../../lib/app-error';
import type { ComputePool } from '../../lib/compute/compute-pool';
import {
  SURVEY_LIMITS,
  type BodyMessage,
  type ComputeOutcome,
  type ComputeTask,
} from '../../lib/compute/compute-protocol';

const MB = 1024 * 1024;

/**
 * Body limits of POST /api/calc/:method, by method: each about the largest input the method's CALC_LIMITS allow, as
 * JSON with plain numbers, with room to spare. Stated in the README; beyond it the answer is 413.
 */
export const CALC_BODY_LIMITS: Record<CalcMethod, number> = {
  surface: 128 * MB,
  grid: 32 * MB,
  'end-area': 16 * MB,
  'mass-haul': 4 * MB,
  section: 2 * MB,
  trench: 2 * MB,
  'load-count': 2 * MB,
  'pay-app': 2 * MB,
  pit: 64 * 1024,
  convert: 64 * 1024,
  spoil: 64 * 1024,
  variance: 64 * 1024,
};

/** Bodies up to this size are parsed and computed on the request thread; larger ones go to the compute pool. */
export const INLINE_BODY_BYTES = 64 * 1024;

/** A surface upload: its two survey files (SURVEY_LIMITS.fileBytes each; a million shots of `x,y,z` is about 40 MB of text) and the form around them. */
export const SURVEY_BODY_LIMIT = 2 * SURVEY_LIMITS.fileBytes + 64 * 1024;

const tooLarge = (limit: number) =>
  new AppError(413, 'BODY_TOO_LARGE', `The request body is larger than the limit of ${limit} bytes for this method.`);

/** True when the body can be parsed and computed inline: small, declared up front, not compressed. */
export function isSmallBody(req: Request): boolean {
  const length = Number(req.get('content-length'));
  const encoding = (req.get('content-encoding') ?? 'identity').toLowerCase();
  return Number.isFinite(length) && length <= INLINE_BODY_BYTES && encoding === 'identity';
}

function decoded(req: Request): Readable {
  const encoding = (req.get('content-encoding') ?? 'identity').toLowerCase();
  if (encoding === 'identity') return req;
  const inflate =
    encoding === 'gzip'
      ? createGunzip()
      : encoding === 'deflate'
        ? createInflate()
        : encoding === 'br'
          ? createBrotliDecompress()
          : null;
  if (!inflate) {
    throw new AppError(
      415,
      'UNSUPPORTED_ENCODING',
      'The body is compressed in a way this server does not read; send it as is, or gzip, deflate or br.',
    );
  }
  return req.pipe(inflate);
}

/** Stops reading a body we refuse: what is still coming is read and dropped, so the answer reaches the client. */
function drop(req: Request) {
  req.unpipe();
  req.resume();
}

/** Aborts the computation when the client goes away before its answer. */
function abortOnClose(res: Response): AbortController {
  const controller = new AbortController();
  res.on('close', () => {
    if (!res.writableFinished) controller.abort();
  });
  return controller;
}

/**
 * A large JSON body goes to a worker as it arrives, in chunks: the worker parses and computes, so neither the
 * parse nor the computation holds the request thread. A full queue answers 503 before the body is read.
 */
export function computeStreamedJson(
  compute: ComputePool,
  method: CalcMethod,
  req: Request,
  res: Response,
): Promise<ComputeOutcome> {
  return computeStreamed(compute, (port) => ({ kind: 'calc-json', method, port }), CALC_BODY_LIMITS[method], req, res);
}

/** Starts the task, then passes the body's chunks to it through a MessagePort, holding the body to `limit` bytes. */
async function computeStreamed(
  compute: ComputePool,
  task: (port: MessagePort) => ComputeTask,
  limit: number,
  req: Request,
  res: Response,
): Promise<ComputeOutcome> {
  const declared = Number(req.get('content-length'));
  const encoded = (req.get('content-encoding') ?? 'identity').toLowerCase() !== 'identity';
  if (!encoded && Number.isFinite(declared) && declared > limit) {
    drop(req);
    throw tooLarge(limit);
  }
  let source: Readable;
  try {
    source = decoded(req);
  } catch (err) {
    drop(req);
    throw err;
  }
  const { port1, port2 } = new MessageChannel();
  const outcome = compute.run(task(port2), { signal: abortOnClose(res).signal, transfer: [port2] });
  outcome.catch(() => {}); // awaited below; a refusal while the body streams must not count as unhandled meanwhile
  let finished = false;
  const stop = (message: BodyMessage) => {
    if (finished) return;
    finished = true;
    port1.postMessage(message);
    port1.close();
    source.removeAllListeners('data');
    if (source !== req) source.destroy();
    drop(req);
  };
  const received = new Promise<void>((resolve, reject) => {
    let bytes = 0;
    source.on('data', (chunk: Buffer) => {
      bytes += chunk.length;
      if (bytes <= limit) return port1.postMessage(chunk);
      stop({ failed: 'too large' });
      reject(tooLarge(limit));
    });
    source.on('end', () => {
      if (finished) return;
      finished = true;
      port1.postMessage({ end: true } satisfies BodyMessage);
      port1.close();
      resolve();
    });
    source.on('error', () => {
      stop({ failed: 'unreadable' });
      reject(
        new AppError(
          400,
          'BODY_UNREADABLE',
          'The request body could not be read (a cut-off or badly compressed body).',
        ),
      );
    });
  });
  try {
    await Promise.race([received, outcome]);
    await received;
  } catch (err) {
    stop({ failed: 'refused' });
    throw err;
  }
  return outcome;
}

/**
 * POST /api/calc/surface as a multipart form: `unit`, and the files `existing` and `design` (CSV, x, y, z a line).
 * The form's bytes stream through to a worker thread, which reads the form and the files into typed arrays and
 * computes: this thread only passes chunks on.
 */
export function computeSurveyUpload(compute: ComputePool, req: Request, res: Response): Promise<ComputeOutcome> {
  const contentType = req.get('content-type') ?? '';
  return computeStreamed(
    compute,
    (port) => ({ kind: 'surface-files', contentType, port }),
    SURVEY_BODY_LIMIT,
    req,
    res,
  );
}
