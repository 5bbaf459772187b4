import type { MessagePort } from 'node:worker_threads';
import type { ApiErrorDetail } from '../../../src/shared/schemas/api-error';
import type { LandXmlIssue, PointOrder } from '../../../src/shared/landxml';

/** The fields of a surface upload that carry survey files. */
export const SURVEY_FIELDS = ['existing', 'design'] as const;

/** What the main thread asks a compute worker to do. */
export type ComputeTask =
  /** A calc method on an already parsed body (tally saves with large worksheets). */
  | { kind: 'calc'; method: string; input: unknown }
  /** A calc method whose JSON body arrives through `port` in chunks (Uint8Array), then `{ end: true }`. */
  | { kind: 'calc-json'; method: string; port: MessagePort }
  /** Surface to surface from a multipart form (`unit`, files `existing` and `design`) streamed through `port`. */
  | { kind: 'surface-files'; contentType: string; port: MessagePort }
  /** A surface's faces checked as the volume engine builds them (points there, no overlap in plan): a baseline's. */
  | { kind: 'surface-faces'; x: Float64Array; y: Float64Array; faces: Uint32Array }
  /**
   * A point file (CSV) read from the uploaded temp file at `path`: the answer is `PointFileRead` as JSON, the
   * points packed beside it at `${path}.xyz` (x, y, z float64 triples) when the file reads clean.
   */
  | { kind: 'point-file'; path: string; order: PointOrder | null };

/** What the compute pool read from a point file; the points themselves are in `packedPath`, when there. */
export type PointFileRead = {
  order: PointOrder | null;
  needsOrder: boolean;
  issues: LandXmlIssue[];
  count: number;
  packedPath: string | null;
};

/** Limits of a survey upload: each file, and the form's parts. */
export const SURVEY_LIMITS = { fileBytes: 64 * 1024 * 1024, files: 2, fields: 2, parts: 6, fieldBytes: 1024 } as const;

/** Chunks of a request body (JSON or a multipart form), then its end; `failed` when the upload broke off (the task then ends quietly). */
export type BodyMessage = Uint8Array | { end: true } | { failed: string };

/**
 * The answer: the result already as JSON text (the main thread sends it as is), or a refusal in the API's error
 * terms. Errors cross the thread boundary as plain data, never as thrown objects.
 */
export type ComputeOutcome =
  { ok: true; json: string } | { ok: false; status: number; code: string; message: string; details?: ApiErrorDetail[] };
