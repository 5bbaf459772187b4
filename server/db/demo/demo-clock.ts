import { sql } from 'drizzle-orm';
import type { Db } from '../client';

/** Tables whose times are not the scenario's: accounts and sessions, and answers kept for repeated writes. */
const NOT_SCENARIO = ['user', 'session', 'account', 'verification', 'idempotent_requests'];

/**
 * The demo's clock. Seeding runs every step of the scenario in a second or two, through the real services, so
 * every row says "today". Each step is then moved to its date in the scenario: every time written since the
 * step began (any timestamp column of the app's tables) is moved to the step's date, keeping the order and the
 * milliseconds between them. Steps run one after another, so a step only ever moves its own writes.
 */
export class DemoClock {
  private columns: Promise<{ table: string; column: string }[]>;

  constructor(private readonly db: Db) {
    this.columns = db
      .execute(
        sql`select table_name, column_name from information_schema.columns
            where table_schema = 'public' and data_type = 'timestamp with time zone'`,
      )
      // Both drivers (PGlite, node-postgres) answer with `rows`.
      .then((r) =>
        (r as unknown as { rows: { table_name: string; column_name: string }[] }).rows
          .filter((c) => !NOT_SCENARIO.includes(c.table_name))
          .map((c) => ({ table: c.table_name, column: c.column_name })),
      );
  }

  /** Runs one step of the scenario, then dates what it wrote at `at` (ISO, UTC). */
  async step<T>(at: string, run: () => Promise<T>): Promise<T> {
    const since = new Date();
    const result = await run();
    const to = new Date(at).toISOString();
    const from = since.toISOString();
    await this.db.transaction(async (tx) => {
      // The trail is append-only (a trigger refuses changes); only this seed, dating its own fresh events before
      // anyone has used the installation, lifts the trigger, inside this one transaction.
      await tx.execute(sql`alter table audit_events disable trigger audit_events_no_update`);
      for (const { table, column } of await this.columns) {
        const c = sql.identifier(column);
        await tx.execute(
          sql`update ${sql.identifier(table)} set ${c} = ${to}::timestamptz + (${c} - ${from}::timestamptz)
              where ${c} >= ${from}::timestamptz`,
        );
      }
      await tx.execute(sql`alter table audit_events enable trigger audit_events_no_update`);
    });
    return result;
  }
}

/** A day of the scenario at a time of day, from a period's ISO date and a number of days after it. */
export function scenarioTime(isoDate: string, daysAfter: number, time: string): string {
  const d = new Date(`${isoDate}T${time}:00Z`);
  d.setUTCDate(d.getUTCDate() + daysAfter);
  return d.toISOString();
}
