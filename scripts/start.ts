// `npm start`: builds the client when needed, then serves the API and the built client from one process.
import { buildClientIfStale } from './build-client';

await buildClientIfStale();
process.env.NODE_ENV ??= 'production';
// The demo command: the Mailbox page shows the mail the local sink catches (`npm run serve` leaves it off).
process.env.MAILBOX ??= 'on';
await import('../server/index');
