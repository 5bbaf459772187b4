import { open, readFile } from 'node:fs/promises';
import { MAX_EVIDENCE_BYTES, MAX_EVIDENCE_FILES_PER_TALLY } from '../../../src/shared/constants';
import type { EvidenceKind } from '../../../src/shared/schemas/tally';
import type { ApiErrorDetail } from '../../../src/shared/schemas/api-error';
import { AppError } from '../../lib/app-error';
import { decodeCsvBytes } from '../../lib/csv-upload';
import { streamedUpload, type UploadedFile } from '../../lib/upload';
import type { Storage } from '../../integrations/storage/storage';

/**
 * Files in the `files` field, each at most MAX_EVIDENCE_BYTES, streamed to temp files (server/lib/upload.ts: the
 * request's total and the temp-file clean-up). Any route taking evidence-like files uses this with
 * `checkEvidenceFiles` and stores through `storeCheckedFiles`.
 */
export const evidenceUpload = streamedUpload((m) => m.array('files', MAX_EVIDENCE_FILES_PER_TALLY), {
  fileSize: MAX_EVIDENCE_BYTES,
  files: MAX_EVIDENCE_FILES_PER_TALLY,
  fields: 5,
});

/** The first bytes of a file (enough for a signature), without reading the rest. */
async function headOf(file: string, n = 64): Promise<Buffer> {
  const handle = await open(file, 'r');
  try {
    const buf = Buffer.alloc(n);
    const { bytesRead } = await handle.read(buf, 0, n, 0);
    return buf.subarray(0, bytesRead);
  } finally {
    await handle.close();
  }
}

type Rule = {
  kind: EvidenceKind;
  contentType: string;
  mimetypes: string[];
  /** The check reads the whole text (CSV, XML; one file at a time); otherwise the first bytes are enough. */
  whole?: boolean;
  check: (b: Buffer) => string | null | Promise<string | null>;
};

const GENERIC = ['application/octet-stream', ''];
const PNG = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
const JPEG = Buffer.from([0xff, 0xd8, 0xff]);

function utf8(b: Buffer): string | null {
  if (b.includes(0)) return null;
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(b);
  } catch {
    return null;
  }
}

/** The first element of an XML text must be a LandXML root (after the declaration and any comments). */
function isLandXml(text: string): boolean {
  const body = text
    .replace(/^\uFEFF/, '')
    .replace(/<\?xml[\s\S]*?\?>/, '')
    .replace(/<!--[\s\S]*?-->/g, '')
    .replace(/<!DOCTYPE[^>]*>/i, '');
  return /^\s*<(?:[A-Za-z_][\w.-]*:)?LandXML[\s/>]/.test(body);
}

const RULES: Record<string, Rule> = {
  csv: {
    kind: 'csv',
    contentType: 'text/csv',
    mimetypes: ['text/csv', 'text/plain', 'application/csv', 'application/vnd.ms-excel'],
    whole: true,
    check: async (b) => {
      const decoded = await decodeCsvBytes(b);
      return decoded.ok ? null : decoded.problem;
    },
  },
  pdf: {
    kind: 'pdf',
    contentType: 'application/pdf',
    mimetypes: ['application/pdf'],
    check: (b) =>
      b.subarray(0, 5).toString('latin1') === '%PDF-' ? null : 'does not start with %PDF-, so it is not a PDF',
  },
  png: {
    kind: 'image',
    contentType: 'image/png',
    mimetypes: ['image/png'],
    check: (b) => (b.subarray(0, 8).equals(PNG) ? null : 'does not carry the PNG signature'),
  },
  jpg: {
    kind: 'image',
    contentType: 'image/jpeg',
    mimetypes: ['image/jpeg', 'image/jpg', 'image/pjpeg'],
    check: (b) => (b.subarray(0, 3).equals(JPEG) ? null : 'does not carry the JPEG signature'),
  },
  xml: {
    kind: 'landxml',
    contentType: 'application/xml',
    mimetypes: ['application/xml', 'text/xml', 'application/landxml+xml'],
    whole: true,
    check: (b) => {
      const text = utf8(b);
      if (text === null) return 'is not UTF-8 text, so it is not XML';
      return isLandXml(text) ? null : 'has no LandXML root element';
    },
  },
};
RULES.jpeg = RULES.jpg!;

/** Names Windows reserves for devices, also before any extension (Microsoft, "Naming Files, Paths, and Namespaces"). */
const WINDOWS_RESERVED = /^(con|prn|aux|nul|com\d|lpt\d)$/i;

/**
 * A name safe to show, to send in Content-Disposition and to save on any desktop: the last path segment, letters,
 * digits, dot, dash, underscore and space only, at most 120 characters, no Windows device name, no trailing dot. It
 * is never used as a path (storage picks random keys).
 */
export function safeFileName(original: string): string {
  const base = original.split(/[\\/]/).pop() ?? '';
  const cleaned = base
    .normalize('NFKD')
    .replace(/[^\w.\- ]+/g, '_')
    .replace(/\s+/g, ' ')
    .replace(/^[.\s_]+/, '')
    .trim();
  const ext = /\.[A-Za-z0-9]{1,5}$/.exec(cleaned)?.[0] ?? '';
  const stem = cleaned
    .slice(0, cleaned.length - ext.length)
    .slice(0, 120 - ext.length)
    .replace(/[.\s]+$/, '');
  return `${WINDOWS_RESERVED.test(stem.split('.')[0]!.trim()) ? `evidence-${stem}` : stem || 'evidence'}${ext.toLowerCase()}`;
}

/**
 * A checked file: an upload still in its temp file (`path`, with the size and SHA-256 taken while it streamed in),
 * or bytes the server made itself (the demo seed).
 */
export type CheckedFile = { fileName: string; contentType: string; kind: EvidenceKind } & (
  { path: string; sizeBytes: number; sha256: string } | { bytes: Buffer }
);

/** Size of a checked file. */
export const sizeOf = (f: CheckedFile) => ('bytes' in f ? f.bytes.length : f.sizeBytes);

/** Puts checked files in storage (streamed from their temp files); on a failure removes the ones already stored. */
export async function storeCheckedFiles(storage: Storage, files: CheckedFile[], hint: string) {
  const stored: { f: CheckedFile; key: string; sha256: string }[] = [];
  try {
    for (const f of files) {
      if ('bytes' in f) stored.push({ f, ...(await storage.put(f.bytes, hint)) });
      else stored.push({ f, key: (await storage.putFile(f.path, hint)).key, sha256: f.sha256 });
    }
    return stored;
  } catch (err) {
    await Promise.all(stored.map((s) => storage.remove(s.key).catch(() => undefined)));
    throw err;
  }
}

/** Checks every file of an upload against its declared type; reports every bad file by index and name. */
export async function checkEvidenceFiles(files: Express.Multer.File[] | undefined): Promise<CheckedFile[]> {
  const uploaded = files as UploadedFile[] | undefined;
  if (!uploaded || uploaded.length === 0) {
    throw new AppError(400, 'UPLOAD_MISSING', 'Attach at least one file in the "files" field.', [
      { path: 'files', message: 'Required' },
    ]);
  }
  const details: ApiErrorDetail[] = [];
  const checked: CheckedFile[] = [];
  for (const [i, file] of uploaded.entries()) {
    const fileName = safeFileName(file.originalname);
    const ext = /\.([a-z0-9]+)$/.exec(fileName)?.[1] ?? '';
    const rule = RULES[ext];
    const say = (message: string) => details.push({ path: `files.${i}`, message: `${fileName}: ${message}` });
    if (!rule) say('use CSV, PDF, PNG or JPEG images, or LandXML (.xml)');
    else if (file.size === 0) say('the file is empty');
    else if (!rule.mimetypes.includes(file.mimetype) && !GENERIC.includes(file.mimetype))
      say(`declared as ${file.mimetype}, which does not match .${ext}`);
    else {
      const problem = await rule.check(rule.whole ? await readFile(file.path) : await headOf(file.path));
      if (problem) say(`the content ${problem}`);
    }
    checked.push({
      fileName,
      contentType: rule?.contentType ?? '',
      kind: rule?.kind ?? 'csv',
      path: file.path,
      sizeBytes: file.size,
      sha256: file.sha256,
    });
  }
  if (details.length > 0)
    throw new AppError(400, 'EVIDENCE_REJECTED', `${details.length} file(s) were refused; nothing was saved.`, details);
  return checked;
}
