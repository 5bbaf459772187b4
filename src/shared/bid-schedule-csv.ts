import Papa from 'papaparse';
import { MAX_BID_ITEMS_PER_IMPORT } from './constants';
import { parseDollarsToCents } from './parse-money';
import type { ApiErrorDetail } from './schemas/api-error';
import { BID_ITEM_CSV_COLUMNS, bidItemInputSchema, type BidItemInput } from './schemas/bid-item';

export type BidScheduleParse = { items: BidItemInput[]; errors: ApiErrorDetail[] };

type Column = (typeof BID_ITEM_CSV_COLUMNS)[number];
const REQUIRED: Column[] = ['item_number', 'description', 'pay_unit', 'basis', 'unit_price', 'contract_quantity', 'method'];
const FIELD_OF: Record<string, Column> = {
  itemNumber: 'item_number',
  description: 'description',
  payUnit: 'pay_unit',
  basis: 'basis',
  unitPriceCents: 'unit_price',
  contractQuantity: 'contract_quantity',
  isMajor: 'major',
  method: 'method',
};

/**
 * Reads a bid schedule CSV (header row of BID_ITEM_CSV_COLUMNS, unit_price in dollars, major yes/no) and checks
 * every row. Line numbers count the header as line 1. Errors name the line and the column.
 */
export function parseBidScheduleCsv(text: string): BidScheduleParse {
  const parsed = Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ''), {
    header: true,
    skipEmptyLines: 'greedy',
    transformHeader: (h) => h.trim().toLowerCase().replace(/\s+/g, '_'),
  });
  const errors: ApiErrorDetail[] = [];
  const headers = parsed.meta.fields ?? [];
  for (const column of REQUIRED) {
    if (!headers.includes(column)) errors.push({ path: 'header', line: 1, column, message: `Missing column "${column}".` });
  }
  if (errors.length > 0) return { items: [], errors };
  if (parsed.data.length === 0) return { items: [], errors: [{ path: 'file', message: 'The file has no bid item rows.' }] };
  if (parsed.data.length > MAX_BID_ITEMS_PER_IMPORT) {
    return { items: [], errors: [{ path: 'file', message: `At most ${MAX_BID_ITEMS_PER_IMPORT} rows per import.` }] };
  }
  for (const e of parsed.errors) {
    const line = (e.row ?? 0) + 2;
    errors.push({ path: `line ${line}`, line, message: `The row could not be read: ${e.message}.` });
  }
  const items: BidItemInput[] = [];
  const seen = new Map<string, number>();
  parsed.data.forEach((row, index) => {
    const line = index + 2;
    const rowErrors = (column: Column, message: string) =>
      errors.push({ path: `line ${line}.${column}`, line, column, message });
    const price = parseDollarsToCents(row.unit_price ?? '');
    if (price === null) rowErrors('unit_price', `"${row.unit_price ?? ''}" is not a dollar amount with at most 2 decimals.`);
    const quantityText = (row.contract_quantity ?? '').trim().replace(/,/g, '');
    const quantity = /^-?\d+(\.\d+)?$/.test(quantityText) ? Number(quantityText) : Number.NaN;
    if (Number.isNaN(quantity)) rowErrors('contract_quantity', `"${row.contract_quantity ?? ''}" is not a number.`);
    const major = parseYesNo(row.major);
    if (major === null) rowErrors('major', `"${row.major}" should be yes or no.`);
    const candidate = {
      itemNumber: row.item_number ?? '',
      description: row.description ?? '',
      payUnit: (row.pay_unit ?? '').trim(),
      basis: (row.basis ?? '').trim().toLowerCase(),
      unitPriceCents: price ?? 0,
      contractQuantity: Number.isNaN(quantity) ? 0 : quantity,
      isMajor: major ?? false,
      method: (row.method ?? '').trim().toLowerCase(),
    };
    const result = bidItemInputSchema.safeParse(candidate);
    if (!result.success) {
      for (const issue of result.error.issues) {
        const column = FIELD_OF[String(issue.path[0])] ?? 'item_number';
        if (column === 'unit_price' && price === null) continue;
        if (column === 'contract_quantity' && Number.isNaN(quantity)) continue;
        rowErrors(column, issue.message);
      }
      return;
    }
    const firstLine = seen.get(result.data.itemNumber);
    if (firstLine !== undefined) {
      rowErrors('item_number', `Item ${result.data.itemNumber} is already on line ${firstLine}.`);
      return;
    }
    seen.set(result.data.itemNumber, line);
    items.push(result.data);
  });
  return { items: errors.length > 0 ? [] : items, errors };
}

function parseYesNo(value: string | undefined): boolean | null {
  const v = (value ?? '').trim().toLowerCase();
  if (v === '' || v === 'no' || v === 'n' || v === 'false' || v === '0') return false;
  if (v === 'yes' || v === 'y' || v === 'true' || v === '1') return true;
  return null;
}
