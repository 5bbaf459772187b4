import { z } from 'zod';
import type { TrailChange, TrailObject } from '../trail-words';

export const AUDIT_PAGE_SIZE_MAX = 200;

/** Query of the project trail: newest first, paged, optionally one object type. */
export const auditQuerySchema = z
  .object({
    page: z.coerce.number().int().min(1).default(1),
    pageSize: z.coerce.number().int().min(1).max(AUDIT_PAGE_SIZE_MAX).default(50),
    objectType: z
      .string()
      .trim()
      .regex(/^[a-z_]{1,40}$/, 'Use an object type such as change_order or pay_app')
      .optional(),
    /** Only this person's events (a user id from the trail's people list). */
    person: z.string().trim().min(1).max(64).optional(),
    /** From and to (ISO instants, with offset): the client sends the person's local day bounds. */
    from: z.iso.datetime({ offset: true }).optional(),
    to: z.iso.datetime({ offset: true }).optional(),
  })
  .strict()
  .refine((q) => !q.from || !q.to || Date.parse(q.from) <= Date.parse(q.to), {
    message: 'The start date is after the end date',
    path: ['from'],
  });
export type AuditQuery = z.infer<typeof auditQuerySchema>;

export type AuditEventView = {
  id: number;
  /** The event in the product's words, with `{object}` where the object's name goes (a link on screen). */
  sentence: string;
  object: TrailObject;
  /** The changed values, labelled and formatted with their units; never ids or field codes. */
  changes: TrailChange[];
  at: string;
  actor: { userId: string; name: string } | null;
  objectType: string;
  objectId: string;
  action: string;
  before: unknown;
  after: unknown;
};

export type AuditPage = {
  events: AuditEventView[];
  page: number;
  pageSize: number;
  total: number;
  /** Object types present on the project, for the filter. */
  objectTypes: string[];
  /** People who appear on the project's trail, for the filter. */
  people: { userId: string; name: string }[];
};
