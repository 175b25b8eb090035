import { Router } from 'express';
import type { ProductionDeps } from '../core/production-deps';

/** `/api/batches`: batch records from released formula versions. */
export function batchesRouter(deps: ProductionDeps) {
  void deps;
  const router = Router();
  return router;
}
