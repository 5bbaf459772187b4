import { readFile } from 'node:fs/promises';
import { MAX_CSV_UPLOAD_BYTES } from '../../src/shared/constants';
import { AppError } from './app-error';
import { nonCsvFormat } from './file-signature';
import { streamedUpload } from './upload';

/** One CSV file, at most MAX_CSV_UPLOAD_BYTES, through the shared upload path (a temp file removed afterwards). */
export const csvUpload = streamedUpload((m) => m.single('file'), {
  fileSize: MAX_CSV_UPLOAD_BYTES,
  files: 1,
  fields: 10,
});

const CSV_TYPES = ['text/csv', 'text/plain', 'application/vnd.ms-excel', 'application/csv', 'application/octet-stream'];
const SAVE_AS = 'Save it as "CSV UTF-8" and upload again.';

export type CsvDecode = { ok: true; text: string } | { ok: false; problem: string };

/**
 * Byte offset where the first ill-formed UTF-8 sequence starts: a lenient decoder puts U+FFFD for it (WHATWG
 * Encoding, "UTF-8 decode"), and the text before it re-encodes to the same bytes. A U+FFFD the file really holds
 * (EF BF BD) is skipped.
 */
function firstInvalidUtf8(bytes: Buffer): number {
  const text = new TextDecoder('utf-8').decode(bytes);
  for (let i = text.indexOf('\uFFFD'); i !== -1; i = text.indexOf('\uFFFD', i + 1)) {
    const at = Buffer.byteLength(text.slice(0, i));
    if (!(bytes[at] === 0xef && bytes[at + 1] === 0xbf && bytes[at + 2] === 0xbd)) return at;
  }
  return 0;
}

/** UTF-16 without a byte-order mark: ASCII text has a zero in every other byte. */
function looksLikeUtf16(bytes: Buffer): boolean {
  const sample = bytes.subarray(0, 2048);
  let even = 0;
  let odd = 0;
  sample.forEach((b, i) => (b === 0 ? (i % 2 === 0 ? even++ : odd++) : undefined));
  return Math.max(even, odd) > sample.length / 4;
}

/**
 * Reads CSV bytes as UTF-8 text (a UTF-8 byte-order mark is allowed). Refuses, naming the problem: a file whose
 * magic bytes say it is another format (a zip, a PDF, an image: file-type's signatures), UTF-16 (by its byte-order
 * mark, Unicode 15 section 23.8, or its zero bytes), other binary content, and bytes that are not UTF-8, with the
 * first bad byte and its line (a Windows-1252 export, most often).
 */
export async function decodeCsvBytes(bytes: Buffer): Promise<CsvDecode> {
  const bom = bytes.subarray(0, 2).toString('hex').toUpperCase();
  if (bom === 'FFFE' || bom === 'FEFF')
    return { ok: false, problem: `is UTF-16 text (byte-order mark ${bom}), not UTF-8. ${SAVE_AS}` };
  const format = await nonCsvFormat(bytes);
  if (format) return { ok: false, problem: `is a .${format.ext} file (${format.mime}) by its content, not CSV text` };
  if (bytes.includes(0)) {
    return {
      ok: false,
      problem: looksLikeUtf16(bytes)
        ? `looks like UTF-16 text without a byte-order mark, not UTF-8. ${SAVE_AS}`
        : 'has binary content; it is not CSV text',
    };
  }
  try {
    return { ok: true, text: new TextDecoder('utf-8', { fatal: true }).decode(bytes) };
  } catch {
    const at = firstInvalidUtf8(bytes);
    const line = bytes.subarray(0, at).filter((b) => b === 0x0a).length + 1;
    const byte = (bytes[at] ?? 0).toString(16).toUpperCase().padStart(2, '0');
    return {
      ok: false,
      problem: `is not UTF-8 text: byte 0x${byte} on line ${line} is not valid UTF-8 (a Windows-1252 or Latin-1 file?). ${SAVE_AS}`,
    };
  }
}

/**
 * Checks that an uploaded file really is CSV text: a .csv (or .txt) name, a plausible declared type, and content
 * that decodes as CSV text (decodeCsvBytes). Returns the decoded text.
 */
export async function readCsvText(file: Express.Multer.File | undefined): Promise<string> {
  const bad = (message: string) => new AppError(400, 'UPLOAD_NOT_CSV', message, [{ path: 'file', message }]);
  if (!file)
    throw new AppError(400, 'UPLOAD_MISSING', 'Attach a CSV file in the "file" field.', [
      { path: 'file', message: 'Required' },
    ]);
  if (!/\.(csv|txt)$/i.test(file.originalname)) throw bad('The file name should end in .csv.');
  if (!CSV_TYPES.includes(file.mimetype)) throw bad(`A ${file.mimetype} file is not CSV.`);
  const decoded = await decodeCsvBytes(await readFile(file.path));
  if (!decoded.ok) throw bad(`The file ${decoded.problem}`);
  return decoded.text;
}
