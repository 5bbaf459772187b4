import { z } from 'zod';

export const PAGE_LIMIT_DEFAULT = 100;
export const PAGE_LIMIT_MAX = 500;

/**
 * The one paging convention of the list endpoints: `?limit=` (1 to PAGE_LIMIT_MAX, default PAGE_LIMIT_DEFAULT) and an
 * opaque `cursor` taken from the previous answer's `nextCursor`. Lists are newest first by (created_at, id).
 */
export const pageQuerySchema = z.object({
  limit: z.coerce
    .number({ error: 'Give limit as a whole number' })
    .int('Give limit as a whole number')
    .min(1, 'limit is at least 1')
    .max(PAGE_LIMIT_MAX, `limit is at most ${PAGE_LIMIT_MAX}`)
    .default(PAGE_LIMIT_DEFAULT),
  cursor: z
    .string()
    .max(200, 'This cursor is not one the server gave')
    .regex(/^[A-Za-z0-9_-]+$/, 'This cursor is not one the server gave')
    .optional(),
});
export type PageQuery = z.infer<typeof pageQuerySchema>;

/** One page of a list; `nextCursor` is null on the last page. */
export type Page<T> = { items: T[]; nextCursor: string | null };
