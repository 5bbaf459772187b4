import { z } from 'zod';
import { COMPANY_KINDS } from '../constants';

/** Passwords as better-auth is configured (server/lib/password-policy.ts checks the same bounds). */
export const MIN_PASSWORD_LENGTH = 12;
export const MAX_PASSWORD_LENGTH = 128;
/** A person's name and e-mail address (RFC 5321 4.5.3.1.3: a path is at most 256 octets with its brackets). */
export const MAX_PERSON_NAME_LENGTH = 120;
export const MAX_EMAIL_LENGTH = 254;

export const personNameSchema = z
  .string()
  .trim()
  .min(1, 'Your name is required')
  .max(MAX_PERSON_NAME_LENGTH, `At most ${MAX_PERSON_NAME_LENGTH} characters`);
export const emailSchema = z
  .email('Type an e-mail address, like name@company.com')
  .trim()
  .toLowerCase()
  .max(MAX_EMAIL_LENGTH);
export const newPasswordSchema = z
  .string()
  .min(MIN_PASSWORD_LENGTH, `Use at least ${MIN_PASSWORD_LENGTH} characters`)
  .max(MAX_PASSWORD_LENGTH, `At most ${MAX_PASSWORD_LENGTH} characters`);

/** The forgotten-password form: only the address; the answer is the same whether it has an account or not. */
export const forgotPasswordSchema = z.object({ email: emailSchema });
export type ForgotPasswordValues = z.infer<typeof forgotPasswordSchema>;

/** A new password typed twice (reset by e-mailed link). */
export const resetPasswordSchema = z
  .object({ password: newPasswordSchema, confirm: z.string() })
  .refine((v) => v.password === v.confirm, { path: ['confirm'], message: 'The two passwords differ' });
export type ResetPasswordValues = z.infer<typeof resetPasswordSchema>;

/** Changing one's password while signed in: the current one, and the new one twice. */
export const changePasswordSchema = z
  .object({
    currentPassword: z.string().min(1, 'Type your current password'),
    password: newPasswordSchema,
    confirm: z.string(),
  })
  .refine((v) => v.password === v.confirm, { path: ['confirm'], message: 'The two passwords differ' })
  .refine((v) => v.password !== v.currentPassword, {
    path: ['password'],
    message: 'Choose a password different from the current one',
  });
export type ChangePasswordValues = z.infer<typeof changePasswordSchema>;

/** `npm run admin:create`: the first administrator of a new installation and their company. */
export const firstAdminSchema = z.object({
  name: personNameSchema,
  email: emailSchema,
  companyName: z.string().trim().min(1, 'The company name is required').max(200),
  companyKind: z.enum(COMPANY_KINDS, `One of ${COMPANY_KINDS.join(', ')}`),
  password: newPasswordSchema,
});
export type FirstAdminInput = z.infer<typeof firstAdminSchema>;
