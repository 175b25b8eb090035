import { Router } from 'express';
import {
  ROLE_SETS,
  customerCreateSchema,
  customerListQuerySchema,
  customerUpdateSchema,
} from '@batchproof/shared';
import { idempotentCreate } from '../core/idempotency';
import type { ProductionDeps } from '../core/production-deps';
import { recordId } from '../core/record-id';
import { parse } from '../core/validate';
import { customers } from '../db/schema';
import { archiveRoutes } from '../housekeeping/archiving';
import * as domain from './customers-domain';

/**
 * `/api/customers`: who the workshop sells to. Members read; owner, formulator and production
 * (goods-in) add, change and archive them; only owner and formulator delete one (no delivery
 * may name it).
 */
export function customersRouter(deps: ProductionDeps) {
  const { db, authn } = deps;
  const router = Router();
  const read = authn.allow(ROLE_SETS.members);
  const write = authn.allow(ROLE_SETS.goodsIn);
  const remove = authn.allow(ROLE_SETS.writers);

  router.get('/', ...read, async (req, res) => {
    res.json(await domain.listCustomers(db, req.user!, parse(customerListQuerySchema, req.query)));
  });
  router.get('/:id', ...read, async (req, res) => {
    res.json(await domain.getCustomer(db, req.user!, recordId(req.params.id, 'That customer')));
  });
  router.post(
    '/',
    ...write,
    idempotentCreate(db, (req, tx) =>
      domain.createCustomer(tx, req.user!, parse(customerCreateSchema, req.body)),
    ),
  );
  router.put('/:id', ...write, async (req, res) => {
    const id = recordId(req.params.id, 'That customer');
    res.json(await domain.updateCustomer(db, req.user!, id, parse(customerUpdateSchema, req.body)));
  });
  router.delete('/:id', ...remove, async (req, res) => {
    await domain.deleteCustomer(db, req.user!, recordId(req.params.id, 'That customer'));
    res.status(204).end();
  });
  router.use(
    archiveRoutes(db, write, {
      table: customers,
      subjectType: 'customer',
      label: 'That customer',
      read: domain.getCustomer,
    }),
  );
  return router;
}
