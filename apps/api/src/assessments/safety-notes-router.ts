import { Router } from 'express';
import { ROLE_SETS, safetyNotesSchema, versionNumberSchema } from '@batchproof/shared';
import { notFound } from '../core/app-error';
import type { ProductionDeps } from '../core/production-deps';
import { recordId } from '../core/record-id';
import { parse } from '../core/validate';
import * as domain from './safety-notes-domain';

const versionNumber = versionNumberSchema('The version', true);

/** `:n` as a version number; anything else is simply not found. */
function versionParam(raw: unknown) {
  const parsed = versionNumber.safeParse(raw);
  if (!parsed.success) throw notFound('That version');
  return parsed.data;
}

/**
 * `/api/formulas/:id/versions/:n/safety-notes`: the maker's notes for Annex I Part A items 2–5.
 * Members read them, and an assessor the version is shared with; owner and formulator write them
 * until the version's assessment is signed.
 */
export function safetyNotesRouter(deps: Pick<ProductionDeps, 'db' | 'authn'>) {
  const { db, authn } = deps;
  const router = Router();
  const path = '/:id/versions/:n/safety-notes';
  const formulaId = (raw: unknown) => recordId(raw, 'That formula');

  router.get(path, ...authn.allow(ROLE_SETS.everyone), async (req, res) => {
    const id = formulaId(req.params['id']);
    const n = versionParam(req.params['n']);
    res.json(await domain.getSafetyNotes(db, req.user!, id, n));
  });
  router.put(path, ...authn.allow(ROLE_SETS.writers), async (req, res) => {
    const id = formulaId(req.params['id']);
    const n = versionParam(req.params['n']);
    const notes = parse(safetyNotesSchema, req.body);
    res.json(await domain.putSafetyNotes(db, req.user!, id, n, notes));
  });
  return router;
}
