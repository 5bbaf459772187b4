import { createReadStream } from 'node:fs';
import { MAX_BASELINE_BYTES } from '../../../src/shared/constants';
import { factorTo, readLandXmlStream, type LandXmlLengthUnit } from '../../../src/shared/landxml';
import { AppError } from '../../lib/app-error';
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
};

const invalid = (message: string, details = [{ path: 'file', message }]) =>
  new AppError(400, 'BASELINE_FILE_INVALID', message, details);

/**
 * Reads the uploaded LandXML with the streaming reader (src/shared/landxml): the first surface with points, its
 * units from <Units> or, for a file without them, the unit the recorder gave. Anything the reader reports refuses the
 * file with each problem's line.
 */
export async function readBaselineFile(
  file: Express.Multer.File | undefined,
  unit?: 'ft' | 'm',
): Promise<BaselineSurface> {
  const up = file as UploadedFile | undefined;
  if (!up)
    throw new AppError(400, 'UPLOAD_MISSING', 'Attach the LandXML file in the "file" field.', [
      { path: 'file', message: 'Required' },
    ]);
  const fileName = safeFileName(up.originalname);
  if (!/\.(xml|landxml)$/i.test(fileName))
    throw invalid(`${fileName}: an original ground surface is a LandXML file (.xml)`);
  const doc = await readLandXmlStream(createReadStream(up.path, { encoding: 'utf8', highWaterMark: 1 << 20 }));
  if (doc.issues.length > 0) {
    throw invalid(
      `${fileName} could not be read as LandXML: ${doc.issues[0]!.message}`,
      doc.issues.map((i) => ({
        path: 'file',
        message: `${i.line > 0 ? `Line ${i.line}, ` : ''}${i.column}: ${i.message}`,
      })),
    );
  }
  const surface = doc.surfaces.find((s) => s.x.length >= 3);
  if (!surface) throw invalid(`${fileName} holds no <Surface> with at least 3 points`);
  let { linearUnit, elevationUnit } = doc.units;
  let unitsFrom: 'file' | 'recorder' = 'file';
  if (doc.units.system === null) {
    if (!unit) {
      const message = `${fileName} has no <Units>: say whether its coordinates and elevations are in feet or metres`;
      throw new AppError(400, 'BASELINE_UNITS_REQUIRED', message, [{ path: 'unit', message }]);
    }
    linearUnit = elevationUnit = unit === 'ft' ? 'foot' : 'meter';
    unitsFrom = 'recorder';
  }
  const n = surface.x.length;
  const xyz = new Float64Array(3 * n);
  for (let i = 0; i < n; i++) {
    xyz[3 * i] = surface.x[i]!;
    xyz[3 * i + 1] = surface.y[i]!;
    xyz[3 * i + 2] = surface.z[i]!;
  }
  return {
    fileName,
    sizeBytes: up.size,
    sha256: up.sha256,
    path: up.path,
    surfaceName: surface.name,
    pointCount: n,
    linearUnit,
    elevationUnit,
    unitsFrom,
    points: Buffer.from(xyz.buffer),
  };
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
