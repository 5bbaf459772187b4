/**
 * `npm run admin:create [-- --name NAME --email ADDRESS --company NAME --kind KIND]`: a company and its first
 * administrator on DATA_DIR or DATABASE_URL. Asks for what the flags leave out; the password is read from
 * TALLYARD_ADMIN_PASSWORD or asked for twice without echo (never a flag: it would stay in the shell history).
 */
import { createInterface } from 'node:readline/promises';
import { parseArgs } from 'node:util';
import { COMPANY_KINDS } from '../src/shared/constants';
import { createAuth } from '../server/auth';
import { openDatabase } from '../server/db/client';
import { runMigrations } from '../server/db/migrate';
import { loadEnv } from '../server/env';
import { AppError } from '../server/lib/app-error';
import { authSecret, dataDirLayout, lockDataDir } from '../server/lib/data-dir';
import { appOrigins } from '../server/lib/origins';
import { createFirstAdmin } from '../server/modules/accounts/first-admin.service';

const { values: flags } = parseArgs({
  options: {
    name: { type: 'string' },
    email: { type: 'string' },
    company: { type: 'string' },
    kind: { type: 'string' },
  },
});

/** Reads a line from the terminal without showing it. */
async function askHidden(question: string): Promise<string> {
  const stdin = process.stdin;
  if (!stdin.isTTY) throw new Error('No terminal to ask the password on: set TALLYARD_ADMIN_PASSWORD.');
  process.stdout.write(question);
  stdin.setRawMode(true);
  stdin.resume();
  stdin.setEncoding('utf8');
  return new Promise((resolve, reject) => {
    let typed = '';
    const onData = (chunk: string) => {
      for (const ch of chunk) {
        if (ch === '\r' || ch === '\n') {
          stdin.setRawMode(false);
          stdin.pause();
          stdin.off('data', onData);
          process.stdout.write('\n');
          resolve(typed);
          return;
        }
        if (ch === '\u0003') {
          stdin.setRawMode(false);
          reject(new Error('Cancelled.'));
          return;
        }
        if (ch === '\u007f' || ch === '\b') typed = typed.slice(0, -1);
        else typed += ch;
      }
    };
    stdin.on('data', onData);
  });
}

async function ask(rl: ReturnType<typeof createInterface> | undefined, question: string, given: string | undefined) {
  if (given !== undefined) return given;
  if (!rl)
    throw new Error(`Missing ${question.replace(/:.*$/, '')}: pass it as a flag (see npm run admin:create -- --help).`);
  return (await rl.question(question)).trim();
}

async function main() {
  const env = loadEnv();
  const interactive = Boolean(process.stdin.isTTY);
  const rl = interactive ? createInterface({ input: process.stdin, output: process.stdout }) : undefined;
  const name = await ask(rl, 'Your name: ', flags.name);
  const email = await ask(rl, 'Your e-mail address: ', flags.email);
  const companyName = await ask(rl, 'Company name: ', flags.company);
  const companyKind = await ask(rl, `Company kind (${COMPANY_KINDS.join(', ')}): `, flags.kind);
  rl?.close();
  let password = process.env.TALLYARD_ADMIN_PASSWORD;
  if (!password) {
    password = await askHidden('Choose a password (at least 12 characters): ');
    if ((await askHidden('Type it again: ')) !== password)
      throw new Error('The two passwords differ; nothing was created.');
  }

  const layout = dataDirLayout(env.DATA_DIR);
  const unlock = env.DATABASE_URL ? async () => {} : await lockDataDir(layout);
  const database = await openDatabase(
    env.DATABASE_URL ? { kind: 'postgres', url: env.DATABASE_URL } : { kind: 'pglite', dataDir: layout.db },
  );
  try {
    await runMigrations(database);
    const { baseURL, trustedOrigins } = appOrigins(env.PORT, env.APP_URL);
    const auth = createAuth({
      db: database.db,
      secret: authSecret(layout, env.BETTER_AUTH_SECRET),
      baseURL,
      trustedOrigins,
      secureCookies: false,
    });
    const made = await createFirstAdmin(database.db, auth, {
      name,
      email,
      companyName,
      companyKind: companyKind as never,
      password,
    });
    console.log(`Created ${made.email}, administrator of ${companyName}. Sign in at ${baseURL}/sign-in.`);
  } finally {
    await database.close();
    await unlock();
  }
}

main().catch((err: unknown) => {
  if (err instanceof AppError && err.details?.length) {
    console.error(`Nothing was created: ${err.message}`);
    for (const d of err.details) console.error(`  - ${d.path}: ${d.message}`);
  } else {
    console.error(err instanceof Error ? err.message : err);
  }
  process.exit(1);
});
