import { createContext, useContext } from 'react';

/** Files loaded into a worksheet, by the label of the box they filled; saved with the tally as its evidence. */
export type WorksheetFiles = {
  attach: (slot: string, file: File) => void;
  detach: (slot: string) => void;
  attached: ReadonlyMap<string, File>;
  /** A tally opened read-only: no file can be loaded (the upload buttons are not offered). */
  readOnly?: boolean;
};

export const WorksheetFilesContext = createContext<WorksheetFiles | null>(null);

export function useWorksheetFiles(): WorksheetFiles | null {
  return useContext(WorksheetFilesContext);
}

const MAGIC: readonly [string, number[]][] = [
  ['a PNG image', [0x89, 0x50, 0x4e, 0x47]],
  ['a JPEG image', [0xff, 0xd8, 0xff]],
  ['a PDF', [0x25, 0x50, 0x44, 0x46]],
  ['a zip archive (a spreadsheet workbook?)', [0x50, 0x4b, 0x03, 0x04]],
  ['a gzip archive', [0x1f, 0x8b]],
  ['a GIF image', [0x47, 0x49, 0x46, 0x38]],
];

/**
 * Why a file is not text the worksheet can read (null when it is): known binary signatures, UTF-16 byte-order
 * marks, or NUL bytes in the first 4 kB. Checked before anything reaches the form.
 */
export async function notTextReason(file: File): Promise<string | null> {
  const head = new Uint8Array(await file.slice(0, 4096).arrayBuffer());
  for (const [what, bytes] of MAGIC) {
    if (bytes.every((b, i) => head[i] === b))
      return `${file.name} is ${what}, not a text file: save it as CSV (or LandXML) and upload that`;
  }
  if ((head[0] === 0xff && head[1] === 0xfe) || (head[0] === 0xfe && head[1] === 0xff))
    return `${file.name} is UTF-16 text: save it as UTF-8 CSV`;
  if (head.includes(0)) return `${file.name} is not a text file (it holds binary data): upload a CSV or LandXML file`;
  return null;
}
