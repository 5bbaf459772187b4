// `npm start`: builds the client and the server when needed, then runs the built server (plain node, no
// TypeScript to transpile at start), which serves the API and the built client from one process.
import { spawn } from 'node:child_process';
import { SERVER_BUNDLE } from './build-server';
import { buildIfStale } from './build';

await buildIfStale();
const server = spawn(process.execPath, [SERVER_BUNDLE], {
  stdio: 'inherit',
  // With neither DATABASE_URL nor SMTP_URL this is the demo on the embedded database: a labelled demo Mailbox
  // and the local Stripe stand-in. Otherwise a real deployment, which production refuses to start half set up.
  env: {
    ...process.env,
    NODE_ENV: process.env.NODE_ENV ?? 'production',
    TALLYARD_DEMO: process.env.TALLYARD_DEMO ?? (process.env.DATABASE_URL || process.env.SMTP_URL ? 'off' : 'on'),
  },
});
// The server closes cleanly on either signal (and ignores a second one); pass them on and leave with its code.
for (const signal of ['SIGINT', 'SIGTERM'] as const) process.on(signal, () => server.kill(signal));
server.on('exit', (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
