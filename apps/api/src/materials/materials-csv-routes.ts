import express, { Router, type RequestHandler } from 'express';
import multer from 'multer';
import { materialImportQuerySchema } from '@batchproof/shared';
import type { Database } from '../db/database';
import { AppError } from '../core/app-error';
import { sendCsv } from '../core/csv-export';
import { multipart } from '../core/multipart';
import { parse } from '../core/validate';
import { checkMaterialsCsv, exportMaterialsCsv, importMaterialsCsv } from './materials-csv';
import { refuseUtf16 } from './materials-csv-messages';

/** Largest CSV accepted, bytes. */
const CSV_MAX_BYTES = 5 * 1024 * 1024;
const csvUpload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: CSV_MAX_BYTES, files: 1 },
});
// A CSV arrives either as a multipart file (a form) or as a text/csv body (a script).
const csvBody: RequestHandler[] = [
  express.text({ type: ['text/csv', 'text/plain'], limit: CSV_MAX_BYTES }),
  multipart(csvUpload.single('file')),
];

function csvText(req: express.Request): string {
  if (req.file) {
    refuseUtf16(req.file.buffer);
    return req.file.buffer.toString('utf8');
  }
  if (typeof req.body === 'string' && req.body.trim()) {
    refuseUtf16(req.body);
    return req.body;
  }
  throw new AppError(400, 'validation_failed', 'Send a CSV file.', {
    file: ['Choose a CSV file, or send the CSV as a text/csv body'],
  });
}

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
    res.json((await checkMaterialsCsv(db, req.user!, csvText(req))).preview);
  });
  router.post('/import', ...write, ...csvBody, async (req, res) => {
    // `?existing=update`: rows matching a material already on file update it, not copy it.
    const options = parse(materialImportQuerySchema, req.query);
    res.status(201).json(await importMaterialsCsv(db, req.user!, csvText(req), options));
  });
  return router;
}
