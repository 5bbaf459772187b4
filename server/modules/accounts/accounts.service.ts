import { sql } from 'drizzle-orm';
import { emailSchema, personNameSchema } from '../../../src/shared/schemas/account';
import type { Auth } from '../../auth';
import type { Executor } from '../../db/client';
import { account, user } from '../../db/schema';
import { conflict, validationFailed } from '../../lib/app-error';
import { passwordProblem } from '../../lib/password-policy';
import { unstorableText } from '../../middleware/storable-text';

/** An account ready to insert: checked, its password hashed (outside any transaction: scrypt takes a while). */
export type PreparedAccount = {
  id: string;
  accountRowId: string;
  email: string;
  name: string;
  passwordHash: string;
  emailVerified: boolean;
};

/**
 * Checks a new person's name, address and password (the password policy, the app's text rules) and hashes the
 * password with better-auth's own hasher. Public sign-up is off (better-auth's disableSignUp): accounts are made
 * only here, by accepting an invitation, `npm run admin:create` and the demo seed.
 */
export async function prepareAccount(
  auth: Auth,
  input: { email: string; name: string; password: string; emailVerified: boolean },
  paths: { name?: string; email?: string; password?: string } = {},
): Promise<PreparedAccount> {
  const problems = [];
  const name = personNameSchema.safeParse(input.name);
  const email = emailSchema.safeParse(input.email);
  if (!name.success) problems.push({ path: paths.name ?? 'name', message: name.error.issues[0]!.message });
  if (!email.success) problems.push({ path: paths.email ?? 'email', message: email.error.issues[0]!.message });
  const weak = passwordProblem(input.password);
  if (weak) problems.push({ path: paths.password ?? 'password', message: weak });
  problems.push(...unstorableText({ [paths.name ?? 'name']: input.name, [paths.email ?? 'email']: input.email }));
  if (problems.length > 0) throw validationFailed(problems, problems[0]!.message);
  const context = await auth.$context;
  return {
    id: String(context.generateId({ model: 'user' })),
    accountRowId: String(context.generateId({ model: 'account' })),
    email: email.data!,
    name: name.data!,
    passwordHash: await context.password.hash(input.password),
    emailVerified: input.emailVerified,
  };
}

/** Inserts the person and their password (better-auth's credential account) inside the caller's transaction. */
export async function insertAccount(tx: Executor, prepared: PreparedAccount): Promise<{ id: string; email: string }> {
  const [taken] = await tx
    .select({ id: user.id })
    .from(user)
    .where(sql`lower(${user.email}) = ${prepared.email}`)
    .limit(1);
  if (taken) throw conflict('ACCOUNT_EXISTS', `An account for ${prepared.email} already exists.`);
  await tx
    .insert(user)
    .values({ id: prepared.id, email: prepared.email, name: prepared.name, emailVerified: prepared.emailVerified });
  await tx.insert(account).values({
    id: prepared.accountRowId,
    accountId: prepared.id,
    providerId: 'credential',
    userId: prepared.id,
    password: prepared.passwordHash,
  });
  return { id: prepared.id, email: prepared.email };
}
