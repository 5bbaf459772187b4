import busboy from 'busboy';
import type { ApiErrorDetail } from '../../../src/shared/schemas/api-error';
import { SURVEY_FIELDS, SURVEY_LIMITS, type ComputeOutcome } from './compute-protocol';
import { SurveyReader } from './survey-reader';

export type SurveyForm = { unit: unknown; readers: Map<string, SurveyReader>; files: Set<string> };

const refusal = (status: number, code: string, message: string, details: ApiErrorDetail[]): ComputeOutcome => ({
  ok: false,
  status,
  code,
  message,
  details,
});

/**
 * Reads a multipart survey form in the worker as its bytes arrive (busboy): each survey file goes line by line
 * into its SurveyReader, so neither the form nor the files are ever held whole. Resolves with the form, or with a
 * refusal in the API's terms (413 for a file over the limit, 400 for a form that cannot be read).
 */
export function readSurveyForm(contentType: string): {
  write: (chunk: Uint8Array) => void;
  end: () => void;
  done: Promise<SurveyForm | ComputeOutcome>;
} {
  const readers = new Map(SURVEY_FIELDS.map((f) => [f as string, new SurveyReader(f)]));
  let unit: unknown;
  const files = new Set<string>();
  let refused: ComputeOutcome | null = null;
  const refuse = (r: ComputeOutcome) => (refused ??= r);
  let bb: busboy.Busboy;
  try {
    bb = busboy({
      headers: { 'content-type': contentType },
      limits: {
        fileSize: SURVEY_LIMITS.fileBytes,
        files: SURVEY_LIMITS.files,
        fields: SURVEY_LIMITS.fields,
        parts: SURVEY_LIMITS.parts,
        fieldSize: SURVEY_LIMITS.fieldBytes,
      },
    });
  } catch (err) {
    const message = `The upload could not be read as a multipart form: ${err instanceof Error ? err.message : String(err)}.`;
    const r = refusal(400, 'UPLOAD_MALFORMED', message, [{ path: 'file', message }]);
    return { write: () => {}, end: () => {}, done: Promise.resolve(r) };
  }
  const done = new Promise<SurveyForm | ComputeOutcome>((resolve) => {
    bb.on('field', (name, value) => {
      if (name === 'unit') unit = value;
    });
    bb.on('file', (name, stream) => {
      const reader = readers.get(name);
      if (!reader) {
        refuse(
          refusal(400, 'UPLOAD_UNEXPECTED_FILE', `Unexpected file field "${name}".`, [
            { path: name, message: 'Use the fields "existing" and "design"' },
          ]),
        );
        stream.resume();
        return;
      }
      files.add(name);
      stream.on('data', (chunk: Buffer) => reader.push(chunk));
      stream.on('error', () => {}); // a cut-off form: busboy reports it once, as the form's own error
      stream.on('limit', () =>
        refuse(
          refusal(413, 'UPLOAD_FILE_SIZE', 'The file is larger than the upload limit.', [
            { path: name, message: `At most ${SURVEY_LIMITS.fileBytes} bytes a survey` },
          ]),
        ),
      );
    });
    const tooMany = (what: string) => () =>
      refuse(
        refusal(400, 'UPLOAD_PART_COUNT', `Too many ${what} in one upload.`, [
          { path: 'file', message: `Send unit, existing and design only` },
        ]),
      );
    bb.on('filesLimit', tooMany('files'));
    bb.on('fieldsLimit', tooMany('fields'));
    bb.on('partsLimit', tooMany('parts'));
    bb.on('error', (err) => {
      const message = `The upload could not be read as a multipart form: ${err instanceof Error ? err.message : String(err)}.`;
      resolve(refused ?? refusal(400, 'UPLOAD_MALFORMED', message, [{ path: 'file', message }]));
    });
    bb.on('close', () => resolve(refused ?? { unit, readers, files }));
  });
  return { write: (chunk) => bb.write(chunk), end: () => bb.end(), done };
}
