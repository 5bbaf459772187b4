import { eq, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Database } from '../../server/db/client';
import { READ_VERSION_EXEMPT, READ_VERSION_TABLES } from '../../server/db/read-version-tables';
import { companies, readVersion } from '../../server/db/schema';
import { createTestDatabase } from '../setup/test-db';

// read_version: the counter cached answers are keyed on (server/db/schema/read-version.ts). PostgreSQL documentation,
// CREATE TRIGGER: a constraint trigger DEFERRABLE INITIALLY DEFERRED fires at commit; "Transactions" (chapter 3.4):
// a rolled-back transaction leaves nothing behind, the counter included.
let database: Database;
beforeAll(async () => {
  database = await createTestDatabase();
});
afterAll(() => database.close());

const version = async () => (await database.db.select().from(readVersion).where(eq(readVersion.id, 1)))[0]!.version;
const rows = async <T>(query: ReturnType<typeof sql>) =>
  ((await database.db.execute(query)) as unknown as { rows: T[] }).rows;

describe('read_version', () => {
  it('covers every table: each is bumped by deferred row triggers and a truncate trigger, or exempt with a reason', async () => {
    const tables = (
      await rows<{ name: string }>(
        sql`select table_name as name from information_schema.tables where table_schema = 'public' and table_type = 'BASE TABLE'`,
      )
    ).map((r) => r.name);
    const bumped = new Set<string>(READ_VERSION_TABLES);
    for (const table of tables) expect(bumped.has(table) !== table in READ_VERSION_EXEMPT, table).toBe(true);
    expect([...bumped].filter((name) => !tables.includes(name))).toEqual([]);
    const triggers = await rows<{ table: string; name: string; deferred: boolean }>(
      sql`select c.relname as "table", t.tgname as name, t.tginitdeferred as deferred from pg_trigger t
          join pg_class c on c.oid = t.tgrelid where t.tgname like 'read_version_bump%' and t.tgenabled = 'O'`,
    );
    for (const table of bumped) {
      const mine = triggers.filter((t) => t.table === table);
      expect(mine.map((t) => [t.name, t.deferred]).sort(), table).toEqual([
        ['read_version_bump', true],
        ['read_version_bump_truncate', false],
      ]);
    }
    expect(triggers.filter((t) => !bumped.has(t.table))).toEqual([]);
  });

  it('grows by one per committed transaction, however many rows it writes, and not at all when it rolls back', async () => {
    const start = await version();
    await database.db.transaction(async (tx) => {
      await tx.insert(companies).values([
        { kind: 'owner', name: 'Counter test A' },
        { kind: 'owner', name: 'Counter test B' },
      ]);
      await tx.update(companies).set({ name: 'Counter test C' }).where(eq(companies.name, 'Counter test A'));
    });
    expect(await version()).toBe(start + 1);
    await database.db.update(companies).set({ name: 'Counter test D' }).where(eq(companies.name, 'Counter test B'));
    expect(await version()).toBe(start + 2);
    await expect(
      database.db.transaction(async (tx) => {
        await tx.insert(companies).values({ kind: 'owner', name: 'Counter test E' });
        throw new Error('roll back');
      }),
    ).rejects.toThrow('roll back');
    expect(await version()).toBe(start + 2);
    // A statement that writes no row moves nothing.
    await database.db.update(companies).set({ name: 'x' }).where(eq(companies.name, 'no such company'));
    expect(await version()).toBe(start + 2);
  });

  it('keeps its one row: deleting or truncating it is refused, so a number is never used twice', async () => {
    await expect(database.db.delete(readVersion)).rejects.toThrow();
    await expect(database.db.execute(sql`truncate read_version`)).rejects.toThrow();
    expect(await version()).toBeGreaterThan(0);
  });
});
