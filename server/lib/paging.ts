import { desc, sql, type AnyColumn, type SQL } from 'drizzle-orm';
import type { Page, PageQuery } from '../../src/shared/schemas/paging';
import { AppError } from './app-error';

/** Where a page ended: the last row's created_at exactly as PostgreSQL prints it (microseconds kept) and its id. */
type Cursor = { at: string; id: string };

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
const PG_INSTANT = /^\d{4}-\d{2}-\d{2}[ T]\d{2}:\d{2}:\d{2}(\.\d{1,6})?([+-]\d{2}(:\d{2})?|Z)?$/;

/** PostgreSQL's text of a timestamptz (`2026-12-04 22:16:25.12345+00`), and a real instant (no 13th month). */
function isInstant(text: string): boolean {
  if (!PG_INSTANT.test(text)) return false;
  const [y, m, d, hh, mm, ss] = text.split(/[- T:.+]/).map(Number) as number[];
  const day = new Date(Date.UTC(y!, m! - 1, d!));
  return (
    day.getUTCFullYear() === y &&
    day.getUTCMonth() === m! - 1 &&
    day.getUTCDate() === d &&
    hh! < 24 &&
    mm! < 60 &&
    ss! < 60
  );
}

function badCursor(): AppError {
  const message = 'This cursor is not one the server gave; start again without it.';
  return new AppError(400, 'VALIDATION_FAILED', 'Some fields need attention.', [{ path: 'cursor', message }]);
}

export function encodeCursor(c: Cursor): string {
  return Buffer.from(JSON.stringify([c.at, c.id]), 'utf8').toString('base64url');
}

/** Reads a cursor from the query; anything the server did not make is 400 naming `cursor`. */
export function decodeCursor(text: string | undefined): Cursor | null {
  if (text === undefined) return null;
  try {
    const value: unknown = JSON.parse(Buffer.from(text, 'base64url').toString('utf8'));
    if (Array.isArray(value) && value.length === 2) {
      const [at, id] = value as unknown[];
      if (typeof at === 'string' && typeof id === 'string' && isInstant(at) && UUID.test(id)) {
        return { at, id };
      }
    }
  } catch {
    // falls through to the 400
  }
  throw badCursor();
}

/**
 * Keyset paging on (created_at, id), newest first. `key` goes in the select (the created_at text for the next
 * cursor), `after` in the where, `order` in the order by; fetch `limit + 1` rows and pass them to `pageOf`.
 */
export function keyset(createdAt: AnyColumn, id: AnyColumn, query: PageQuery) {
  const cursor = decodeCursor(query.cursor);
  return {
    key: sql<string>`${createdAt}::text`,
    after: cursor ? sql`(${createdAt}, ${id}) < (${cursor.at}::timestamptz, ${cursor.id}::uuid)` : undefined,
    order: [desc(createdAt), desc(id)] as SQL[],
    fetch: query.limit + 1,
  };
}

/** Cuts the extra row off and makes the next cursor from the last row kept. */
export function pageOf<R, T>(rows: R[], limit: number, keyOf: (row: R) => Cursor, present: (row: R) => T): Page<T> {
  const kept = rows.slice(0, limit);
  const last = kept[kept.length - 1];
  return { items: kept.map(present), nextCursor: rows.length > limit && last ? encodeCursor(keyOf(last)) : null };
}
