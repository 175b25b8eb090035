import { Router } from 'express';
import type { ProductionDeps } from '../core/production-deps';

/** `/api/recalls`: recall cases and drills. */
export function recallsRouter(deps: ProductionDeps) {
  void deps;
  const router = Router();
  return router;
}
