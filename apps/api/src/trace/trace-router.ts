import { Router } from 'express';
import { ROLE_SETS, traceSearchQuerySchema } from '@batchproof/shared';
import type { ProductionDeps } from '../core/production-deps';
import { recordId } from '../core/record-id';
import { parse } from '../core/validate';
import * as domain from './trace-domain';

/**
 * `/api/trace`: forward from a supplier lot to the batches that used it and the customers who
 * received them; backward from a finished lot (a released batch) to every supplier lot, its
 * supplier and documents. Members read; another workshop's record is not found.
 */
export function traceRouter(deps: ProductionDeps) {
  const { db, authn } = deps;
  const router = Router();
  const read = authn.allow(ROLE_SETS.members);

  router.get('/search', ...read, async (req, res) => {
    res.json(await domain.searchTrace(db, req.user!, parse(traceSearchQuerySchema, req.query)));
  });
  router.get('/supplier-lots/:id', ...read, async (req, res) => {
    const id = recordId(req.params.id, 'That lot');
    res.json(await domain.traceSupplierLot(db, req.user!, id));
  });
  router.get('/finished-lots/:id', ...read, async (req, res) => {
    const id = recordId(req.params.id, 'That finished lot');
    res.json(await domain.traceFinishedLot(db, req.user!, id));
  });
  return router;
}
