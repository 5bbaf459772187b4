// `npm start`: builds the client and the server when needed, then runs the built server (plain node, no
// TypeScript to transpile at start), which serves the API and the built client from one process.
import { spawn } from 'node:child_process';
import { SERVER_BUNDLE } from './build-server';
import { buildIfStale } from './build';

await buildIfStale();
const server = spawn(process.execPath, [SERVER_BUNDLE], {
  stdio: 'inherit',
  // The demo command: the Mailbox page shows the mail the local sink catches (`npm run serve` leaves it off).
  env: { ...process.env, NODE_ENV: process.env.NODE_ENV ?? 'production', MAILBOX: process.env.MAILBOX ?? 'on' },
});
// The server closes cleanly on either signal (and ignores a second one); pass them on and leave with its code.
for (const signal of ['SIGINT', 'SIGTERM'] as const) process.on(signal, () => server.kill(signal));
server.on('exit', (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
