import { z } from 'zod';

export const signInSchema = z.object({
  email: z.email('Type an e-mail address, like name@company.com').trim(),
  password: z.string().min(1, 'Type your password'),
});
export type SignInValues = z.infer<typeof signInSchema>;

export const DEMO_PASSWORD = 'tallyard-demo';

/** The seeded demo people, one per role. */
export const DEMO_SIGN_INS = [
  { email: 'sub@tallyard.test', role: 'Subcontractor', does: 'measures quantities and bills' },
  { email: 'gc@tallyard.test', role: 'General contractor', does: 'sets up jobs and bid schedules, reviews' },
  { email: 'owner@tallyard.test', role: 'Owner', does: 'sees certified amounts and pays' },
  { email: 'admin@tallyard.test', role: 'Company admin', does: 'manages the company and people' },
] as const;
