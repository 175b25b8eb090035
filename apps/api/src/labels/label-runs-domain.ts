import { randomBytes } from 'node:crypto';
import {
  buildLabelContent,
  BUILT_IN_LABEL_STOCKS,
  labelAreas,
  missingLabelElements,
  type LabelContentInput,
  LABEL_RUN_LIST_MAX,
  labelPositions,
  MAX_LABELS_PER_RUN,
  todayIso,
  type LabelRunCreateParsed,
  type LabelRunListQuery,
  type LabelRunRecord,
  type LabelStock,
  type MissingLabelElementRecord,
  type ProductType,
} from '@batchproof/shared';
import { recordAudit } from '../audit/audit-log';
import type { AuthUser } from '../auth/authenticate';
import { AppError, conflict, notFound } from '../core/app-error';
import { isRecordId } from '../core/record-id';
import type { Database } from '../db/database';
import { evaluateBatch, type EvaluatedBatch } from '../batches/batch-labels';
import { evaluateLines } from '../formulas/formula-evaluation';
import * as formulasRepo from '../formulas/formulas-repository';
import {
  byFormula,
  missingAssessmentFindings,
  signedVersions,
} from '../readiness/assessment-findings';
import { findLabelDetails } from '../workshop/workshop-repository';
import { checkLabelFit, countLabels, type LabelSheetRequest } from './pdf';
import { findLabelStock } from './label-stocks-repository';
import { findProductIdentity } from './product-identity-repository';
import * as repo from './label-runs-repository';

const RUN = 'That print run';

/** The public ingredients page's path for a token. */
export const publicPagePath = (token: string) => `/p/${token}`;

/** A run in the API's shape. */
export function runRecord(row: repo.LabelRunRecordRow): LabelRunRecord {
  return {
    id: row.id,
    formulaId: row.formulaId,
    formulaName: row.formulaName,
    version: row.versionNumber,
    markets: row.markets,
    stock: { id: row.stockId, name: row.stock.name },
    layout: row.layout,
    barcode: row.barcode,
    startPosition: row.startPosition,
    copies: row.copies,
    labelCount: row.labelCount,
    pageCount: row.pageCount,
    lotCode: row.lotCode,
    expiresOn: row.expiresOn,
    batchId: row.batchId,
    status: row.status,
    progress: { done: row.progressDone, total: row.progressTotal },
    overrideReason: row.overrideReason,
    overriddenMissing: row.overriddenMissing,
    outOfDate: row.outOfDate,
    publicPage: {
      path: publicPagePath(row.publicToken),
      withdrawnAt: row.withdrawnAt?.toISOString() ?? null,
    },
    createdAt: row.createdAt.toISOString(),
    createdBy: { id: row.createdBy, name: row.createdByName },
  };
}

/**
 * Runs in the API's shape with what their version lacks in safety assessment for the markets
 * printed (one query for all of them): labels carry that finding until the version is signed.
 */
async function runRecords(
  db: Database,
  workshopId: string,
  rows: readonly repo.LabelRunRecordRow[],
): Promise<LabelRunRecord[]> {
  const signed = byFormula(
    await signedVersions(
      db,
      workshopId,
      rows.map((r) => r.formulaId),
    ),
  );
  return rows.map((row) => ({
    ...runRecord(row),
    assessmentFindings: missingAssessmentFindings(
      { id: row.versionId, number: row.versionNumber, markets: row.markets },
      signed.get(row.formulaId) ?? [],
    ),
  }));
}

export async function getRun(db: Database, actor: AuthUser, id: string) {
  const row = await repo.findRunRecord(db, actor.workshopId, id);
  if (!row) throw notFound(RUN);
  return (await runRecords(db, actor.workshopId, [row]))[0]!;
}

export async function listRuns(db: Database, actor: AuthUser, q: LabelRunListQuery) {
  if (q.formulaId && !(await formulasRepo.findFormula(db, actor.workshopId, q.formulaId)))
    throw notFound('That formula');
  const rows = await repo.listRunRecords(db, actor.workshopId, q.formulaId, LABEL_RUN_LIST_MAX);
  return { items: await runRecords(db, actor.workshopId, rows) };
}

/** A 400 on one field of the request, like a zod refusal. */
const fieldError = (field: string, message: string) =>
  new AppError(400, 'validation_failed', 'Some fields need attention.', { [field]: [message] });

/** A built-in stock by key, or one of the workshop's own by id; a field error otherwise. */
async function chosenStock(db: Database, workshopId: string, stockId: string): Promise<LabelStock> {
  const builtIn = BUILT_IN_LABEL_STOCKS.find((s) => s.key === stockId);
  if (builtIn) {
    const { key: _key, ...stock } = builtIn;
    return stock;
  }
  const own = isRecordId(stockId) ? await findLabelStock(db, workshopId, stockId) : undefined;
  if (!own) throw fieldError('stockId', 'Choose one of the label stocks');
  return { ...own.geometry, name: own.name } as LabelStock;
}

/**
 * The batch a run prints for, evaluated with the materials it was made of, or null for a run of a
 * formula version. Production prints for batches only (403 without one); a batch prints once
 * released (409 while a draft), from the version it was made of, with its batch code as the lot
 * code and its expiry; a request naming another formula, version, lot code or expiry is refused
 * on that field.
 */
async function batchFor(
  db: Database,
  actor: AuthUser,
  request: LabelRunCreateParsed,
  now: Date,
): Promise<EvaluatedBatch | null> {
  if (!request.batchId) {
    if (actor.role === 'production')
      throw new AppError(
        403,
        'forbidden',
        'Production prints labels from a batch. Open the batch and print from there, or ask the owner or a formulator to print labels for a formula version.',
      );
    return null;
  }
  const evaluated = await evaluateBatch(db, actor.workshopId, request.batchId, now);
  const { batch, formula } = evaluated;
  if (batch.state !== 'released')
    throw conflict(
      `Batch ${batch.batchCode} is still a draft: its labels print once it is released.`,
    );
  const madeFrom = `Batch ${batch.batchCode} was made from ${formula.name} version ${batch.versionNumber}`;
  if (request.formulaId !== batch.formulaId) throw fieldError('formulaId', madeFrom);
  if (request.version !== batch.versionNumber) throw fieldError('version', madeFrom);
  if (request.lotCode !== undefined && request.lotCode !== batch.batchCode)
    throw fieldError('lotCode', `A batch's labels carry its batch code, ${batch.batchCode}`);
  if (request.expiresOn !== undefined && request.expiresOn !== batch.expiresOn)
    throw fieldError(
      'expiresOn',
      batch.expiresOn
        ? `A batch's labels carry its expiry, ${batch.expiresOn}`
        : `Batch ${batch.batchCode} has no expiry date: leave it out`,
    );
  return evaluated;
}

const identityMissing = (market: MissingLabelElementRecord['market']) => ({
  market,
  field: 'identity',
  item: 'The product identity: product name, product code and shelf life or period after opening',
  source: 'Product identity of the formula',
});

/** The same evaluation as release: the engine on the version's lines with today's materials. */
async function versionEvaluation(
  db: Database,
  actor: AuthUser,
  formula: { name: string; productType: ProductType },
  version: formulasRepo.VersionRow,
  now: Date,
) {
  const lines = (await formulasRepo.findLines(db, actor.workshopId, version.id)).map((l) => ({
    materialId: l.materialId,
    grams: l.grams,
  }));
  const evaluated = await evaluateLines(db, actor.workshopId, formula, lines, version.profile, now);
  if (!evaluated.evaluation)
    throw conflict(
      `Version ${version.number} cannot be checked: ${evaluated.evaluationProblems.join('; ')}`,
    );
  return evaluated.evaluation;
}

/**
 * Records a print run of a released version (or of a released batch, whose labels follow what it
 * was made of: see `evaluateBatch`) and answers it with status `rendering`; the caller
 * starts the PDF once the run is committed. Refusals: 409 for a version that is not released,
 * 409 `label_incomplete` listing what each market's label lacks (the owner may print anyway with
 * a recorded reason; a formulator's override is 403), 422 `label_does_not_fit`.
 */
export async function createRun(
  db: Database,
  actor: AuthUser,
  request: LabelRunCreateParsed,
  appUrl: string,
  now = new Date(),
): Promise<LabelRunRecord> {
  const forBatch = await batchFor(db, actor, request, now);
  const formula =
    forBatch?.formula ?? (await formulasRepo.findFormula(db, actor.workshopId, request.formulaId));
  if (!formula) throw notFound('That formula');
  const n = request.version;
  const version =
    forBatch?.version ?? (await formulasRepo.findVersion(db, actor.workshopId, formula.id, n));
  if (!version) throw notFound(`Version ${n} of that formula`);
  // A batch prints from the version it was made of, even once a newer one is released.
  if (!forBatch && version.state !== 'released')
    throw conflict(
      `Version ${n} is ${version.state === 'draft' ? 'a draft' : 'superseded'}: labels print from the released version only.`,
    );
  const unchecked = request.markets.filter((m) => !version.profile.markets.includes(m));
  if (unchecked.length > 0)
    throw fieldError(
      'markets',
      `Version ${n} was checked for ${version.profile.markets.join(', ')} only, not ${unchecked.join(', ')}`,
    );
  const stock = await chosenStock(db, actor.workshopId, request.stockId);
  const perPage = labelPositions(stock).length;
  if (request.startPosition > perPage)
    throw fieldError(
      'startPosition',
      `${stock.name} has ${perPage} label${perPage === 1 ? '' : 's'} per page: start at 1 to ${perPage}`,
    );

  const evaluation =
    forBatch?.evaluation ?? (await versionEvaluation(db, actor, formula, version, now));
  const lotCode = forBatch ? forBatch.batch.batchCode : (request.lotCode ?? null);
  const expiresOn = forBatch ? forBatch.batch.expiresOn : (request.expiresOn ?? null);

  const identityRow = await findProductIdentity(db, actor.workshopId, formula.id);
  const workshop = (await findLabelDetails(db, actor.workshopId))!;
  const areas = labelAreas(stock, request.layout);
  const inputs: LabelContentInput[] | null = identityRow
    ? request.markets.map((market) => ({
        market,
        evaluation,
        identity: identityRow.identity,
        workshop,
        netQuantity: version.profile.netQuantity ?? null,
        lotCode,
        expiresOn,
        // A batch's shelf life counts from the day it was made.
        madeOn: forBatch?.batch.madeOn ?? todayIso(now),
        areas,
      }))
    : null;
  const missing = inputs
    ? inputs.flatMap(missingLabelElements)
    : request.markets.map(identityMissing);
  const overriding = missing.length > 0 && request.overrideReason !== undefined;
  if (missing.length > 0 && (!inputs || !overriding))
    throw new AppError(
      409,
      'label_incomplete',
      inputs
        ? `The labels lack ${missing.length} required element(s). Fill them in, or the owner may print anyway with a reason.`
        : 'Enter the product identity of this formula before printing its labels.',
      undefined,
      undefined,
      { missing },
    );
  if (overriding && actor.role !== 'owner')
    throw new AppError(
      403,
      'forbidden',
      'Only the owner may print labels with required elements missing.',
    );

  const contents = inputs!.map(buildLabelContent);
  const token = randomBytes(32).toString('base64url');
  const sheet: LabelSheetRequest = {
    stock,
    startPosition: request.startPosition,
    layout: request.layout,
    placement: request.placement,
    barcode: request.barcode,
    contents,
    copies: request.copies,
    publicUrl: `${appUrl}${publicPagePath(token)}`,
  };
  const fitProblems = checkLabelFit(sheet);
  if (fitProblems.length > 0)
    throw new AppError(
      422,
      'label_does_not_fit',
      `${fitProblems.length} field(s) do not fit at their legal minimum letter height. Choose a larger stock, another layout, or move fields.`,
      undefined,
      undefined,
      { fitProblems },
    );
  const { labelCount, pageCount } = countLabels(sheet);
  if (labelCount > MAX_LABELS_PER_RUN)
    throw fieldError(
      'copies',
      `That is ${labelCount} labels; one run prints at most ${MAX_LABELS_PER_RUN}`,
    );

  const overrideReason = overriding ? request.overrideReason! : null;
  // The run and its audit entry commit together, read back in the same transaction.
  return db.transaction(async (tx) => {
    const id = await repo.insertRun(tx, {
      workshopId: actor.workshopId,
      formulaId: formula.id,
      versionId: version.id,
      versionNumber: n,
      formulaName: formula.name,
      markets: request.markets,
      stockId: request.stockId,
      stock,
      layout: request.layout,
      barcode: request.barcode,
      placement: request.placement,
      startPosition: request.startPosition,
      copies: request.copies,
      labelCount,
      pageCount,
      lotCode,
      expiresOn,
      batchId: forBatch?.batch.id ?? null,
      contents,
      progressTotal: labelCount,
      overrideReason,
      overriddenMissing: overriding ? missing : [],
      publicToken: token,
      createdBy: actor.id,
      createdByName: actor.name,
    });
    await recordAudit(tx, actor, {
      action: overriding ? 'label-run.printed-with-override' : 'label-run.printed',
      subjectType: 'label_run',
      subjectId: id,
      detail: {
        formulaId: formula.id,
        version: n,
        markets: request.markets,
        stockId: request.stockId,
        labelCount,
        lotCode,
        batchId: forBatch?.batch.id ?? null,
        overrideReason,
        missing: overriding ? missing : [],
      },
    });
    return getRun(tx, actor, id);
  });
}

/** Withdraws a run's public ingredients page (owner); a second call changes nothing. */
export async function withdrawRun(db: Database, actor: AuthUser, id: string) {
  return db.transaction(async (tx) => {
    const run = await repo.findRunRecord(tx, actor.workshopId, id);
    if (!run) throw notFound(RUN);
    if (await repo.withdrawRun(tx, actor.workshopId, id))
      await recordAudit(tx, actor, {
        action: 'label-run.public-page-withdrawn',
        subjectType: 'label_run',
        subjectId: id,
        detail: { formulaId: run.formulaId, version: run.versionNumber },
      });
    return getRun(tx, actor, id);
  });
}

/** A ready run's PDF; 409 while it is being made or after it failed. */
export async function getRunPdf(db: Database, actor: AuthUser, run: LabelRunRecord) {
  if (run.status === 'rendering')
    throw conflict(
      `The PDF is still being made (${run.progress.done} of ${run.progress.total} labels). Try again in a moment.`,
    );
  const pdf = run.status === 'ready' ? await repo.findPdf(db, actor.workshopId, run.id) : undefined;
  if (!pdf) throw conflict('The PDF of this run could not be made. Print the labels again.');
  return pdf;
}
