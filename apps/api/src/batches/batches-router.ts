import { Router } from 'express';
import {
  batchCreateSchema,
  batchListQuerySchema,
  batchRecordInputSchema,
  ROLE_SETS,
} from '@batchproof/shared';
import { idempotentCreate } from '../core/idempotency';
import type { ProductionDeps } from '../core/production-deps';
import { recordId } from '../core/record-id';
import { parse } from '../core/validate';
import { batchExtrasRouter } from './batch-extras-router';
import * as domain from './batches-domain';

const BATCH = 'That batch';

/**
 * `/api/batches`: batch records from released formula versions. Members read; owner, formulator
 * and production start, record and delete drafts; owner and formulator release.
 */
export function batchesRouter(deps: ProductionDeps) {
  const { db, authn } = deps;
  const router = Router();
  const read = authn.allow(ROLE_SETS.members);
  const record = authn.allow(ROLE_SETS.goodsIn);
  const write = authn.allow(ROLE_SETS.writers);

  router.get('/', ...read, async (req, res) => {
    res.json(await domain.listBatches(db, req.user!, parse(batchListQuerySchema, req.query)));
  });
  router.post(
    '/',
    ...record,
    idempotentCreate(db, (req, tx) =>
      domain.createBatch(tx, req.user!, parse(batchCreateSchema, req.body)),
    ),
  );
  router.get('/:id', ...read, async (req, res) => {
    res.json(await domain.getBatch(db, req.user!, recordId(req.params.id, BATCH)));
  });
  router.put('/:id', ...record, async (req, res) => {
    const id = recordId(req.params.id, BATCH);
    res.json(await domain.recordBatch(db, req.user!, id, parse(batchRecordInputSchema, req.body)));
  });
  router.delete('/:id', ...record, async (req, res) => {
    await domain.deleteDraftBatch(db, req.user!, recordId(req.params.id, BATCH));
    res.status(204).end();
  });
  router.post('/:id/release', ...write, async (req, res) => {
    res.json(await domain.releaseBatch(db, req.user!, recordId(req.params.id, BATCH)));
  });
  // Amendments of released batches and the printed weigh sheet.
  router.use(batchExtrasRouter(deps));
  return router;
}
