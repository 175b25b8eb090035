import { Router } from 'express';
import { productIdentitySchema, ROLE_SETS } from '@batchproof/shared';
import type { Authenticator } from '../auth/authenticate';
import { recordId } from '../core/record-id';
import { parse } from '../core/validate';
import type { Database } from '../db/database';
import * as domain from './product-identity-domain';

/**
 * `/api/formulas/:id/identity`: what a formula's labels carry beyond the engine's output. Members
 * read it; owner and formulator write it.
 */
export function productIdentityRouter(deps: { db: Database; authn: Authenticator }) {
  const { db, authn } = deps;
  const router = Router();
  const formulaId = (raw: unknown) => recordId(raw, 'That formula');
  router.get('/:id/identity', ...authn.allow(ROLE_SETS.members), async (req, res) => {
    res.json(await domain.getProductIdentity(db, req.user!, formulaId(req.params.id)));
  });
  router.put('/:id/identity', ...authn.allow(ROLE_SETS.writers), async (req, res) => {
    const id = formulaId(req.params.id);
    const identity = parse(productIdentitySchema, req.body);
    res.json(await domain.putProductIdentity(db, req.user!, id, identity));
  });
  return router;
}
