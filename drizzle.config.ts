import { defineConfig } from 'drizzle-kit';

export default defineConfig({
  dialect: 'postgresql',
  schema: './apps/api/src/db/schema/index.ts',
  out: './drizzle',
  casing: 'snake_case',
});
