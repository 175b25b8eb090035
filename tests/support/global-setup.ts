import { openMigratedTestDatabase } from './test-database';

/** Applies the migrations once before a suite's files run in parallel. */
export default async function setup() {
  const handle = await openMigratedTestDatabase();
  await handle.close();
}
