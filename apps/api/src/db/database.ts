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

/** Opens a pool and a Drizzle handle with snake_case column names. */
export function openDatabase(url: string, max = 10): DatabaseHandle {
  const pool = new pg.Pool({ connectionString: url, max });
  const db = drizzle({ client: pool, schema: fullSchema, casing: 'snake_case' });
  return { db, pool, close: () => pool.end() };
}

/** Applies the committed migrations in `folder` (drizzle-kit output). */
export async function applyMigrations(db: Database, folder: string): Promise<void> {
  await migrate(db, { migrationsFolder: folder });
}
