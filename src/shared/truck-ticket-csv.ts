import Papa from 'papaparse';
import type { ApiErrorDetail } from './schemas/api-error';
import { MAX_TICKETS_PER_IMPORT, TRUCK_TICKET_CSV_COLUMNS, truckTicketRowSchema } from './schemas/provisions/tickets';
import type { z } from 'zod';

export type TruckTicketRow = z.infer<typeof truckTicketRowSchema>;
type Column = (typeof TRUCK_TICKET_CSV_COLUMNS)[number];
const REQUIRED = TRUCK_TICKET_CSV_COLUMNS.filter((c) => c !== 'load_volume_cy');
const COLUMN_OF: Record<string, Column> = {
  deliveredOn: 'delivered_on',
  truckLabel: 'truck',
  material: 'material',
  source: 'source',
  loadedAt: 'loaded_at',
  deliveredTo: 'delivered_to',
  loadCheckerInitials: 'load_checker',
  deliveryCheckerInitials: 'delivery_checker',
  loadVolumeCy: 'load_volume_cy',
};

/**
 * Reads truck tickets from CSV (a header row naming TRUCK_TICKET_CSV_COLUMNS; load_volume_cy may be left out or
 * blank to take the truck's bed volume). Every row is checked like a typed ticket; errors name the line (the
 * header is line 1) and the column, and any error keeps the whole file out.
 */
export function parseTruckTicketCsv(text: string): { rows: TruckTicketRow[]; errors: ApiErrorDetail[] } {
  const parsed = Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ''), {
    header: true,
    skipEmptyLines: 'greedy',
    transformHeader: (h) => h.trim().toLowerCase().replace(/\s+/g, '_'),
  });
  const headers = parsed.meta.fields ?? [];
  const missing = REQUIRED.filter((c) => !headers.includes(c));
  if (missing.length > 0) {
    return {
      rows: [],
      errors: missing.map((column) => ({ path: 'header', line: 1, column, message: `Missing column "${column}".` })),
    };
  }
  if (parsed.data.length === 0)
    return { rows: [], errors: [{ path: 'file', message: 'The file has no ticket rows.' }] };
  if (parsed.data.length > MAX_TICKETS_PER_IMPORT) {
    return { rows: [], errors: [{ path: 'file', message: `At most ${MAX_TICKETS_PER_IMPORT} tickets per import.` }] };
  }
  const errors: ApiErrorDetail[] = parsed.errors.map((e) => {
    const line = (e.row ?? 0) + 2;
    return { path: `line ${line}`, line, message: `The row could not be read: ${e.message}.` };
  });
  const rows: TruckTicketRow[] = [];
  parsed.data.forEach((row, index) => {
    const line = index + 2;
    const volumeText = (row.load_volume_cy ?? '').trim();
    const volume = volumeText === '' ? null : /^\d+(\.\d+)?$/.test(volumeText) ? Number(volumeText) : Number.NaN;
    const badVolume = Number.isNaN(volume);
    if (badVolume) {
      errors.push({
        path: `line ${line}.load_volume_cy`,
        line,
        column: 'load_volume_cy',
        message: `"${volumeText}" is not a number.`,
      });
    }
    const result = truckTicketRowSchema.safeParse({
      deliveredOn: (row.delivered_on ?? '').trim(),
      truckLabel: row.truck ?? '',
      material: row.material ?? '',
      source: row.source ?? '',
      loadedAt: row.loaded_at ?? '',
      deliveredTo: row.delivered_to ?? '',
      loadCheckerInitials: row.load_checker ?? '',
      deliveryCheckerInitials: row.delivery_checker ?? '',
      loadVolumeCy: badVolume ? null : volume,
    });
    if (!result.success || badVolume) {
      for (const issue of result.error?.issues ?? []) {
        const column = COLUMN_OF[String(issue.path[0])] ?? 'delivered_on';
        errors.push({ path: `line ${line}.${column}`, line, column, message: issue.message });
      }
      return;
    }
    rows.push(result.data);
  });
  return { rows: errors.length > 0 ? [] : rows, errors };
}
