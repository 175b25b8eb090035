import { Router } from 'express';
import type { ProductionDeps } from '../core/production-deps';

/** `/api/trace`: forward from a supplier lot, backward from a finished lot. */
export function traceRouter(deps: ProductionDeps) {
  void deps;
  const router = Router();
  return router;
}
