import { Router } from 'express';
import { evaluateFormula, evaluationInputSchema, ROLE_SETS } from '@batchproof/shared';
import type { Authenticator } from '../auth/authenticate';
import { parse } from '../core/validate';

/**
 * `POST /api/evaluations`: runs the shared compliance engine on a posted, unsaved formula, so any
 * member can check a what-if without saving it. The engine is pure; nothing is stored.
 */
export function evaluationsRouter({ authn }: { authn: Authenticator }): Router {
  const router = Router();
  router.post('/', ...authn.allow(ROLE_SETS.everyone), (req, res) => {
    res.json(evaluateFormula(parse(evaluationInputSchema, req.body)));
  });
  return router;
}
