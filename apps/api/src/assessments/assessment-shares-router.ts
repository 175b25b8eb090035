import { Router } from 'express';
import type { ProductionDeps } from '../core/production-deps';

/** `/api/assessment-shares`: placeholder, routes are added by the assessment work. */
export function assessmentSharesRouter(_deps: ProductionDeps) {
  const router = Router();
  return router;
}
