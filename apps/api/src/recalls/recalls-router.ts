import { Router, type Request } from 'express';
import {
  recallCloseSchema,
  recallCreateSchema,
  recallListQuerySchema,
  recallNoticesSendSchema,
  recallPreviewRequestSchema,
  recallReplyCreateSchema,
  ROLE_SETS,
} from '@batchproof/shared';
import { idempotentCreate } from '../core/idempotency';
import type { ProductionDeps } from '../core/production-deps';
import { recordId } from '../core/record-id';
import { parse } from '../core/validate';
import { contentDisposition } from '../documents/download-name';
import { sendNotices } from './recall-notices';
import * as domain from './recalls-domain';

/**
 * `/api/recalls`: recall cases and drills. Members read them and their summary PDFs; only the
 * owner opens, sends, records replies and closes.
 */
export function recallsRouter(deps: ProductionDeps) {
  const { db, authn, mailer } = deps;
  const router = Router();
  const read = authn.allow(ROLE_SETS.members);
  const owner = authn.allow(ROLE_SETS.ownerOnly);
  const id = (req: Request) => recordId(req.params['id'], 'That recall');

  router.get('/', ...read, async (req, res) => {
    res.json(await domain.listRecalls(db, req.user!, parse(recallListQuerySchema, req.query)));
  });
  router.post('/preview', ...owner, async (req, res) => {
    const { scope } = parse(recallPreviewRequestSchema, req.body);
    res.json(await domain.previewRecall(db, req.user!, scope));
  });
  router.post(
    '/',
    ...owner,
    idempotentCreate(db, (req, tx) =>
      domain.openRecall(tx, req.user!, parse(recallCreateSchema, req.body)),
    ),
  );
  router.get('/:id', ...read, async (req, res) => {
    res.json(await domain.getRecall(db, req.user!, id(req)));
  });
  router.get('/:id/summary.pdf', ...read, async (req, res) => {
    const { pdf, fileName } = await domain.recallSummaryPdf(db, req.user!, id(req));
    res.set({
      'Content-Type': 'application/pdf',
      'Content-Length': String(pdf.length),
      'Content-Disposition': contentDisposition(fileName, 'inline'),
      'X-Content-Type-Options': 'nosniff',
    });
    res.end(pdf);
  });
  router.post('/:id/notices', ...owner, async (req, res) => {
    const recallId = id(req);
    const input = parse(recallNoticesSendSchema, req.body ?? {});
    res.json(await sendNotices(db, mailer, req.user!, recallId, input));
  });
  router.post('/:id/replies', ...owner, async (req, res) => {
    const recallId = id(req);
    const input = parse(recallReplyCreateSchema, req.body);
    res.status(201).json(await domain.addReply(db, req.user!, recallId, input));
  });
  router.post('/:id/close', ...owner, async (req, res) => {
    const recallId = id(req);
    res.json(await domain.closeRecall(db, req.user!, recallId, parse(recallCloseSchema, req.body)));
  });
  return router;
}
