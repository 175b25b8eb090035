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
} from '@batchproof/shared';
import { recordAudit } from '../audit/audit-log';
import type { AuthUser } from '../auth/authenticate';
import { AppError, conflict, notFound } from '../core/app-error';
import { isRecordId } from '../core/record-id';
import type { Database } from '../db/database';
import { evaluateLines } from '../formulas/formula-evaluation';
import * as formulasRepo from '../formulas/formulas-repository';
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

export async function getRun(db: Database, actor: AuthUser, id: string) {
  const row = await repo.findRunRecord(db, actor.workshopId, id);
  if (!row) throw notFound(RUN);
  return runRecord(row);
}

export async function listRuns(db: Database, actor: AuthUser, q: LabelRunListQuery) {
  if (q.formulaId && !(await formulasRepo.findFormula(db, actor.workshopId, q.formulaId)))
    throw notFound('That formula');
  const rows = await repo.listRunRecords(db, actor.workshopId, q.formulaId, LABEL_RUN_LIST_MAX);
  return { items: rows.map(runRecord) };
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

/** Who may print what: production prints for batches only; batches do not exist yet. */
function checkBatch(actor: AuthUser, request: LabelRunCreateParsed) {
  if (request.batchId) throw notFound('That batch');
  if (actor.role === 'production')
    throw new AppError(
      403,
      'forbidden',
      'Production prints labels from a batch. Ask the owner or a formulator to print labels for a formula version.',
    );
}

const identityMissing = (market: MissingLabelElementRecord['market']) => ({
  market,
  field: 'identity',
  item: 'The product identity: product name, product code and shelf life or period after opening',
  source: 'Product identity of the formula',
});

/**
 * Records a print run of a released version and answers it with status `rendering`; the caller
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
  checkBatch(actor, request);
  const formula = await formulasRepo.findFormula(db, actor.workshopId, request.formulaId);
  if (!formula) throw notFound('That formula');
  const n = request.version;
  const version = await formulasRepo.findVersion(db, actor.workshopId, formula.id, n);
  if (!version) throw notFound(`Version ${n} of that formula`);
  if (version.state !== 'released')
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

  // The same evaluation as release: the engine on the version's lines with today's materials.
  const lines = (await formulasRepo.findLines(db, actor.workshopId, version.id)).map((l) => ({
    materialId: l.materialId,
    grams: l.grams,
  }));
  const evaluated = await evaluateLines(db, actor.workshopId, formula, lines, version.profile, now);
  if (!evaluated.evaluation)
    throw conflict(`Version ${n} cannot be checked: ${evaluated.evaluationProblems.join('; ')}`);
  const evaluation = evaluated.evaluation;

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
        lotCode: request.lotCode ?? null,
        expiresOn: request.expiresOn ?? null,
        madeOn: todayIso(now),
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
      lotCode: request.lotCode ?? null,
      expiresOn: request.expiresOn ?? null,
      batchId: null,
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
        lotCode: request.lotCode ?? null,
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
