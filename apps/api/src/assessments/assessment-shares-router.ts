import { Router } from 'express';
import { ROLE_SETS, shareCreateSchema, shareListQuerySchema } from '@batchproof/shared';
import type { ProductionDeps } from '../core/production-deps';
import { recordId } from '../core/record-id';
import { parse } from '../core/validate';
import * as domain from './shares-domain';

/**
 * `/api/assessment-shares`: formula versions shared with assessors. The owner shares and
 * unshares; owner, formulators and viewers see every live share, an assessor their own.
 */
export function assessmentSharesRouter(deps: ProductionDeps) {
  const { db, authn, mailer, appUrl } = deps;
  const router = Router();
  const owner = authn.allow(ROLE_SETS.ownerOnly);

  router.get('/', ...authn.allow(ROLE_SETS.assessments), async (req, res) => {
    res.json(await domain.listShares(db, req.user!, parse(shareListQuerySchema, req.query)));
  });
  // Sharing twice answers the live share (200), so a retry never makes a second one.
  router.post('/', ...owner, async (req, res) => {
    const input = parse(shareCreateSchema, req.body);
    const { created, share } = await domain.shareVersion(db, mailer, appUrl, req.user!, input);
    res.status(created ? 201 : 200).json(share);
  });
  router.delete('/:id', ...owner, async (req, res) => {
    await domain.unshareVersion(db, req.user!, recordId(req.params['id'], 'That share'));
    res.status(204).end();
  });
  return router;
}
