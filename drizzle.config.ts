import { defineConfig } from 'drizzle-kit';

// Migrations are generated from the schema and committed; the server applies them at start.
// The same SQL runs on embedded PGlite and on a PostgreSQL server.
export default defineConfig({
  dialect: 'postgresql',
  schema: './server/db/schema/index.ts',
  out: './drizzle',
  casing: 'snake_case',
});
