import { defineConfig } from 'drizzle-kit';

// drizzle-kit only diffs the schema files; it never needs a live database for `generate`.
export default defineConfig({
  dialect: 'mysql',
  schema: './server/db/schema/*.ts',
  out: './drizzle',
});
