import { Router } from 'express';
import type { ProductionDeps } from '../core/production-deps';

/** `/api/assessments`: placeholder, routes are added by the assessment work. */
export function assessmentsRouter(_deps: ProductionDeps) {
  const router = Router();
  return router;
}
