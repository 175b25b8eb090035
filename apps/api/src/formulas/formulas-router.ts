import { Router } from 'express';
import {
  compareQuerySchema,
  formulaCreateSchema,
  formulaListQuerySchema,
  formulaUpdateSchema,
  formulaVersionInputSchema,
  newVersionSchema,
  releaseSchema,
  ROLE_SETS,
  scaleRequestSchema,
  versionNumberSchema,
} from '@batchproof/shared';
import type { Authenticator } from '../auth/authenticate';
import { notFound } from '../core/app-error';
import { idempotentCreate } from '../core/idempotency';
import { recordId } from '../core/record-id';
import { parse } from '../core/validate';
import type { Database } from '../db/database';
import { formulas } from '../db/schema';
import { archiveRoutes } from '../housekeeping/archiving';
import * as views from './formula-views';
import * as domain from './formulas-domain';

const versionNumber = versionNumberSchema('The version', true);

/** Parses `:n`; anything but a positive whole number is simply not found. */
function versionParam(raw: unknown) {
  const parsed = versionNumber.safeParse(raw);
  if (!parsed.success) throw notFound('That version');
  return parsed.data;
}

/** `/api/formulas`: versioned formulas. Members read, owner and formulator write. */
export function formulasRouter(deps: { db: Database; authn: Authenticator }) {
  const { db, authn } = deps;
  const router = Router();
  const read = authn.allow(ROLE_SETS.members);
  const write = authn.allow(ROLE_SETS.writers);
  const formulaId = (raw: unknown) => recordId(raw, 'That formula');

  router.get('/', ...read, async (req, res) => {
    res.json(await views.listFormulas(db, req.user!, parse(formulaListQuerySchema, req.query)));
  });
  router.post(
    '/',
    ...write,
    idempotentCreate(db, (req, tx) =>
      domain.createFormula(tx, req.user!, parse(formulaCreateSchema, req.body)),
    ),
  );
  router.get('/:id', ...read, async (req, res) => {
    res.json(await views.getFormula(db, req.user!, formulaId(req.params.id)));
  });
  router.patch('/:id', ...write, async (req, res) => {
    const id = formulaId(req.params.id);
    res.json(await domain.updateFormula(db, req.user!, id, parse(formulaUpdateSchema, req.body)));
  });
  router.delete('/:id', ...write, async (req, res) => {
    await domain.deleteFormula(db, req.user!, formulaId(req.params.id));
    res.status(204).end();
  });
  router.use(
    archiveRoutes(db, write, {
      table: formulas,
      subjectType: 'formula',
      label: 'That formula',
      read: views.getFormula,
    }),
  );
  router.get('/:id/compare', ...read, async (req, res) => {
    const id = formulaId(req.params.id);
    const { from, to } = parse(compareQuerySchema, req.query);
    res.json(await views.compare(db, req.user!, id, from, to));
  });
  router.post(
    '/:id/versions',
    ...write,
    idempotentCreate(db, (req, tx) => {
      const id = formulaId(req.params['id']);
      const { fromVersion } = parse(newVersionSchema, req.body);
      return domain.newDraft(tx, req.user!, id, fromVersion);
    }),
  );
  router.get('/:id/versions/:n', ...read, async (req, res) => {
    const id = formulaId(req.params.id);
    res.json(await views.getVersion(db, req.user!, id, versionParam(req.params.n)));
  });
  router.put('/:id/versions/:n', ...write, async (req, res) => {
    const id = formulaId(req.params.id);
    const n = versionParam(req.params.n);
    const input = parse(formulaVersionInputSchema, req.body);
    res.json(await domain.saveDraft(db, req.user!, id, n, input));
  });
  router.patch('/:id/versions/:n', ...write, async (req, res) => {
    const id = formulaId(req.params.id);
    res.json(await domain.patchDraft(db, req.user!, id, versionParam(req.params.n), req.body));
  });
  router.post('/:id/versions/:n/release', ...write, async (req, res) => {
    const id = formulaId(req.params.id);
    const n = versionParam(req.params.n);
    res.json(await domain.release(db, req.user!, id, n, parse(releaseSchema, req.body)));
  });
  router.post('/:id/versions/:n/scale', ...read, async (req, res) => {
    const id = formulaId(req.params.id);
    const n = versionParam(req.params.n);
    res.json(await views.scale(db, req.user!, id, n, parse(scaleRequestSchema, req.body)));
  });
  return router;
}
