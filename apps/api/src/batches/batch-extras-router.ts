import { Router } from 'express';
import { batchAmendmentSchema, ROLE_SETS } from '@batchproof/shared';
import { idempotentCreate } from '../core/idempotency';
import type { ProductionDeps } from '../core/production-deps';
import { recordId } from '../core/record-id';
import { parse } from '../core/validate';
import { contentDisposition } from '../documents/download-name';
import { amendBatch } from './batch-amendments';
import { weighSheetPdf } from './weigh-sheet-pdf';

const BATCH = 'That batch';

/**
 * Routes of `/api/batches/:id` beside the record itself: amendments of a released batch (owner
 * and formulator, answering 201 with the batch) and the printed weigh sheet (members).
 */
export function batchExtrasRouter(deps: Pick<ProductionDeps, 'db' | 'authn'>) {
  const { db, authn } = deps;
  const router = Router();
  router.post(
    '/:id/amendments',
    ...authn.allow(ROLE_SETS.writers),
    idempotentCreate(db, (req, tx) => {
      const id = recordId(req.params.id, BATCH);
      return amendBatch(tx, req.user!, id, parse(batchAmendmentSchema, req.body));
    }),
  );
  router.get('/:id/weigh-sheet.pdf', ...authn.allow(ROLE_SETS.members), async (req, res) => {
    const { pdf, fileName } = await weighSheetPdf(db, req.user!, recordId(req.params.id, BATCH));
    res.set({
      'Content-Type': 'application/pdf',
      'Content-Length': String(pdf.length),
      'Content-Disposition': contentDisposition(fileName, 'inline'),
      'X-Content-Type-Options': 'nosniff',
    });
    res.end(pdf);
  });
  return router;
}
