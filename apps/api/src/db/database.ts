import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres';
import { migrate } from 'drizzle-orm/node-postgres/migrator';
import pg from 'pg';
import * as relations from './relations';
import * as schema from './schema';

export const fullSchema = { ...schema, ...relations };
export type Database = NodePgDatabase<typeof fullSchema>;

/** An open database: the Drizzle handle and the pool behind it, closed together. */
export interface DatabaseHandle {
  db: Database;
  pool: pg.Pool;
  close(): Promise<void>;
}

/**
 * Opens a pool and a Drizzle handle with snake_case column names. The pool survives a database
 * restart: an idle connection the server closes is dropped (one log line per outage, not a crash)
 * and the next query opens a fresh one; a query while the server is down fails fast and the error
 * handler answers 503.
 */
export function openDatabase(url: string, max = 10): DatabaseHandle {
  const pool = new pg.Pool({ connectionString: url, max, connectionTimeoutMillis: 10_000 });
  reportOutages(pool);
  const db = drizzle({ client: pool, schema: fullSchema, casing: 'snake_case' });
  return { db, pool, close: () => pool.end() };
}

/** Applies the committed migrations in `folder` (drizzle-kit output). */
export async function applyMigrations(db: Database, folder: string): Promise<void> {
  await migrate(db, { migrationsFolder: folder });
}

/**
 * Without a listener, an idle client's 'error' (the server restarting or closing the connection)
 * is an unhandled event that ends the process. Logs the first loss of an outage in one line and
 * the first successful connection after it, so a restart leaves two lines however many clients
 * were idle.
 */
function reportOutages(pool: pg.Pool) {
  let lost = false;
  pool.on('error', (err: Error & { code?: string }) => {
    if (lost) return;
    lost = true;
    const code = err.code ? ` (${err.code})` : '';
    console.error(`[db] connection lost: ${err.message.split('\n')[0]}${code}`);
  });
  pool.on('connect', () => {
    if (!lost) return;
    lost = false;
    console.log('[db] connected again');
  });
}
