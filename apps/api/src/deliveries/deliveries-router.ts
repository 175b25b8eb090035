import { Router } from 'express';
import {
  ROLE_SETS,
  deliveryCreateSchema,
  deliveryListQuerySchema,
  deliveryUpdateSchema,
} from '@batchproof/shared';
import { csvBody, uploadedCsvText } from '../core/csv-upload';
import { idempotentCreate } from '../core/idempotency';
import type { ProductionDeps } from '../core/production-deps';
import { recordId } from '../core/record-id';
import { parse } from '../core/validate';
import * as domain from './deliveries-domain';
import { checkDeliveriesCsv, importDeliveriesCsv } from './deliveries-import';

/**
 * `/api/deliveries`: finished lots delivered to customers, and their CSV import. Members read;
 * owner, formulator and production (goods-in) record, correct and import deliveries; only owner
 * and formulator delete one.
 */
export function deliveriesRouter(deps: ProductionDeps) {
  const { db, authn } = deps;
  const router = Router();
  const read = authn.allow(ROLE_SETS.members);
  const write = authn.allow(ROLE_SETS.goodsIn);
  const remove = authn.allow(ROLE_SETS.writers);

  router.get('/', ...read, async (req, res) => {
    res.json(await domain.listDeliveries(db, req.user!, parse(deliveryListQuerySchema, req.query)));
  });
  router.post(
    '/',
    ...write,
    idempotentCreate(db, (req, tx) =>
      domain.createDelivery(tx, req.user!, parse(deliveryCreateSchema, req.body)),
    ),
  );
  router.post('/import/preview', ...write, ...csvBody, async (req, res) => {
    res.json((await checkDeliveriesCsv(db, req.user!, uploadedCsvText(req))).preview);
  });
  router.post(
    '/import',
    ...write,
    ...csvBody,
    idempotentCreate(db, (req, tx) => importDeliveriesCsv(tx, req.user!, uploadedCsvText(req))),
  );
  router.get('/:id', ...read, async (req, res) => {
    res.json(await domain.getDelivery(db, req.user!, recordId(req.params.id, 'That delivery')));
  });
  router.put('/:id', ...write, async (req, res) => {
    const id = recordId(req.params.id, 'That delivery');
    res.json(await domain.updateDelivery(db, req.user!, id, parse(deliveryUpdateSchema, req.body)));
  });
  router.delete('/:id', ...remove, async (req, res) => {
    await domain.deleteDelivery(db, req.user!, recordId(req.params.id, 'That delivery'));
    res.status(204).end();
  });
  return router;
}
