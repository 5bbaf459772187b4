import { getAuthTables } from 'better-auth/db';
import { getTableConfig } from 'drizzle-orm/pg-core';
import { describe, expect, it } from 'vitest';
import { createAuth } from '../../server/auth';
import * as schema from '../../server/db/schema';
import { createTestDatabase } from '../setup/test-db';

describe('better-auth tables', () => {
  it('has every column better-auth expects, written by hand in server/db/schema/auth.ts', async () => {
    const database = await createTestDatabase();
    const auth = createAuth({
      db: database.db,
      secret: 'x'.repeat(32),
      baseURL: 'http://localhost:3000',
      trustedOrigins: [],
      secureCookies: false,
    });
    const expected = getAuthTables(auth.options);
    const tables = {
      user: schema.user,
      session: schema.session,
      account: schema.account,
      verification: schema.verification,
      rateLimit: schema.rateLimit,
    };
    for (const [key, table] of Object.entries(expected)) {
      const ours = tables[key as keyof typeof tables];
      expect(ours, `table ${key}`).toBeDefined();
      const columns = getTableConfig(ours).columns.map((c) => c.name);
      for (const [field, def] of Object.entries(table.fields)) {
        const name = (def.fieldName ?? field).replace(/[A-Z]/g, (c) => `_${c.toLowerCase()}`);
        expect(columns, `${key}.${field}`).toContain(name);
      }
    }
    await database.close();
  });
});
