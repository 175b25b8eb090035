import { Router } from 'express';
import {
  lotCreateSchema,
  lotListQuerySchema,
  lotUpdateSchema,
  ROLE_SETS,
  stockAdjustmentSchema,
} from '@batchproof/shared';
import type { Authenticator } from '../auth/authenticate';
import { idempotentCreate } from '../core/idempotency';
import { recordId } from '../core/record-id';
import { parse } from '../core/validate';
import type { Database } from '../db/database';
import * as domain from './lots-domain';
import { adjustStock, listStockMovements } from './stock-adjustments';

/**
 * `/api/lots`: goods-in. Members read; owner, formulator and production record deliveries and
 * correct them; only owner and formulator delete a lot. Members read a lot's stock movements;
 * goods-in records adjustments (spillage, count correction, disposal) with a reason.
 */
export function lotsRouter(deps: { db: Database; authn: Authenticator }) {
  const { db, authn } = deps;
  const router = Router();
  const read = authn.allow(ROLE_SETS.members);
  const record = authn.allow(ROLE_SETS.goodsIn);
  const write = authn.allow(ROLE_SETS.writers);

  router.get('/', ...read, async (req, res) => {
    res.json(await domain.listLots(db, req.user!, parse(lotListQuerySchema, req.query)));
  });
  router.get('/:id', ...read, async (req, res) => {
    res.json(await domain.getLot(db, req.user!, recordId(req.params.id, 'That lot')));
  });
  router.post(
    '/',
    ...record,
    idempotentCreate(db, (req, tx) =>
      domain.createLot(tx, req.user!, parse(lotCreateSchema, req.body)),
    ),
  );
  router.put('/:id', ...record, async (req, res) => {
    const id = recordId(req.params.id, 'That lot');
    res.json(await domain.updateLot(db, req.user!, id, parse(lotUpdateSchema, req.body)));
  });
  router.get('/:id/movements', ...read, async (req, res) => {
    res.json(await listStockMovements(db, req.user!, recordId(req.params.id, 'That lot')));
  });
  router.post(
    '/:id/adjustments',
    ...record,
    idempotentCreate(db, (req, tx) => {
      const lotId = recordId(req.params.id, 'That lot');
      const body: unknown = req.body;
      const input = typeof body === 'object' && body !== null ? { ...body, lotId } : { lotId };
      return adjustStock(tx, req.user!, parse(stockAdjustmentSchema, input));
    }),
  );
  router.delete('/:id', ...write, async (req, res) => {
    await domain.deleteLot(db, req.user!, recordId(req.params.id, 'That lot'));
    res.status(204).end();
  });
  return router;
}
