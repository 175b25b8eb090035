import { Router } from 'express';
import {
  complaintCreateSchema,
  complaintListQuerySchema,
  complaintUpdateSchema,
  ROLE_SETS,
  todayIso,
} from '@batchproof/shared';
import { idempotentCreate } from '../core/idempotency';
import type { ProductionDeps } from '../core/production-deps';
import { recordId } from '../core/record-id';
import { parse } from '../core/validate';
import * as domain from './complaints-domain';

/**
 * `/api/complaints`: complaints and adverse events. Members read; owner, formulator and
 * production log and update them. There is no delete: the records are kept for the retention
 * period (FD&C Act §605(e)).
 */
export function complaintsRouter(deps: ProductionDeps) {
  const { db, authn } = deps;
  const router = Router();
  const read = authn.allow(ROLE_SETS.members);
  const record = authn.allow(ROLE_SETS.goodsIn);

  router.get('/', ...read, async (req, res) => {
    const q = parse(complaintListQuerySchema, req.query);
    res.json(await domain.listComplaints(db, req.user!, q, todayIso()));
  });
  router.get('/:id', ...read, async (req, res) => {
    const id = recordId(req.params.id, 'That complaint');
    res.json(await domain.getComplaint(db, req.user!, id, todayIso()));
  });
  router.post(
    '/',
    ...record,
    idempotentCreate(db, (req, tx) =>
      domain.createComplaint(tx, req.user!, parse(complaintCreateSchema, req.body), todayIso()),
    ),
  );
  router.put('/:id', ...record, async (req, res) => {
    const id = recordId(req.params.id, 'That complaint');
    const input = parse(complaintUpdateSchema, req.body);
    res.json(await domain.updateComplaint(db, req.user!, id, input, todayIso()));
  });
  return router;
}
