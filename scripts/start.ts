// `npm start`: builds the client when needed, then serves the API and the built client from one process.
import { buildClientIfStale } from './build-client';

await buildClientIfStale();
process.env.NODE_ENV ??= 'production';
await import('../server/index');
