// Prints the test database URL (creating the cluster and database if needed), for running one
// suite by hand:  TEST_DATABASE_URL=$(node scripts/test-db-url.mjs) npx vitest run --config …
import { ensureCluster, ensureDatabase } from './lib/provision.mjs';

const cluster = ensureCluster(Number(process.env.DATABASE_PORT ?? 54329));
console.log(ensureDatabase(cluster, 'batchproof_test'));
