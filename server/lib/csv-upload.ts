import multer from 'multer';
import { MAX_CSV_UPLOAD_BYTES } from '../../src/shared/constants';
import { AppError } from './app-error';
import { readableMultipart } from './multipart';

/** One CSV file in memory, at most MAX_CSV_UPLOAD_BYTES. */
export const csvUpload = readableMultipart(
  multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: MAX_CSV_UPLOAD_BYTES, files: 1, fields: 10 },
  }).single('file'),
);

const CSV_TYPES = ['text/csv', 'text/plain', 'application/vnd.ms-excel', 'application/csv', 'application/octet-stream'];

/**
 * Checks that an uploaded file really is CSV text: a .csv (or .txt) name, a plausible declared type, valid UTF-8
 * and no binary bytes. Returns the decoded text.
 */
export function readCsvText(file: Express.Multer.File | undefined): string {
  const bad = (message: string) => new AppError(400, 'UPLOAD_NOT_CSV', message, [{ path: 'file', message }]);
  if (!file) throw new AppError(400, 'UPLOAD_MISSING', 'Attach a CSV file in the "file" field.', [{ path: 'file', message: 'Required' }]);
  if (!/\.(csv|txt)$/i.test(file.originalname)) throw bad('The file name should end in .csv.');
  if (!CSV_TYPES.includes(file.mimetype)) throw bad(`A ${file.mimetype} file is not CSV.`);
  if (file.buffer.includes(0)) throw bad('The file has binary content; it is not CSV text.');
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(file.buffer);
  } catch {
    throw bad('The file is not UTF-8 text. Save it as "CSV UTF-8" and upload again.');
  }
}
