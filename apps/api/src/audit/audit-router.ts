import { Router } from 'express';
import { auditListQuerySchema, ROLE_SETS } from '@batchproof/shared';
import { sendCsv } from '../core/csv-export';
import type { ProductionDeps } from '../core/production-deps';
import { parse } from '../core/validate';
import { exportAuditCsv, listAuditEvents } from './audit-domain';

/** `/api/audit-events`: the audit log, read and exported by the owner. */
export function auditRouter(deps: ProductionDeps) {
  const { db, authn } = deps;
  const router = Router();
  const owner = authn.allow(ROLE_SETS.ownerOnly);
  router.get('/', ...owner, async (req, res) => {
    res.json(await listAuditEvents(db, req.user!, parse(auditListQuerySchema, req.query)));
  });
  router.get('/export.csv', ...owner, async (req, res) => {
    const text = await exportAuditCsv(db, req.user!, parse(auditListQuerySchema, req.query));
    sendCsv(res, 'audit-log.csv', text);
  });
  return router;
}
