import { PAGE_LIMIT_MAX, type Page } from '@/shared/schemas/paging';
import { api } from './api-client';

/** The query string of a list's filters (empty values left out), with the paging added by the callers below. */
export function listParams(filter: Record<string, string | undefined>): URLSearchParams {
  return new URLSearchParams(Object.entries(filter).filter((e): e is [string, string] => Boolean(e[1])));
}

/**
 * Every page of a paged list, following `nextCursor` until it is null, for screens that need the whole list (totals,
 * a full table). A failed page fails the whole load: a screen never shows part of a list as if it were all of it.
 */
export async function fetchAllPages<T>(path: string, filter: Record<string, string | undefined> = {}): Promise<T[]> {
  const items: T[] = [];
  let cursor: string | null = null;
  do {
    const params = listParams(filter);
    params.set('limit', String(PAGE_LIMIT_MAX));
    if (cursor) params.set('cursor', cursor);
    const page: Page<T> = await api.get<Page<T>>(`${path}?${params.toString()}`);
    items.push(...page.items);
    cursor = page.nextCursor;
  } while (cursor);
  return items;
}
