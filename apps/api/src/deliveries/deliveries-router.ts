import { Router } from 'express';
import type { ProductionDeps } from '../core/production-deps';

/** `/api/deliveries`: finished lots delivered to customers, and their CSV import. */
export function deliveriesRouter(deps: ProductionDeps) {
  void deps;
  const router = Router();
  return router;
}
