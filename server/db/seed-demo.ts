import { eq, inArray } from 'drizzle-orm';
import type { CompanyKind } from '../../src/shared/constants';
import type { Auth } from '../auth';
import type { Storage } from '../integrations/storage/storage';
import { seedPayCycle } from './demo/seed-pay-cycle';
import { seedProvisions } from './demo/seed-provisions';
import type { Db } from './client';
import { DEMO_BID_ITEMS, DEMO_COMPANIES, DEMO_PASSWORD, DEMO_PEOPLE, DEMO_PROJECT } from './demo/demo-data';
import { bidItems, companies, companyMembers, emailOutbox, projectMembers, projects, user } from './schema';
import { recordAudit } from '../modules/audit/audit.repository';
import { insertAccount, prepareAccount } from '../modules/accounts/accounts.service';
import { DemoClock } from './demo/demo-clock';

const DEMO_SET_UP_AT = '2026-07-21T16:00:00.000Z';
const DEMO_PAY_BASIS_AT = '2026-11-24T09:30:00.000Z';

/**
 * Runs a seeding step whose hand-offs are history: the e-mails it queues are marked undelivered, never sent to the
 * demo addresses.
 */
async function asHistory<T>(db: Db, step: () => Promise<T>): Promise<T> {
  const before = new Set((await db.select({ id: emailOutbox.id }).from(emailOutbox)).map((r) => r.id));
  const result = await step();
  const queued = (await db.select({ id: emailOutbox.id }).from(emailOutbox))
    .map((r) => r.id)
    .filter((id) => !before.has(id));
  if (queued.length > 0) {
    await db
      .update(emailOutbox)
      .set({ status: 'sent', lastError: 'Demo history: not delivered' })
      .where(inArray(emailOutbox.id, queued));
  }
  return result;
}

/**
 * Seeds the demo scenario once. Returns false when the demo is already there (idempotent: a marker is the
 * general contractor's demo sign-in; the pay cycle has its own marker, a pay application on the demo project).
 */
export async function seedDemo(db: Db, auth: Auth, storage: Storage): Promise<boolean> {
  const [existing] = await db.select({ id: user.id }).from(user).where(eq(user.email, 'gc@tallyard.test')).limit(1);
  if (existing) {
    const [project] = await db
      .select({ id: projects.id })
      .from(projects)
      .where(eq(projects.name, DEMO_PROJECT.name))
      .limit(1);
    if (!project) return false;
    const cycle = await seedPayCycle(db, storage, project.id);
    return (await asHistory(db, () => seedProvisions(db, project.id))) || cycle;
  }

  // Hashed before the transaction (scrypt is slow); the demo people are created with everything else in it.
  const accounts = await Promise.all(
    DEMO_PEOPLE.map((person) =>
      prepareAccount(auth, { email: person.email, name: person.name, password: DEMO_PASSWORD, emailVerified: true }),
    ),
  );
  const userIds = new Map(accounts.map((a) => [a.email, a.id]));

  // The contract is set up in July; the pay cycle dates its own steps; the pay basis records come in November.
  const clock = new DemoClock(db);
  const projectId = await clock.step(DEMO_SET_UP_AT, () =>
    db.transaction(async (tx) => {
      for (const prepared of accounts) await insertAccount(tx, prepared);
      const companyIds = {} as Record<CompanyKind, string>;
      for (const [kind, name] of Object.entries(DEMO_COMPANIES) as [CompanyKind, string][]) {
        const [row] = await tx.insert(companies).values({ kind, name }).returning({ id: companies.id });
        companyIds[kind] = row!.id;
      }
      for (const person of DEMO_PEOPLE) {
        await tx.insert(companyMembers).values({
          userId: userIds.get(person.email)!,
          companyId: companyIds[person.company],
          isAdmin: person.isAdmin,
        });
      }
      const [project] = await tx
        .insert(projects)
        .values({
          ...DEMO_PROJECT,
          subcontractorCompanyId: companyIds.subcontractor,
          generalContractorCompanyId: companyIds.general_contractor,
          ownerCompanyId: companyIds.owner,
        })
        .returning({ id: projects.id });
      const projectId = project!.id;
      for (const person of DEMO_PEOPLE) {
        if (!person.projectRole) continue;
        await tx
          .insert(projectMembers)
          .values({ projectId, userId: userIds.get(person.email)!, role: person.projectRole });
      }
      await tx.insert(bidItems).values(DEMO_BID_ITEMS.map((i) => ({ ...i, projectId })));
      await recordAudit(tx, {
        projectId,
        actorUserId: null,
        objectType: 'project',
        objectId: projectId,
        action: 'demo.seeded',
        after: { bidItems: DEMO_BID_ITEMS.length },
      });
      return projectId;
    }),
  );
  await seedPayCycle(db, storage, projectId);
  await clock.step(DEMO_PAY_BASIS_AT, () => asHistory(db, () => seedProvisions(db, projectId)));
  return true;
}
