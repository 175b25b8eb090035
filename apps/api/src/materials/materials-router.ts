import { Router } from 'express';
import {
  materialCreateSchema,
  materialIdsQuerySchema,
  materialListQuerySchema,
  materialUpdateSchema,
  ROLE_SETS,
} from '@batchproof/shared';
import type { Authenticator } from '../auth/authenticate';
import { recordId } from '../core/record-id';
import { parse } from '../core/validate';
import type { Database } from '../db/database';
import { documentStatus } from '../documents/documents-domain';
import { materials } from '../db/schema';
import { archiveRoutes } from '../housekeeping/archiving';
import { materialsCsvRoutes } from './materials-csv-routes';
import * as domain from './materials-domain';

/** `/api/materials`: members read, owner and formulator write. */
export function materialsRouter(deps: { db: Database; authn: Authenticator }) {
  const { db, authn } = deps;
  const router = Router();
  const read = authn.allow(ROLE_SETS.members);
  const write = authn.allow(ROLE_SETS.writers);

  router.get('/', ...read, async (req, res) => {
    // `?ids=a,b,c` reads the full records of named materials (a formula's lines) in one request.
    if (req.query['ids'] !== undefined) {
      const { ids } = parse(materialIdsQuerySchema, req.query);
      res.json(await domain.getMaterials(db, req.user!, ids));
      return;
    }
    res.json(await domain.listMaterials(db, req.user!, parse(materialListQuerySchema, req.query)));
  });
  // The CSV routes have fixed paths, so they go before `/:id`.
  router.use(materialsCsvRoutes({ db, read, write }));
  router.get('/:id', ...read, async (req, res) => {
    res.json(await domain.getMaterial(db, req.user!, recordId(req.params.id, 'That material')));
  });
  router.get('/:id/document-status', ...read, async (req, res) => {
    const id = recordId(req.params.id, 'That material');
    res.json(await documentStatus(db, req.user!, id, new Date()));
  });
  router.post('/', ...write, async (req, res) => {
    const input = parse(materialCreateSchema, req.body);
    res.status(201).json(await domain.createMaterial(db, req.user!, input));
  });
  router.put('/:id', ...write, async (req, res) => {
    const id = recordId(req.params.id, 'That material');
    res.json(await domain.updateMaterial(db, req.user!, id, parse(materialUpdateSchema, req.body)));
  });
  router.delete('/:id', ...write, async (req, res) => {
    await domain.deleteMaterial(db, req.user!, recordId(req.params.id, 'That material'));
    res.status(204).end();
  });
  router.use(
    archiveRoutes(db, write, {
      table: materials,
      subjectType: 'material',
      label: 'That material',
      read: domain.getMaterial,
    }),
  );
  return router;
}
