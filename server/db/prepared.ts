import type { Db } from './client';

/**
 * Builds a database's prepared statements once, on first use, and keeps them with that database (tests open many).
 * Prepared statements skip Drizzle's query building on every call; on PostgreSQL they are also parsed and planned
 * once per connection.
 */
export function preparedFor<T>(build: (db: Db) => T): (db: Db) => T {
  const built = new WeakMap<Db, T>();
  return (db) => {
    let statements = built.get(db);
    if (!statements) {
      statements = build(db);
      built.set(db, statements);
    }
    return statements;
  };
}
