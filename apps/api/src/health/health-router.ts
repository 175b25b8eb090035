import { Router } from 'express';
import { sql } from 'drizzle-orm';
import type { Health } from '@batchproof/shared';
import type { Database } from '../db/database';

export function healthRouter(db: Database, version: string): Router {
  const router = Router();
  router.get('/', async (_req, res) => {
    let database: Health['database'] = 'up';
    try {
      await db.execute(sql`select 1`);
    } catch {
      // Any connection or query error means the database is unreachable right now.
      database = 'down';
    }
    const body: Health = { status: database === 'up' ? 'ok' : 'degraded', database, version };
    res.status(database === 'up' ? 200 : 503).json(body);
  });
  return router;
}
