import { Router } from 'express';
import type { ProductionDeps } from '../core/production-deps';

/** `/api/complaints`: complaints and adverse events. */
export function complaintsRouter(deps: ProductionDeps) {
  void deps;
  const router = Router();
  return router;
}
