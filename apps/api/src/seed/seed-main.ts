import path from 'node:path';
import { applyMigrations, openDatabase } from '../db/database';
import { seedDemo } from './demo-seed';

/** Applies migrations and seeds the demo workshop; run by `npm start` before the server starts. */
async function main() {
  const url = process.env['DATABASE_URL'];
  const password = process.env['DEMO_PASSWORD'];
  if (!url || !password) throw new Error('DATABASE_URL and DEMO_PASSWORD are required');
  const handle = openDatabase(url, 2);
  try {
    await applyMigrations(handle.db, path.resolve(process.env['MIGRATIONS_DIR'] ?? 'drizzle'));
    const outcome = await seedDemo(handle.db, password);
    console.log(`[seed] demo workshop ${outcome}`);
  } finally {
    await handle.close();
  }
}

main().catch((err: unknown) => {
  console.error('[seed] failed:', err instanceof Error ? err.message : err);
  process.exit(1);
});
