import { z } from 'zod';

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
  })
  .strict();
export type AuditQuery = z.infer<typeof auditQuerySchema>;

export type AuditEventView = {
  id: number;
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
};
