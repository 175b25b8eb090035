import path from 'node:path';
import { applyMigrations, openDatabase, type DatabaseHandle } from '../../apps/api/src/db/database';

/** The test database URL that `npm test` provides (a fresh database on every run). */
export function testDatabaseUrl(): string {
  const url = process.env['TEST_DATABASE_URL'];
  if (!url) {
    throw new Error(
      'TEST_DATABASE_URL is not set: run the suites through `npm test`, which provisions it.',
    );
  }
  return url;
}

/** Opens the test database and applies the real, committed migrations. */
export async function openMigratedTestDatabase(): Promise<DatabaseHandle> {
  const handle = openDatabase(testDatabaseUrl(), 5);
  await applyMigrations(handle.db, path.resolve(import.meta.dirname, '../../drizzle'));
  return handle;
}
