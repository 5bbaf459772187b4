import { firstAdminSchema, type FirstAdminInput } from '../../../src/shared/schemas/account';
import type { Auth } from '../../auth';
import type { Db } from '../../db/client';
import { companies, companyMembers } from '../../db/schema';
import { validationFailed } from '../../lib/app-error';
import { recordAudit } from '../audit/audit.repository';
import { zodIssuesToDetails } from '../../../src/shared/schemas/api-error';
import { insertAccount, prepareAccount } from './accounts.service';

/**
 * `npm run admin:create`: a company and its first administrator, in one transaction with its audit event. Run on
 * the server's machine (it needs the database), so it is how a new installation gets its first person; everyone
 * after that comes in by invitation.
 */
export async function createFirstAdmin(db: Db, auth: Auth, raw: Partial<FirstAdminInput>) {
  const parsed = firstAdminSchema.safeParse(raw);
  if (!parsed.success) throw validationFailed(zodIssuesToDetails(parsed.error.issues));
  const input = parsed.data;
  // The person typed their own address here: there is no link to prove it, so it is not marked verified.
  const prepared = await prepareAccount(auth, {
    email: input.email,
    name: input.name,
    password: input.password,
    emailVerified: false,
  });
  return db.transaction(async (tx) => {
    const person = await insertAccount(tx, prepared);
    const [company] = await tx
      .insert(companies)
      .values({ name: input.companyName, kind: input.companyKind })
      .returning();
    await tx.insert(companyMembers).values({ userId: person.id, companyId: company!.id, isAdmin: true });
    await recordAudit(tx, {
      projectId: null,
      actorUserId: null,
      objectType: 'user',
      objectId: person.id,
      action: 'account.admin_created',
      after: {
        email: person.email,
        name: prepared.name,
        companyId: company!.id,
        companyName: company!.name,
        companyKind: company!.kind,
        isAdmin: true,
      },
    });
    return { userId: person.id, email: person.email, companyId: company!.id };
  });
}
