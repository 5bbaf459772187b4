import { z } from 'zod';

/** One problem with a request: where (a field path, a CSV line) and what. */
export const apiErrorDetailSchema = z.object({
  path: z.string(),
  message: z.string(),
  line: z.number().int().optional(),
  column: z.string().optional(),
});
export type ApiErrorDetail = z.infer<typeof apiErrorDetailSchema>;

/** The one error shape every route answers with. */
export const apiErrorSchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    details: z.array(apiErrorDetailSchema).optional(),
  }),
});
export type ApiErrorBody = z.infer<typeof apiErrorSchema>;

/** Turns zod issues into details with dotted paths (`stations.3.station`). */
export function zodIssuesToDetails(issues: readonly z.core.$ZodIssue[]): ApiErrorDetail[] {
  return issues.map((issue) => ({
    path: issue.path.map(String).join('.') || '(body)',
    message: issue.message,
  }));
}
