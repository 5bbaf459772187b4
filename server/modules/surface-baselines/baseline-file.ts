import { createReadStream } from 'node:fs';
import { readFile, rm } from 'node:fs/promises';
import { MAX_BASELINE_BYTES } from '../../../src/shared/constants';
import {
  factorTo,
  readLandXmlStream,
  packXyz,
  readPointCsv,
  type LandXmlIssue,
  type LandXmlLengthUnit,
  type PointOrder,
} from '../../../src/shared/landxml';
import { DomainError } from '../../../src/shared/domain/domain-error';
import { buildTin } from '../../../src/shared/domain/earthwork/surface-tin';
import { AppError } from '../../lib/app-error';
import type { ComputePool } from '../../lib/compute/compute-pool';
import type { PointFileRead } from '../../lib/compute/compute-protocol';
import { streamedUpload, type UploadedFile } from '../../lib/upload';
import { safeFileName } from '../tallies/evidence-files';

/** One LandXML file in the `file` field (the shared upload path: temp file, SHA-256, request total). */
export const baselineUpload = streamedUpload((m) => m.single('file'), {
  fileSize: MAX_BASELINE_BYTES,
  files: 1,
  fields: 4,
});

export type BaselineSurface = {
  fileName: string;
  sizeBytes: number;
  sha256: string;
  path: string;
  surfaceName: string;
  pointCount: number;
  linearUnit: LandXmlLengthUnit;
  elevationUnit: LandXmlLengthUnit;
  unitsFrom: 'file' | 'recorder';
  /** x, y, z little-endian float64 triples in the file's units. */
  points: Buffer;
  /** LandXML faces as given (0-based uint32 triples), or null. */
  faces: Buffer | null;
  /** LandXML breaklines of a surface without faces, [x, y, z] in the file's units, or null. */
  breaklines: [number, number, number][][] | null;
  contentType: 'application/xml' | 'text/csv';
  /** A point file's column order; null for LandXML. */
  pointOrder: PointOrder | null;
};

const invalid = (message: string, details = [{ path: 'file', message }]) =>
  new AppError(400, 'BASELINE_FILE_INVALID', message, details);

const refuseIssues = (fileName: string, what: string, issues: LandXmlIssue[]) =>
  invalid(
    `${fileName} could not be read as ${what}: ${issues[0]!.line > 0 ? `line ${issues[0]!.line}, ` : ''}${issues[0]!.column}: ${issues[0]!.message}`,
    issues.map((i) => ({
      path: 'file',
      message: `${i.line > 0 ? `Line ${i.line}, ` : ''}${i.column}: ${i.message}`,
    })),
  );

const packed = (x: ArrayLike<number>, y: ArrayLike<number>, z: ArrayLike<number>) =>
  Buffer.from(packXyz(x, y, z).buffer);

const unitsRequired = (fileName: string, why: string) => {
  const message = `${fileName} ${why}: say whether its coordinates and elevations are in feet or metres`;
  return new AppError(400, 'BASELINE_UNITS_REQUIRED', message, [{ path: 'unit', message }]);
};

/**
 * A point file (CSV: point, northing, easting, elevation, description in PNEZD or PENZD order): the order from a
 * header naming the columns, else as the recorder chose it (400 BASELINE_ORDER_REQUIRED asks); a point file has no
 * units, so the recorder gives them. Bad values (NaN, infinite), repeated points and the same plan position with
 * another elevation are refused naming the line (src/shared/landxml/point-csv.ts).
 */
async function readPointFileBaseline(
  up: UploadedFile,
  fileName: string,
  unit: 'ft' | 'm' | undefined,
  order: PointOrder | undefined,
  compute?: ComputePool,
): Promise<BaselineSurface> {
  const read = compute && up.size > INLINE_POINT_FILE_BYTES ? await pointFileInPool(up, order, compute) : undefined;
  try {
    const f: PointFileBasics = read ?? inlinePointFile(await readFile(up.path, 'utf8'), order);
    if (f.needsOrder) {
      const message = `${fileName} has no header naming its columns: say whether it is PNEZD (northing first) or PENZD (easting first)`;
      throw new AppError(400, 'BASELINE_ORDER_REQUIRED', message, [{ path: 'order', message }]);
    }
    if (f.issues.length > 0) throw refuseIssues(fileName, 'a point file', f.issues);
    if (f.count < 3) throw invalid(`${fileName} holds fewer than 3 points`);
    if (!unit) throw unitsRequired(fileName, 'is a point file, which carries no units');
    const u: LandXmlLengthUnit = unit === 'ft' ? 'foot' : 'meter';
    return {
      fileName,
      sizeBytes: up.size,
      sha256: up.sha256,
      path: up.path,
      surfaceName: `Points (${f.order})`,
      pointCount: f.count,
      linearUnit: u,
      elevationUnit: u,
      unitsFrom: 'recorder',
      points: f.points ?? (await readFile(read!.packedPath!)),
      faces: null,
      breaklines: null,
      contentType: 'text/csv',
      pointOrder: f.order,
    };
  } finally {
    if (read?.packedPath) await rm(read.packedPath, { force: true });
  }
}

/** Point files above this size are read in the compute pool, so a large one never holds the request thread. */
const INLINE_POINT_FILE_BYTES = 1024 * 1024;

type PointFileBasics = Omit<PointFileRead, 'packedPath'> & { points?: Buffer };

function inlinePointFile(text: string, order: PointOrder | undefined): PointFileBasics {
  const f = readPointCsv(text, order);
  return {
    order: f.order,
    needsOrder: f.needsOrder,
    issues: f.issues,
    count: f.x.length,
    points: packed(f.x, f.y, f.z),
  };
}

async function pointFileInPool(up: UploadedFile, order: PointOrder | undefined, compute: ComputePool) {
  const outcome = await compute.run({ kind: 'point-file', path: up.path, order: order ?? null });
  if (!outcome.ok) throw new AppError(outcome.status, outcome.code, outcome.message, outcome.details);
  return JSON.parse(outcome.json) as PointFileRead;
}

/**
 * Reads the uploaded LandXML with the streaming reader (src/shared/landxml): the first surface with points, its
 * faces (used as given) or breaklines, its units from <Units> or, for a file without them, the unit the recorder
 * gave. A .csv or .txt file is a point file (readPointFileBaseline). Anything the reader reports refuses the file
 * with each problem's line.
 */
export async function readBaselineFile(
  file: Express.Multer.File | undefined,
  unit?: 'ft' | 'm',
  order?: PointOrder,
  compute?: ComputePool,
): Promise<BaselineSurface> {
  const up = file as UploadedFile | undefined;
  if (!up)
    throw new AppError(400, 'UPLOAD_MISSING', 'Attach the LandXML file in the "file" field.', [
      { path: 'file', message: 'Required' },
    ]);
  const fileName = safeFileName(up.originalname);
  if (/\.(csv|txt)$/i.test(fileName)) return readPointFileBaseline(up, fileName, unit, order, compute);
  if (!/\.(xml|landxml)$/i.test(fileName))
    throw invalid(`${fileName}: an original ground surface is a LandXML file (.xml) or a point file (.csv)`);
  const doc = await readLandXmlStream(createReadStream(up.path, { encoding: 'utf8', highWaterMark: 1 << 20 }));
  if (doc.issues.length > 0) throw refuseIssues(fileName, 'LandXML', doc.issues);
  const surface = doc.surfaces.find((s) => s.x.length >= 3);
  if (!surface) throw invalid(`${fileName} holds no <Surface> with at least 3 points`);
  if (surface.faces.length > 0) await checkFaces(fileName, surface, compute);
  let { linearUnit, elevationUnit } = doc.units;
  let unitsFrom: 'file' | 'recorder' = 'file';
  if (doc.units.system === null) {
    if (!unit) throw unitsRequired(fileName, 'has no <Units>');
    linearUnit = elevationUnit = unit === 'ft' ? 'foot' : 'meter';
    unitsFrom = 'recorder';
  }
  return {
    fileName,
    sizeBytes: up.size,
    sha256: up.sha256,
    path: up.path,
    surfaceName: surface.name,
    pointCount: surface.x.length,
    linearUnit,
    elevationUnit,
    unitsFrom,
    points: packed(surface.x, surface.y, surface.z),
    faces:
      surface.faces.length > 0
        ? Buffer.from(surface.faces.buffer, surface.faces.byteOffset, surface.faces.byteLength)
        : null,
    breaklines: surface.faces.length === 0 && surface.breaklines.length > 0 ? surface.breaklines : null,
    contentType: 'application/xml',
    pointOrder: null,
  };
}

/** Face sets larger than this are checked in the compute pool, off the request thread (a million faces take seconds). */
const INLINE_FACES = 20_000;

/**
 * The surface's faces make one surface (the engine's own checks, surface-tin.ts: each face names points of the
 * surface, no two overlap in plan), so a baseline is never accepted that no tally could measure against.
 */
async function checkFaces(
  fileName: string,
  s: { name: string; x: Float64Array; y: Float64Array; faces: Uint32Array },
  compute?: ComputePool,
): Promise<void> {
  let problem: string | null = null;
  if (compute && s.faces.length / 3 > INLINE_FACES) {
    const outcome = await compute.run({ kind: 'surface-faces', x: s.x, y: s.y, faces: s.faces });
    if (!outcome.ok) problem = outcome.message;
  } else {
    try {
      buildTin({ x: s.x, y: s.y, z: new Float64Array(s.x.length), faces: s.faces }, s.x[0]!, s.y[0]!, 'existing');
    } catch (e) {
      if (!(e instanceof DomainError)) throw e;
      problem = e.message;
    }
  }
  if (problem) throw invalid(`${fileName}, surface "${s.name}": ${problem.replace(' of the existing surface', '')}`);
}

/** A stored baseline's faces as row triples, or undefined without faces. */
export function baselineFaces(b: { faces: Buffer | null }): [number, number, number][] | undefined {
  if (!b.faces || b.faces.byteLength === 0) return undefined;
  const copy = new Uint8Array(b.faces.byteLength);
  copy.set(b.faces);
  const ids = new Uint32Array(copy.buffer);
  const rows: [number, number, number][] = new Array(ids.length / 3);
  for (let i = 0; i < rows.length; i++) rows[i] = [ids[3 * i]!, ids[3 * i + 1]!, ids[3 * i + 2]!];
  return rows;
}

/** A stored baseline's breaklines in the worksheet's unit, or undefined without them. */
export function baselineBreaklines(
  b: { breaklines: [number, number, number][][] | null; linearUnit: string; elevationUnit: string },
  unit: 'ft' | 'm',
): [number, number, number][][] | undefined {
  if (!b.breaklines || b.breaklines.length === 0) return undefined;
  const kp = factorTo(b.linearUnit as LandXmlLengthUnit, unit);
  const kz = factorTo(b.elevationUnit as LandXmlLengthUnit, unit);
  return b.breaklines.map((l) => l.map(([x, y, z]) => [x * kp, y * kp, z * kz] as [number, number, number]));
}

/** A stored baseline's points as [x, y, z] rows in the worksheet's unit (the reader's exact factors). */
export function baselineRows(
  b: { points: Buffer; linearUnit: string; elevationUnit: string },
  unit: 'ft' | 'm',
): [number, number, number][] {
  const copy = new Uint8Array(b.points.byteLength);
  copy.set(b.points);
  const xyz = new Float64Array(copy.buffer);
  const kp = factorTo(b.linearUnit as LandXmlLengthUnit, unit);
  const kz = factorTo(b.elevationUnit as LandXmlLengthUnit, unit);
  const rows: [number, number, number][] = new Array(xyz.length / 3);
  for (let i = 0; i < rows.length; i++) rows[i] = [xyz[3 * i]! * kp, xyz[3 * i + 1]! * kp, xyz[3 * i + 2]! * kz];
  return rows;
}
