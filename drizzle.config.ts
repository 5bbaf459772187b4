import { defineConfig } from 'drizzle-kit';

// Generates SQL migrations into drizzle/ from the schema. `npm run db:generate -- --name what_changed`.
// The server applies them itself on start; drizzle-kit never opens a data folder the server may hold.
export default defineConfig({
  dialect: 'postgresql',
  schema: './server/db/schema/index.ts',
  out: './drizzle',
  casing: 'snake_case',
});
