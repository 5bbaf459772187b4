import { fileTypeFromBuffer } from 'file-type';

export type Sniffed = { ext: string; mime: string };

/** Formats that can be plain text on the wire but are documents, never a CSV table. */
const TEXT_DOCUMENTS = new Set(['application/pdf', 'application/rtf', 'application/xml', 'application/postscript', 'image/svg+xml']);

/** Whether the bytes are free of C0 control characters other than tab, line feed and carriage return. */
function controlFree(bytes: Buffer): boolean {
  for (const b of bytes) if (b < 0x20 && b !== 0x09 && b !== 0x0a && b !== 0x0d) return false;
  return true;
}

/**
 * The format a file's leading bytes (magic numbers) say it is, when that rules it out as CSV: any format file-type
 * recognises whose bytes are not plain text (a zip, gzip, PNG, ELF or PDF with binary streams), and text-encoded
 * documents such as a PDF, RTF or XML. A two-letter signature that plain text can begin with ("BM", "MZ") is not
 * enough on its own: text without control characters is left to the CSV reader.
 */
export async function nonCsvFormat(bytes: Buffer): Promise<Sniffed | null> {
  const found = await fileTypeFromBuffer(bytes);
  if (!found) return null;
  if (TEXT_DOCUMENTS.has(found.mime) || !controlFree(bytes.subarray(0, 4096))) return { ext: found.ext, mime: found.mime };
  return null;
}
