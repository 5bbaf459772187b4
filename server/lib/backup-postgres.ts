import { spawnSync } from 'node:child_process';
import { existsSync, readdirSync } from 'node:fs';
import path from 'node:path';
import pg from 'pg';
import { BackupError } from './backup-archive';

export type PgTool = { path: string; version: string; major: number };
export type PgToolName = 'pg_dump' | 'pg_restore';
/** Where to look for the client programs: PATH, then Debian's versioned folders (`/usr/lib/postgresql/16/bin`). */
export type PgToolSearch = { path: string; libDir: string };

const DEFAULT_SEARCH: PgToolSearch = { path: process.env.PATH ?? '', libDir: '/usr/lib/postgresql' };

/** "pg_dump (PostgreSQL) 16.4 (Debian 16.4-1.pgdg120+1)" -> 16.4. */
function versionOf(bin: string): PgTool | null {
  const run = spawnSync(bin, ['--version'], { encoding: 'utf8' });
  const match = run.status === 0 ? /\(PostgreSQL\)\s+(\d+)(\.\d+)?/.exec(run.stdout) : null;
  return match ? { path: bin, version: `${match[1]}${match[2] ?? ''}`, major: Number(match[1]) } : null;
}

function candidates(name: PgToolName, search: PgToolSearch): string[] {
  const dirs = search.path.split(path.delimiter).filter(Boolean);
  if (existsSync(search.libDir)) {
    for (const v of readdirSync(search.libDir).sort()) dirs.push(path.join(search.libDir, v, 'bin'));
  }
  return [...new Set(dirs.map((d) => path.join(d, name)))].filter((f) => existsSync(f));
}

/**
 * The newest pg_dump or pg_restore on PATH or under /usr/lib/postgresql/<version>/bin. Refuses when there is
 * none, or when the newest is older than `atLeast` (pg_dump cannot dump a newer server; pg_restore cannot read
 * a newer pg_dump's archive).
 */
export function findPgTool(name: PgToolName, atLeast: { major: number; of: string }, search = DEFAULT_SEARCH): PgTool {
  const found = candidates(name, search)
    .map(versionOf)
    .filter((t): t is PgTool => t !== null)
    .sort((a, b) => b.major - a.major || b.version.localeCompare(a.version, 'en', { numeric: true }));
  const best = found[0];
  if (!best) {
    throw new BackupError(
      `${name} was not found on PATH or under ${search.libDir}/*/bin. Install Debian's PostgreSQL client (apt-get install postgresql-client), matching the server's major version or newer.`,
    );
  }
  if (best.major < atLeast.major) {
    throw new BackupError(
      `${name} ${best.version} (${best.path}) is older than ${atLeast.of} (${atLeast.major}): install postgresql-client-${atLeast.major} or newer, from Debian or the PostgreSQL apt repository.`,
    );
  }
  return best;
}

/** The URL without its password (for a child's command line) and the password in PGPASSWORD. */
function childConnection(url: string): { dbname: string; env: NodeJS.ProcessEnv } {
  const parsed = new URL(url);
  const password = decodeURIComponent(parsed.password);
  parsed.password = '';
  return { dbname: parsed.toString(), env: { ...process.env, ...(password ? { PGPASSWORD: password } : {}) } };
}

function runTool(tool: PgTool, args: string[], url: string, what: string): void {
  const { dbname, env } = childConnection(url);
  const run = spawnSync(tool.path, [...args, `--dbname=${dbname}`], {
    encoding: 'utf8',
    env,
    maxBuffer: 64 * 1024 * 1024,
  });
  if (run.error) throw new BackupError(`${what}: ${tool.path} could not run (${run.error.message}).`);
  if (run.status !== 0)
    throw new BackupError(
      `${what} failed (${path.basename(tool.path)} ${tool.version}, status ${run.status}):\n${run.stderr.trim()}`,
    );
}

/** Dumps in pg_dump's custom format, without owners, from an exported snapshot when given (one consistent view). */
export function pgDump(tool: PgTool, url: string, file: string, snapshot?: string): void {
  runTool(
    tool,
    ['--format=custom', '--no-owner', `--file=${file}`, ...(snapshot ? [`--snapshot=${snapshot}`] : [])],
    url,
    'pg_dump',
  );
}

/** Replaces what the dump holds in one transaction: all of it, or nothing when any statement fails. */
export function pgRestore(tool: PgTool, url: string, file: string): void {
  runTool(
    tool,
    ['--clean', '--if-exists', '--single-transaction', '--no-owner', '--exit-on-error', file],
    url,
    'pg_restore',
  );
}

/** A connection for the few queries around a dump or restore; `end` always. */
export async function connect(url: string): Promise<pg.Client> {
  const client = new pg.Client({ connectionString: url, application_name: 'tallyard-backup' });
  await client.connect().catch((err: unknown) => {
    throw new BackupError(
      `Cannot connect to the PostgreSQL server in DATABASE_URL: ${err instanceof Error ? err.message : String(err)}`,
    );
  });
  return client;
}

export async function serverVersion(client: pg.Client): Promise<{ version: string; major: number }> {
  const { rows } = await client.query<{ v: string; n: string }>(
    `select current_setting('server_version') as v, current_setting('server_version_num') as n`,
  );
  const row = rows[0]!;
  return { version: row.v.split(' ')[0]!, major: Math.floor(Number(row.n) / 10_000) };
}

/** Other sessions on this database (a running Tallyard keeps a pool open). */
export async function otherSessions(client: pg.Client): Promise<number> {
  const { rows } = await client.query<{ n: number }>(
    `select count(*)::int as n from pg_stat_activity
     where datname = current_database() and pid <> pg_backend_pid() and backend_type = 'client backend'`,
  );
  return rows[0]!.n;
}
