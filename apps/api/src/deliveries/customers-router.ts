import { Router } from 'express';
import type { ProductionDeps } from '../core/production-deps';

/** `/api/customers`: who the workshop sells to. */
export function customersRouter(deps: ProductionDeps) {
  void deps;
  const router = Router();
  return router;
}
