import { randomUUID } from 'node:crypto';
import { eq, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Database } from '../../server/db/client';
import { READ_VERSION_EXEMPT, READ_VERSION_TABLES } from '../../server/db/read-version-tables';
import { companies, projectReadVersions, readVersion, tallies, tallyEvidence, user } from '../../server/db/schema';
import { makeBidItem, makeCompany, makeProject } from '../setup/factories';
import { makeTally } from '../setup/pay-cycle-factories';
import { createTestDatabase } from '../setup/test-db';

// The read versions cached answers are keyed on (server/db/schema/read-version.ts). PostgreSQL documentation,
// CREATE TRIGGER: a constraint trigger DEFERRABLE INITIALLY DEFERRED fires at commit; "Transactions" (chapter 3.4):
// a rolled-back transaction leaves nothing behind, the counters included.
let database: Database;
beforeAll(async () => {
  database = await createTestDatabase();
});
afterAll(() => database.close());

const rows = async <T>(query: ReturnType<typeof sql>) =>
  ((await database.db.execute(query)) as unknown as { rows: T[] }).rows;
const globalVersion = async () =>
  (await database.db.select().from(readVersion).where(eq(readVersion.id, 1)))[0]!.version;
const projectVersion = async (projectId: string) =>
  (await database.db.select().from(projectReadVersions).where(eq(projectReadVersions.projectId, projectId)))[0]
    ?.version ?? 0;
const versions = async (...projectIds: string[]) => [
  await globalVersion(),
  ...(await Promise.all(projectIds.map(projectVersion))),
];

async function makeProjectWithParties() {
  const parties = {
    subcontractor: (await makeCompany(database.db, 'subcontractor')).id,
    general_contractor: (await makeCompany(database.db, 'general_contractor')).id,
    owner: (await makeCompany(database.db, 'owner')).id,
  };
  return makeProject(database.db, parties);
}

describe('read versions', () => {
  it('covers every table: each moves a version through deferred row triggers that name how to find its project, or is exempt with a reason', async () => {
    const tables = (
      await rows<{ name: string }>(
        sql`select table_name as name from information_schema.tables where table_schema = 'public' and table_type = 'BASE TABLE'`,
      )
    ).map((r) => r.name);
    const bumped = new Map<string, string>(Object.entries(READ_VERSION_TABLES));
    for (const table of tables) expect(bumped.has(table) !== table in READ_VERSION_EXEMPT, table).toBe(true);
    expect([...bumped.keys()].filter((name) => !tables.includes(name))).toEqual([]);
    const triggers = await rows<{ table: string; name: string; deferred: boolean; args: string }>(
      sql`select c.relname as "table", t.tgname as name, t.tginitdeferred as deferred,
            encode(t.tgargs, 'escape') as args
          from pg_trigger t join pg_class c on c.oid = t.tgrelid
          where t.tgname like 'read_version_bump%' and t.tgenabled = 'O'`,
    );
    const columns = await rows<{ table: string; column: string }>(
      sql`select table_name as "table", column_name as "column" from information_schema.columns where table_schema = 'public'`,
    );
    for (const [table, how] of bumped) {
      const mine = triggers.filter((t) => t.table === table);
      expect(mine.map((t) => [t.name, t.deferred, t.args.replace(/\\000/g, '')]).sort(), table).toEqual([
        ['read_version_bump', true, how],
        ['read_version_bump_truncate', false, ''],
      ]);
      if (how !== 'global')
        expect(
          columns.some((c) => c.table === table && c.column === how),
          `${table}.${how}`,
        ).toBe(true);
    }
    expect(triggers.filter((t) => !bumped.has(t.table))).toEqual([]);
  });

  it("moves only the written project's counter, once per committed transaction, and nothing on rollback", async () => {
    const one = await makeProjectWithParties();
    const two = await makeProjectWithParties();
    const start = await versions(one.id, two.id);
    expect(start[1]).toBeGreaterThan(0);
    await database.db.transaction(async (tx) => {
      await makeBidItem(tx as never, one.id);
      await makeBidItem(tx as never, one.id);
    });
    expect(await versions(one.id, two.id)).toEqual([start[0], start[1]! + 1, start[2]]);
    await database.db.transaction(async (tx) => {
      await makeBidItem(tx as never, one.id);
      await makeBidItem(tx as never, two.id);
    });
    expect(await versions(one.id, two.id)).toEqual([start[0], start[1]! + 2, start[2]! + 1]);
    await expect(
      database.db.transaction(async (tx) => {
        await makeBidItem(tx as never, two.id);
        throw new Error('roll back');
      }),
    ).rejects.toThrow('roll back');
    expect(await versions(one.id, two.id)).toEqual([start[0], start[1]! + 2, start[2]! + 1]);
  });

  it('lets transactions that move the same counters in opposite orders all commit (no deadlock at commit)', async () => {
    const one = await makeProjectWithParties();
    const two = await makeProjectWithParties();
    const start = await versions(one.id, two.id);
    const both = (first: string, second: string) =>
      database.db.transaction(async (tx) => {
        await makeBidItem(tx as never, first);
        await tx.insert(companies).values({ kind: 'owner', name: `Order ${randomUUID()}` });
        await makeBidItem(tx as never, second);
      });
    const pairs = Array.from({ length: 8 }, (_, i) => (i % 2 ? both(one.id, two.id) : both(two.id, one.id)));
    await Promise.all(pairs);
    expect(await versions(one.id, two.id)).toEqual([start[0]! + 8, start[1]! + 8, start[2]! + 8]);
  });

  it('finds the project of a row through its parent (evidence through its tally)', async () => {
    const project = await makeProjectWithParties();
    const author = `u-${randomUUID()}`;
    await database.db.insert(user).values({ id: author, name: 'Author', email: `${author}@example.test` });
    const item = await makeBidItem(database.db, project.id);
    const tally = await makeTally(database.db, {
      projectId: project.id,
      bidItemId: item.id,
      authorUserId: author,
      measuredOn: '2026-10-05',
      quantity: 5,
    });
    const [global, before] = await versions(project.id);
    await database.db.insert(tallyEvidence).values({
      tallyId: tally.id,
      kind: 'pdf',
      fileName: 'ticket.pdf',
      contentType: 'application/pdf',
      sizeBytes: 10,
      sha256: '0'.repeat(64),
      storageKey: `k-${randomUUID()}`,
      uploadedByUserId: author,
    });
    expect(await versions(project.id)).toEqual([global, before! + 1]);
    // Deleting the parent with its children in one transaction: the children's project is gone at commit, so they
    // move the global counter (every cached answer) rather than none.
    await database.db.transaction(async (tx) => {
      await tx.delete(tallyEvidence).where(eq(tallyEvidence.tallyId, tally.id));
      await tx.delete(tallies).where(eq(tallies.id, tally.id));
    });
    expect(await versions(project.id)).toEqual([global! + 1, before! + 2]);
  });

  it('moves the global counter for people and companies; a statement that writes no row moves nothing', async () => {
    const start = await globalVersion();
    await database.db.insert(companies).values({ kind: 'owner', name: 'Counter test' });
    expect(await globalVersion()).toBe(start + 1);
    await database.db.update(companies).set({ name: 'x' }).where(eq(companies.name, 'no such company'));
    expect(await globalVersion()).toBe(start + 1);
  });

  it('keeps its rows: deleting or truncating a counter is refused, so a number is never used twice', async () => {
    await expect(database.db.delete(readVersion)).rejects.toThrow();
    await expect(database.db.execute(sql`truncate read_version`)).rejects.toThrow();
    await expect(database.db.delete(projectReadVersions)).rejects.toThrow();
    await expect(database.db.execute(sql`truncate project_read_versions`)).rejects.toThrow();
  });
});
