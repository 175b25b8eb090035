import { Router, type Request } from 'express';
import {
  assessmentCreateSchema,
  assessmentSignSchema,
  assessmentUpdateSchema,
  ROLE_SETS,
} from '@batchproof/shared';
import { idempotentCreate } from '../core/idempotency';
import type { ProductionDeps } from '../core/production-deps';
import { recordId } from '../core/record-id';
import { parse } from '../core/validate';
import { contentDisposition } from '../documents/download-name';
import * as domain from './assessments-domain';

/**
 * `/api/assessments`: safety assessments of shared formula versions. Owner, formulators and
 * viewers read every one; an assessor reads only their own while the version is shared with
 * them, and is the only one who starts, edits and signs it.
 */
export function assessmentsRouter(deps: ProductionDeps) {
  const { db, authn } = deps;
  const router = Router();
  const read = authn.allow(ROLE_SETS.assessments);
  const assessor = authn.allow(['assessor']);
  const id = (req: Request) => recordId(req.params['id'], 'That assessment');

  router.get('/', ...read, async (req, res) => {
    res.json(await domain.listAssessments(db, req.user!));
  });
  router.post(
    '/',
    ...assessor,
    idempotentCreate(db, (req, tx) =>
      domain.startAssessment(tx, req.user!, parse(assessmentCreateSchema, req.body)),
    ),
  );
  router.get('/:id', ...read, async (req, res) => {
    res.json(await domain.getAssessment(db, req.user!, id(req)));
  });
  router.put('/:id', ...assessor, async (req, res) => {
    const assessmentId = id(req);
    const input = parse(assessmentUpdateSchema, req.body);
    res.json(await domain.updateAssessment(db, req.user!, assessmentId, input));
  });
  router.post('/:id/sign', ...assessor, async (req, res) => {
    const assessmentId = id(req);
    const input = parse(assessmentSignSchema, req.body);
    res.json(await domain.signAssessment(db, req.user!, assessmentId, input));
  });
  router.get('/:id/packet.pdf', ...read, async (req, res) => {
    const { pdf, fileName } = await domain.assessmentPdf(db, req.user!, id(req));
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
