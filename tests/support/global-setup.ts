import { syncReferenceData } from '../../apps/api/src/reference/reference-sync';
import { openMigratedTestDatabase } from './test-database';

/** Applies the migrations and syncs the reference lists once, before a suite's files run in parallel. */
export default async function setup() {
  const handle = await openMigratedTestDatabase();
  try {
    await syncReferenceData(handle.db);
  } finally {
    await handle.close();
  }
}
