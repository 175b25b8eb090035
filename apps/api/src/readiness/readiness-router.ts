import { Router } from 'express';
import type { ProductionDeps } from '../core/production-deps';

/** `/api/readiness`: placeholder, routes are added by the assessment work. */
export function readinessRouter(_deps: ProductionDeps) {
  const router = Router();
  return router;
}
