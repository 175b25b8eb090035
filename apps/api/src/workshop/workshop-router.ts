import { Router } from 'express';
import {
  productionSettingsSchema,
  ROLE_SETS,
  workshopLabelDetailsSchema,
} from '@batchproof/shared';
import type { Authenticator } from '../auth/authenticate';
import { parse } from '../core/validate';
import type { Database } from '../db/database';
import * as domain from './workshop-domain';

/**
 * `/api/workshop`: the workshop's own details. Every member reads the name and address labels
 * print (`/label-details`); only the owner changes them. Members read the production settings
 * (`/production`: weighing tolerance, batch code pattern, small business); only the owner sets them.
 */
export function workshopRouter(deps: { db: Database; authn: Authenticator }) {
  const { db, authn } = deps;
  const router = Router();
  router.get('/label-details', ...authn.allow(ROLE_SETS.everyone), async (req, res) => {
    res.json(await domain.getLabelDetails(db, req.user!));
  });
  router.put('/label-details', ...authn.allow(ROLE_SETS.ownerOnly), async (req, res) => {
    const details = parse(workshopLabelDetailsSchema, req.body);
    res.json(await domain.putLabelDetails(db, req.user!, details));
  });
  router.get('/production', ...authn.allow(ROLE_SETS.members), async (req, res) => {
    res.json(await domain.getProductionSettings(db, req.user!));
  });
  router.put('/production', ...authn.allow(ROLE_SETS.ownerOnly), async (req, res) => {
    const settings = parse(productionSettingsSchema, req.body);
    res.json(await domain.putProductionSettings(db, req.user!, settings));
  });
  return router;
}
