import { Router, type Request } from 'express';
import { labelRunCreateSchema, labelRunListQuerySchema, ROLE_SETS } from '@batchproof/shared';
import type { Authenticator } from '../auth/authenticate';
import { idempotentCreate } from '../core/idempotency';
import { recordId } from '../core/record-id';
import { parse } from '../core/validate';
import type { Database } from '../db/database';
import { contentDisposition, safeFilename } from '../documents/download-name';
import * as domain from './label-runs-domain';
import { resumeIfStalled, startRendering } from './label-run-rendering';

/**
 * `/api/label-runs`: print runs of released formula versions and of released batches, and their
 * PDFs. Owner and formulator print either; production (`ROLE_SETS.goodsIn` with them) prints for
 * a released batch only (`batchId`; the domain refuses production a run without one, 403);
 * every role reads runs, the assessor too, since the safety assessment covers what the label
 * says; the owner withdraws a run's public ingredients page.
 */
export function labelRunsRouter(deps: { db: Database; authn: Authenticator; appUrl: string }) {
  const { db, authn, appUrl } = deps;
  const router = Router();
  const read = authn.allow(ROLE_SETS.everyone);
  const runId = (raw: unknown) => recordId(raw, 'That print run');

  // The PDF starts once the run is committed: the create's work notes the id, the route starts it.
  const created = new WeakMap<Request, string>();
  const create = idempotentCreate(db, async (req, tx) => {
    const request = parse(labelRunCreateSchema, req.body);
    const run = await domain.createRun(tx, req.user!, request, appUrl);
    created.set(req, run.id);
    return run;
  });
  router.post('/', ...authn.allow(ROLE_SETS.goodsIn), async (req, res, next) => {
    await create(req, res, next);
    const id = created.get(req);
    if (id) startRendering(db, req.user!.workshopId, id, appUrl);
  });
  router.get('/', ...read, async (req, res) => {
    res.json(await domain.listRuns(db, req.user!, parse(labelRunListQuerySchema, req.query)));
  });
  /** A run of the caller's workshop; one left half-made by a stopped server is started again. */
  const readRun = async (req: Request) => {
    const run = await domain.getRun(db, req.user!, runId(req.params['id']));
    resumeIfStalled(db, req.user!.workshopId, run, appUrl);
    return run;
  };
  router.get('/:id', ...read, async (req, res) => {
    res.json(await readRun(req));
  });
  router.get('/:id/pdf', ...read, async (req, res) => {
    const run = await readRun(req);
    const pdf = await domain.getRunPdf(db, req.user!, run);
    const name = safeFilename(`${run.formulaName} v${run.version} labels.pdf`, 'pdf');
    res.set({
      'Content-Type': 'application/pdf',
      'Content-Length': String(pdf.length),
      'Content-Disposition': contentDisposition(name, 'inline'),
      'X-Content-Type-Options': 'nosniff',
    });
    res.end(pdf);
  });
  router.post('/:id/withdraw', ...authn.allow(ROLE_SETS.ownerOnly), async (req, res) => {
    res.json(await domain.withdrawRun(db, req.user!, runId(req.params.id)));
  });
  return router;
}
