import { availableParallelism } from 'node:os';
import { fileURLToPath } from 'node:url';
import type { MessagePort } from 'node:worker_threads';
import { Piscina } from 'piscina';
import { AppError } from '../app-error';
import type { ComputeOutcome, ComputeTask } from './compute-protocol';

/** Set by scripts/build-server.ts: the bundled worker beside the bundled server, relative to this module. Undefined under tsx. */
declare const __TALLYARD_COMPUTE_WORKER__: string | undefined;

function workerFile(): string {
  if (typeof __TALLYARD_COMPUTE_WORKER__ !== 'undefined')
    return fileURLToPath(new URL(__TALLYARD_COMPUTE_WORKER__, import.meta.url));
  return fileURLToPath(new URL('./compute-worker.mjs', import.meta.url));
}

export type ComputeLimits = {
  /** Worker threads (each runs one calculation at a time). */
  threads: number;
  /** Calculations waiting for a thread; beyond it a request is refused with 503 at once. */
  queue: number;
  /** Longest a calculation may run, its upload included; then its thread is stopped and the answer is 503. */
  timeLimitMs: number;
};

/** One thread fewer than the cores (the request thread keeps one), at least one, at most four. */
export const DEFAULT_COMPUTE_LIMITS: ComputeLimits = {
  threads: Math.max(1, Math.min(4, availableParallelism() - 1)),
  queue: 8,
  timeLimitMs: 60_000,
};

/** Seconds a refused client is told to wait (Retry-After). */
export const RETRY_AFTER_SECONDS = 5;

export type ComputePool = {
  /**
   * Runs a task on a worker thread. Refuses with 503 COMPUTE_BUSY when every thread is busy and the queue is full,
   * and 503 COMPUTE_TIMED_OUT when the time limit passes (the worker is stopped). `signal` cancels it (the client
   * went away). Resolves with the worker's outcome (a result as JSON text, or a refusal in API terms).
   */
  run(task: ComputeTask, options?: { signal?: AbortSignal; transfer?: MessagePort[] }): Promise<ComputeOutcome>;
  readonly limits: ComputeLimits;
  close(): Promise<void>;
};

export const computeBusy = () =>
  new AppError(
    503,
    'COMPUTE_BUSY',
    `The calculation queue is full; try again in ${RETRY_AFTER_SECONDS} seconds.`,
    undefined,
    { 'Retry-After': String(RETRY_AFTER_SECONDS) },
  );
export const computeTimedOut = (ms: number) =>
  new AppError(
    503,
    'COMPUTE_TIMED_OUT',
    `The calculation ran longer than the limit of ${ms / 1000} s and was stopped; send a smaller input or try later.`,
    undefined,
    {
      'Retry-After': String(RETRY_AFTER_SECONDS),
    },
  );

/** A piscina pool of worker threads for the quantity engine, with a time limit per call and a queue limit. */
export function createComputePool(limits: Partial<ComputeLimits> = {}): ComputePool {
  const l: ComputeLimits = { ...DEFAULT_COMPUTE_LIMITS, ...limits };
  // Threads start when first needed and end after a minute idle; the queue is counted here (piscina's own
  // count also includes threads still starting). The threads run at a lower priority (nice +10, Linux and macOS),
  // so on a busy machine the request thread is scheduled first.
  const pool = new Piscina<ComputeTask, ComputeOutcome>({
    filename: workerFile(),
    minThreads: 0,
    maxThreads: l.threads,
    idleTimeout: 60_000,
    maxQueue: Infinity,
    niceIncrement: 10,
  });
  let inFlight = 0;
  return {
    limits: l,
    async run(task, options = {}) {
      if (inFlight >= l.threads + l.queue) throw computeBusy();
      inFlight++;
      const timeout = AbortSignal.timeout(l.timeLimitMs);
      const signal = options.signal ? AbortSignal.any([timeout, options.signal]) : timeout;
      try {
        return await pool.run(task, { signal, transferList: options.transfer });
      } catch (err) {
        if (timeout.aborted) throw computeTimedOut(l.timeLimitMs);
        throw err;
      } finally {
        inFlight--;
      }
    },
    close: () => pool.close({ force: true }),
  };
}

let shared: ComputePool | undefined;

/** The process's pool with the default limits, made when first asked for (threads start only when needed). */
export function sharedComputePool(): ComputePool {
  shared ??= createComputePool();
  return shared;
}
