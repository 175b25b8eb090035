import { Router } from 'express';
import type { ProductionDeps } from '../core/production-deps';

/** `/api/audit-events`: the audit log, read and exported by the owner. */
export function auditRouter(deps: ProductionDeps) {
  void deps;
  const router = Router();
  return router;
}
