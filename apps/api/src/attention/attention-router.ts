import { Router } from 'express';
import { ROLE_SETS } from '@batchproof/shared';
import type { Authenticator } from '../auth/authenticate';
import type { Database } from '../db/database';
import { attention } from './attention-domain';

/**
 * `/api/attention`: what needs attention on the home page. Every role may ask; the answer holds
 * only what the caller's role can open.
 */
export function attentionRouter(deps: { db: Database; authn: Authenticator }) {
  const { db, authn } = deps;
  const router = Router();
  router.get('/', ...authn.allow(ROLE_SETS.everyone), async (req, res) => {
    res.json(await attention(db, req.user!, new Date()));
  });
  return router;
}
