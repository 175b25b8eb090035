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

/** Opens the test database (or the one at `url`) and applies the real, committed migrations. */
export async function openMigratedTestDatabase(url = testDatabaseUrl()): Promise<DatabaseHandle> {
  const handle = openDatabase(url, 5);
  await applyMigrations(handle.db, path.resolve(import.meta.dirname, '../../drizzle'));
  return handle;
}
