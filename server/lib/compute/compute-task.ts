import { readFile, writeFile } from 'node:fs/promises';
import type { MessagePort } from 'node:worker_threads';
import { LENGTH_UNITS } from '../../../src/shared/constants';
import { runCalc } from '../../../src/shared/domain/calc';
import { isDomainError } from '../../../src/shared/domain/domain-error';
import { surfaceVolumeFromPoints } from '../../../src/shared/domain/earthwork/surface';
import { buildTin } from '../../../src/shared/domain/earthwork/surface-tin';
import { packXyz, readPointCsv, type PointOrder } from '../../../src/shared/landxml';
import {
  SURVEY_FIELDS,
  type BodyMessage,
  type ComputeOutcome,
  type ComputeTask,
  type PointFileRead,
} from './compute-protocol';
import { readSurveyForm } from './survey-form';

const refuse = (
  status: number,
  code: string,
  message: string,
  details?: { path: string; message: string }[],
): ComputeOutcome => ({ ok: false, status, code, message, details });

/** Runs the engine and turns its refusals into the API's terms (400, or 404 for an unknown method). */
function calc(method: string, input: unknown): ComputeOutcome {
  try {
    return { ok: true, json: JSON.stringify(runCalc(method, input)) };
  } catch (err) {
    if (!isDomainError(err)) throw err;
    return refuse(err.code === 'UNKNOWN_CALC_METHOD' ? 404 : 400, err.code, err.message, err.issues);
  }
}

/** Feeds the chunks of a request body to `write` until its end; resolves false when the sender gave up. */
function receive(port: MessagePort, write: (chunk: Uint8Array) => void): Promise<boolean> {
  return new Promise((resolve) => {
    port.on('message', (m: BodyMessage) => {
      if (m instanceof Uint8Array) return write(m);
      port.close();
      resolve('end' in m);
    });
  });
}

async function calcJson(method: string, port: MessagePort): Promise<ComputeOutcome> {
  const chunks: Uint8Array[] = [];
  if (!(await receive(port, (c) => chunks.push(c))))
    return refuse(400, 'BODY_INCOMPLETE', 'The request body ended before it was complete.');
  let input: unknown;
  try {
    input = JSON.parse(new TextDecoder('utf-8', { fatal: true }).decode(Buffer.concat(chunks)));
  } catch {
    return refuse(400, 'MALFORMED_JSON', 'The request body is not valid JSON in UTF-8.');
  }
  chunks.length = 0;
  return calc(method, input);
}

async function surfaceFiles(contentType: string, port: MessagePort): Promise<ComputeOutcome> {
  const form = readSurveyForm(contentType);
  const complete = await receive(port, form.write);
  if (!complete) return refuse(400, 'BODY_INCOMPLETE', 'The upload ended before it was complete.');
  form.end();
  const read = await form.done;
  if ('ok' in read) return read;
  const missing = SURVEY_FIELDS.filter((f) => !read.files.has(f));
  if (missing.length > 0) {
    return refuse(
      400,
      'UPLOAD_MISSING',
      'Attach both surveys as files "existing" and "design".',
      missing.map((path) => ({ path, message: 'Required' })),
    );
  }
  const [existing, design] = SURVEY_FIELDS.map((f) => read.readers.get(f)!.end());
  const issues = SURVEY_FIELDS.flatMap((f) => read.readers.get(f)!.issues);
  const unit = read.unit;
  if (!(LENGTH_UNITS as readonly unknown[]).includes(unit))
    issues.unshift({ path: 'unit', message: `Use one of: ${LENGTH_UNITS.join(', ')}` });
  if (issues.length > 0 || !existing || !design)
    return refuse(400, 'VALIDATION_FAILED', `${issues[0]!.path}: ${issues[0]!.message}`, issues);
  try {
    return {
      ok: true,
      json: JSON.stringify(surfaceVolumeFromPoints(unit as (typeof LENGTH_UNITS)[number], existing, design)),
    };
  } catch (err) {
    if (!isDomainError(err)) throw err;
    return refuse(400, err.code, err.message, err.issues);
  }
}

/** Builds the surface of the faces as the engine does; its refusal (INVALID_FACE naming the faces) as a 400. */
function surfaceFaces(x: Float64Array, y: Float64Array, faces: Uint32Array): ComputeOutcome {
  try {
    buildTin({ x, y, z: new Float64Array(x.length), faces }, x[0] ?? 0, y[0] ?? 0, 'existing');
    return { ok: true, json: 'null' };
  } catch (err) {
    if (!isDomainError(err)) throw err;
    return refuse(400, err.code, err.message, err.issues);
  }
}

/** A point file parsed off the request thread; clean points are packed into a file beside the upload. */
async function pointFile(path: string, order: PointOrder | null): Promise<ComputeOutcome> {
  const f = readPointCsv(await readFile(path, 'utf8'), order ?? undefined);
  const read: PointFileRead = {
    order: f.order,
    needsOrder: f.needsOrder,
    issues: f.issues,
    count: f.x.length,
    packedPath: null,
  };
  if (!f.needsOrder && f.issues.length === 0) {
    read.packedPath = `${path}.xyz`;
    await writeFile(read.packedPath, Buffer.from(packXyz(f.x, f.y, f.z).buffer));
  }
  return { ok: true, json: JSON.stringify(read) };
}

/** The compute pool's task (a worker thread): the quantity engine, off the server's request thread. */
export default async function computeTask(task: ComputeTask): Promise<ComputeOutcome> {
  if (task.kind === 'calc') return calc(task.method, task.input);
  if (task.kind === 'calc-json') return calcJson(task.method, task.port);
  if (task.kind === 'surface-faces') return surfaceFaces(task.x, task.y, task.faces);
  if (task.kind === 'point-file') return pointFile(task.path, task.order);
  return surfaceFiles(task.contentType, task.port);
}
