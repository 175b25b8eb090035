import { Router, type RequestHandler } from 'express';
import { materialImportQuerySchema } from '@batchproof/shared';
import type { Database } from '../db/database';
import { sendCsv } from '../core/csv-export';
import { csvBody, uploadedCsvText } from '../core/csv-upload';
import { parse } from '../core/validate';
import { checkMaterialsCsv, exportMaterialsCsv, importMaterialsCsv } from './materials-csv';

/** CSV export, import preview and import under `/api/materials`. */
export function materialsCsvRoutes(deps: {
  db: Database;
  read: RequestHandler[];
  write: RequestHandler[];
}) {
  const { db, read, write } = deps;
  const router = Router();
  router.get('/export.csv', ...read, async (req, res) => {
    sendCsv(res, 'materials.csv', await exportMaterialsCsv(db, req.user!));
  });
  router.post('/import/preview', ...write, ...csvBody, async (req, res) => {
    res.json((await checkMaterialsCsv(db, req.user!, uploadedCsvText(req))).preview);
  });
  router.post('/import', ...write, ...csvBody, async (req, res) => {
    // `?existing=update`: rows matching a material already on file update it, not copy it.
    const options = parse(materialImportQuerySchema, req.query);
    res.status(201).json(await importMaterialsCsv(db, req.user!, uploadedCsvText(req), options));
  });
  return router;
}
