import { Router } from 'express';
import {
  ROLE_SETS,
  supplierCreateSchema,
  supplierListQuerySchema,
  supplierUpdateSchema,
} from '@batchproof/shared';
import type { Authenticator } from '../auth/authenticate';
import { recordId } from '../core/record-id';
import { parse } from '../core/validate';
import type { Database } from '../db/database';
import { suppliers } from '../db/schema';
import { archiveRoutes } from '../housekeeping/archiving';
import * as domain from './suppliers-domain';

/** `/api/suppliers`: members read, owner and formulator write. */
export function suppliersRouter(deps: { db: Database; authn: Authenticator }) {
  const { db, authn } = deps;
  const router = Router();
  const read = authn.allow(ROLE_SETS.members);
  const write = authn.allow(ROLE_SETS.writers);

  router.get('/', ...read, async (req, res) => {
    res.json(await domain.listSuppliers(db, req.user!, parse(supplierListQuerySchema, req.query)));
  });
  router.get('/:id', ...read, async (req, res) => {
    res.json(await domain.getSupplier(db, req.user!, recordId(req.params.id, 'That supplier')));
  });
  router.post('/', ...write, async (req, res) => {
    const input = parse(supplierCreateSchema, req.body);
    res.status(201).json(await domain.createSupplier(db, req.user!, input));
  });
  router.put('/:id', ...write, async (req, res) => {
    const id = recordId(req.params.id, 'That supplier');
    res.json(await domain.updateSupplier(db, req.user!, id, parse(supplierUpdateSchema, req.body)));
  });
  router.delete('/:id', ...write, async (req, res) => {
    await domain.deleteSupplier(db, req.user!, recordId(req.params.id, 'That supplier'));
    res.status(204).end();
  });
  router.use(
    archiveRoutes(db, write, {
      table: suppliers,
      subjectType: 'supplier',
      label: 'That supplier',
      read: domain.getSupplier,
    }),
  );
  return router;
}
