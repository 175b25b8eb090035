import { Router } from 'express';
import { ROLE_SETS, referenceRowsQuerySchema, type ReferenceRowsPage } from '@batchproof/shared';
import type { Authenticator } from '../auth/authenticate';
import { notFound } from '../core/app-error';
import { parse } from '../core/validate';
import type { Database } from '../db/database';
import * as repo from './reference-repository';

const iso = <T extends { syncedAt: Date }>(l: T) => ({ ...l, syncedAt: l.syncedAt.toISOString() });

/** Read-only reference lists, for every signed-in member. */
export function referenceRouter({ db, authn }: { db: Database; authn: Authenticator }): Router {
  const router = Router();

  router.get('/', ...authn.allow(ROLE_SETS.everyone), async (_req, res) => {
    res.json({ items: (await repo.listReferenceLists(db)).map(iso) });
  });

  router.get('/:key', ...authn.allow(ROLE_SETS.everyone), async (req, res) => {
    const list = await repo.findReferenceList(db, String(req.params.key));
    if (!list) throw notFound('That reference list');
    const q = parse(referenceRowsQuerySchema, req.query);
    const { items, total } = await repo.pageReferenceRows(db, list.key, q);
    const body: ReferenceRowsPage = {
      list: iso(list),
      items: items.map((r) => ({
        ...r,
        status: r.status as ReferenceRowsPage['items'][number]['status'],
      })),
      total,
      page: q.page,
      pageSize: q.pageSize,
    };
    res.json(body);
  });

  return router;
}
