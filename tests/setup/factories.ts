import { randomUUID } from 'node:crypto';
import type { CompanyKind, ProjectRole } from '../../src/shared/constants';
import type { BidItemInput } from '../../src/shared/schemas/bid-item';
import { PROJECT_DEFAULTS } from '../../src/shared/schemas/project';
import type { Auth } from '../../server/auth';
import type { Db } from '../../server/db/client';
import { insertAccount, prepareAccount } from '../../server/modules/accounts/accounts.service';
import { bidItems, companies, companyMembers, projectMembers, projects } from '../../server/db/schema';
import { TEST_PASSWORD } from './test-app';

export async function makeCompany(db: Db, kind: CompanyKind, name = `${kind} ${randomUUID().slice(0, 6)}`) {
  const [row] = await db.insert(companies).values({ kind, name }).returning();
  return row!;
}

export async function makeUser(
  db: Db,
  auth: Auth,
  companyId: string,
  opts: { isAdmin?: boolean; email?: string } = {},
) {
  const email = opts.email ?? `${randomUUID().slice(0, 8)}@example.test`;
  // Public sign-up is off: people are made the way the app makes them (server/modules/accounts).
  const prepared = await prepareAccount(auth, {
    email,
    password: TEST_PASSWORD,
    name: email.split('@')[0]!,
    emailVerified: true,
  });
  const user = await db.transaction(async (tx) => {
    const made = await insertAccount(tx, prepared);
    await tx.insert(companyMembers).values({ userId: made.id, companyId, isAdmin: opts.isAdmin ?? false });
    return made;
  });
  return { id: user.id, email };
}

export async function makeProject(
  db: Db,
  parties: { subcontractor: string; general_contractor: string; owner: string },
  name = `Project ${randomUUID().slice(0, 6)}`,
) {
  const [row] = await db
    .insert(projects)
    .values({
      ...PROJECT_DEFAULTS,
      name,
      subcontractorCompanyId: parties.subcontractor,
      generalContractorCompanyId: parties.general_contractor,
      ownerCompanyId: parties.owner,
    })
    .returning();
  return row!;
}

export async function addMember(db: Db, projectId: string, userId: string, role: ProjectRole) {
  await db.insert(projectMembers).values({ projectId, userId, role });
}

export const sampleBidItem = (overrides: Partial<BidItemInput> = {}): BidItemInput => ({
  itemNumber: `T-${randomUUID().slice(0, 8)}`,
  description: 'Unclassified excavation',
  payUnit: 'CY',
  basis: 'bank',
  unitPriceCents: 725,
  contractQuantity: 1000,
  isMajor: false,
  method: 'end-area',
  ...overrides,
});

export async function makeBidItem(db: Db, projectId: string, overrides: Partial<BidItemInput> = {}) {
  const [row] = await db
    .insert(bidItems)
    .values({ ...sampleBidItem(overrides), projectId })
    .returning();
  return row!;
}

/**
 * Two projects with their own companies and people: `home`, on which each role has one person of its seat's
 * company, plus an admin of each of the three companies (`admin` is the general contractor's), and `foreign`,
 * whose general contractor is an outsider to `home`.
 */
export async function makeWorld(db: Db, auth: Auth) {
  const sub = await makeCompany(db, 'subcontractor');
  const gc = await makeCompany(db, 'general_contractor');
  const owner = await makeCompany(db, 'owner');
  const home = await makeProject(db, { subcontractor: sub.id, general_contractor: gc.id, owner: owner.id }, 'Home');
  const people = {
    subcontractor: await makeUser(db, auth, sub.id),
    general_contractor: await makeUser(db, auth, gc.id),
    owner: await makeUser(db, auth, owner.id),
    admin: await makeUser(db, auth, gc.id, { isAdmin: true }),
    subcontractor_admin: await makeUser(db, auth, sub.id, { isAdmin: true }),
    owner_admin: await makeUser(db, auth, owner.id, { isAdmin: true }),
  };
  for (const role of ['subcontractor', 'general_contractor', 'owner'] as const) {
    await addMember(db, home.id, people[role].id, role);
  }
  const otherGc = await makeCompany(db, 'general_contractor');
  const otherSub = await makeCompany(db, 'subcontractor');
  const otherOwner = await makeCompany(db, 'owner');
  const foreign = await makeProject(
    db,
    { subcontractor: otherSub.id, general_contractor: otherGc.id, owner: otherOwner.id },
    'Foreign',
  );
  const outsider = await makeUser(db, auth, otherGc.id);
  await addMember(db, foreign.id, outsider.id, 'general_contractor');
  return { companies: { sub, gc, owner, otherGc, otherSub, otherOwner }, home, foreign, people, outsider };
}
