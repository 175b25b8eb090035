import { Router } from 'express';
import {
  labelStockCreateSchema,
  labelStockListQuerySchema,
  labelStockUpdateSchema,
  ROLE_SETS,
} from '@batchproof/shared';
import type { Authenticator } from '../auth/authenticate';
import { idempotentCreate } from '../core/idempotency';
import { contentDisposition, safeFilename } from '../documents/download-name';
import { parse } from '../core/validate';
import type { Database } from '../db/database';
import { labelStocks } from '../db/schema';
import { archiveRoutes } from '../housekeeping/archiving';
import * as domain from './label-stocks-domain';
import { renderCalibrationPdf } from './pdf';

/**
 * `/api/label-stocks`: members read the built-in stocks and the workshop's own, and print any
 * stock's calibration page (`/:id/calibration.pdf`); owner and formulator write their own. A built-in stock's key in a write's path is refused with 409.
 */
export function labelStocksRouter(deps: { db: Database; authn: Authenticator }) {
  const { db, authn } = deps;
  const router = Router();
  const read = authn.allow(ROLE_SETS.members);
  const write = authn.allow(ROLE_SETS.writers);

  router.get('/', ...read, async (req, res) => {
    res.json(
      await domain.listLabelStocks(db, req.user!, parse(labelStockListQuerySchema, req.query)),
    );
  });
  router.get('/:id', ...read, async (req, res) => {
    res.json(await domain.getLabelStock(db, req.user!, String(req.params.id)));
  });
  router.get('/:id/calibration.pdf', ...read, async (req, res) => {
    const record = await domain.getLabelStock(db, req.user!, String(req.params.id));
    const pdf = await renderCalibrationPdf(record.stock);
    res.set({
      'Content-Type': 'application/pdf',
      'Content-Length': String(pdf.length),
      'Content-Disposition': contentDisposition(
        safeFilename(`${record.stock.name} calibration.pdf`, 'pdf'),
        'inline',
      ),
      'X-Content-Type-Options': 'nosniff',
    });
    res.end(pdf);
  });
  router.post(
    '/',
    ...write,
    idempotentCreate(db, (req, tx) =>
      domain.createLabelStock(tx, req.user!, parse(labelStockCreateSchema, req.body)),
    ),
  );
  router.put('/:id', ...write, async (req, res) => {
    const id = domain.ownStockId(req.params.id);
    const stock = parse(labelStockUpdateSchema, req.body);
    res.json(await domain.updateLabelStock(db, req.user!, id, stock));
  });
  router.delete('/:id', ...write, async (req, res) => {
    await domain.deleteLabelStock(db, req.user!, domain.ownStockId(req.params.id));
    res.status(204).end();
  });
  router.use(
    archiveRoutes(db, write, {
      table: labelStocks,
      subjectType: 'label_stock',
      label: 'That label stock',
      read: domain.getLabelStock,
      // A built-in stock's key is refused with 409 rather than answered as unknown.
      idOf: domain.ownStockId,
    }),
  );
  return router;
}
