import { Router } from 'express';
import * as z from 'zod';
import {
  marketRecordInputSchema,
  marketRecordKindSchema,
  ROLE_SETS,
  todayIso,
} from '@batchproof/shared';
import type { ProductionDeps } from '../core/production-deps';
import { recordId } from '../core/record-id';
import { parse } from '../core/validate';
import * as domain from './readiness-domain';

/** The kind in the path, refused like a body field (`fieldErrors.kind`). */
const kindParam = z.object({ kind: marketRecordKindSchema });

/**
 * `/api/readiness`: per product and market, what is in place before it is sold and what is
 * missing. Members read; the writers (owner, formulator) record the references the authorities'
 * portals and forms gave them.
 */
export function readinessRouter(deps: ProductionDeps) {
  const { db, authn } = deps;
  const router = Router();

  router.get('/', ...authn.allow(ROLE_SETS.members), async (req, res) => {
    res.json(await domain.listReadiness(db, req.user!, todayIso()));
  });
  router.put('/:formulaId/records/:kind', ...authn.allow(ROLE_SETS.writers), async (req, res) => {
    const formulaId = recordId(req.params.formulaId, 'That formula');
    const { kind } = parse(kindParam, { kind: req.params.kind });
    const input = parse(marketRecordInputSchema, req.body);
    res.json(await domain.saveMarketRecord(db, req.user!, formulaId, kind, input));
  });
  return router;
}
