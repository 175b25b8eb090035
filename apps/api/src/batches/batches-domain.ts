import {
  batchCodeProblem,
  batchDurability,
  batchReadyOn,
  batchRecordInputSchema,
  checkWeighing,
  formatBatchCode,
  roundTo,
  suggestLotPicks,
  usedMaterialProblem,
  weighSheet,
  type Batch,
  type BatchCreateFields,
  type BatchListQuery,
  type BatchPage,
  type BatchRecordFields,
  type BatchSizing,
} from '@batchproof/shared';
import { recordAudit } from '../audit/audit-log';
import type { AuthUser } from '../auth/authenticate';
import { AppError, conflict, notFound } from '../core/app-error';
import { databaseFailure } from '../core/database-errors';
import type { Database } from '../db/database';
import type { BatchSheet } from '../db/schema';
import * as formulasRepo from '../formulas/formulas-repository';
import { findProductIdentity } from '../labels/product-identity-repository';
import { pickQuantity, usedMaterialOf, type BatchRow } from './batch-view';
import { lotAmount } from '../lots/stock-adjustments';
import * as repo from './batches-repository';

const BATCH = 'That batch';

/** The UTC day, YYYY-MM-DD. */
const today = () => new Date().toISOString().slice(0, 10);

const invalid = (fieldErrors: Record<string, string[]>) =>
  new AppError(400, 'validation_failed', 'Some fields need attention.', fieldErrors);

const released = (row: BatchRow) =>
  new AppError(
    409,
    'record_released',
    `Batch ${row.batchCode} is released and cannot be changed: make an amendment with the reason instead.`,
  );

/** A page of the caller's workshop's batches. */
export async function listBatches(
  db: Database,
  actor: AuthUser,
  query: BatchListQuery,
): Promise<BatchPage> {
  const { items, total } = await repo.pageBatches(db, actor.workshopId, query);
  return {
    items: items.map(({ row, formulaName }) => {
      const recorded = new Map(row.record.lines.map((l) => [l.lineNumber, l.actualGrams]));
      const checks = checkWeighing(
        row.sheet.lines.map((l) => ({
          name: l.materialName,
          targetGrams: l.grams,
          actualGrams: recorded.get(l.lineNumber) ?? null,
        })),
        row.tolerancePercent,
      );
      return {
        id: row.id,
        formulaId: row.formulaId,
        formulaName,
        version: row.versionNumber,
        batchCode: row.batchCode,
        state: row.state,
        madeOn: row.madeOn,
        releasedAt: row.releasedAt?.toISOString() ?? null,
        updatedAt: row.updatedAt.toISOString(),
        durability: {
          bestBeforeMonth: row.bestBeforeMonth,
          expiresOn: row.expiresOn,
          periodAfterOpeningMonths: row.periodAfterOpeningMonths,
        },
        readyOn: row.readyOn,
        unitsMade: row.unitsMade,
        outOfTolerance: checks.filter((c) => c.status === 'out').length,
      };
    }),
    total,
    page: query.page,
    pageSize: query.pageSize,
  };
}

/** One batch of the caller's workshop; 404 for any other. */
export async function getBatch(db: Database, actor: AuthUser, id: string): Promise<Batch> {
  const batch = await repo.loadBatch(db, actor.workshopId, id);
  if (!batch) throw notFound(BATCH);
  return batch;
}

/** The released version the batch is made from: 404 for an unknown formula, 409 otherwise. */
async function releasedVersion(db: Database, actor: AuthUser, input: BatchCreateFields) {
  const formula = await formulasRepo.findFormula(db, actor.workshopId, input.formulaId);
  if (!formula) throw notFound('That formula');
  const n = input.version;
  const version = await formulasRepo.findVersion(db, actor.workshopId, formula.id, n);
  if (version?.state === 'released') return { formula, version };
  const current = await formulasRepo.findVersionInState(
    db,
    actor.workshopId,
    formula.id,
    'released',
  );
  const which = version
    ? `Version ${n} of ${formula.name} is ${version.state === 'draft' ? 'a draft' : 'superseded'}`
    : `${formula.name} has no version ${n}`;
  throw conflict(
    `${which}: batches are made from the released version only${current ? ` (version ${current.number})` : ', and none is released yet'}.`,
  );
}

function sizingOf(
  input: BatchCreateFields,
  profileUnitMass: number | null | undefined,
): BatchSizing {
  const lossPercent = input.lossPercent;
  if (input.totalGrams !== undefined) return { totalGrams: input.totalGrams, lossPercent };
  const unitMassGrams = input.unitMass ?? profileUnitMass;
  if (!unitMassGrams)
    throw invalid({
      unitMass: ["Enter the unit mass, or set it on the version's product profile"],
    });
  return { units: input.units!, unitMassGrams, lossPercent };
}

/** The empty record a new batch starts with. */
const emptyRecord = (): BatchRecordFields => batchRecordInputSchema.parse({});

/** Most attempts at a free batch code before giving up (each a lost race or a taken code). */
const CODE_ATTEMPTS = 20;

/**
 * Starts a batch from the formula's released version: the weigh sheet for its size, the
 * first-expiring lots with stock suggested per line, the workshop's tolerance and the next
 * batch code of the day, and the durability from the product identity.
 */
export async function createBatch(
  db: Database,
  actor: AuthUser,
  input: BatchCreateFields,
): Promise<Batch> {
  const { workshopId } = actor;
  return db.transaction(async (tx) => {
    const { formula, version } = await releasedVersion(tx, actor, input);
    const madeOn = input.madeOn ?? today();
    const sources = await repo.sheetSources(tx, workshopId, version.id);
    let sheet;
    try {
      sheet = weighSheet(sources, sizingOf(input, version.profile.unitMassGrams));
    } catch (err) {
      if (err instanceof RangeError)
        throw conflict(
          `Version ${version.number} of ${formula.name} cannot be weighed out: ${err.message}.`,
        );
      throw err;
    }
    const lots = await repo.lotsInStock(
      tx,
      workshopId,
      sources.map((l) => l.materialId),
    );
    const suggested = suggestLotPicks(
      sheet.lines.map((l) => ({
        materialId: l.materialId,
        grams: l.weighGrams,
        gramsPerMillilitre: l.gramsPerMillilitre,
      })),
      lots,
      madeOn,
    );
    const storedSheet: BatchSheet = {
      lines: sheet.lines.map(({ gramsPerMillilitre: _g, ...line }, i) => ({
        ...line,
        lineNumber: i + 1,
        suggestedPicks: suggested[i]!,
      })),
      sum: sheet.sum,
      notes: sheet.notes,
    };
    const settings = await repo.workshopBatchSettings(tx, workshopId);
    const identity = (await findProductIdentity(tx, workshopId, formula.id))?.identity;
    const durability = identity
      ? batchDurability(madeOn, identity)
      : { bestBeforeMonth: null, expiresOn: null, periodAfterOpeningMonths: null };
    const productCode = identity?.productCode ?? '';
    const values = {
      workshopId,
      formulaId: formula.id,
      versionId: version.id,
      versionNumber: version.number,
      madeOn,
      units: sheet.size.units,
      unitMassGrams: sheet.size.unitMassGrams,
      targetGrams: sheet.size.targetGrams,
      lossPercent: sheet.size.lossPercent,
      batchGrams: sheet.size.batchGrams,
      tolerancePercent: settings.tolerancePercent,
      sheet: storedSheet,
      record: emptyRecord(),
      ...durability,
      createdBy: actor.id,
    };
    const id = await insertWithNextCode(tx, settings.batchCodePattern, productCode, values);
    await recordAudit(tx, actor, {
      action: 'batch.created',
      subjectType: 'batch',
      subjectId: id,
      detail: {
        formulaId: formula.id,
        version: version.number,
        madeOn,
        batchGrams: sheet.size.batchGrams,
      },
    });
    return (await repo.loadBatch(tx, workshopId, id))!;
  });
}

/**
 * Inserts the batch with the day's next sequence (1 + the highest of the workshop's batches made
 * that day). Two batches started at once may take the same code: the unique index refuses the
 * second, which tries again (in a savepoint, so the transaction survives) with the next number.
 */
async function insertWithNextCode(
  tx: Database,
  pattern: string,
  productCode: string,
  values: Omit<Parameters<typeof repo.insertBatch>[1], 'batchCode' | 'sequence'>,
) {
  let sequence = 0;
  for (let attempt = 0; attempt < CODE_ATTEMPTS; attempt++) {
    sequence = Math.max(
      sequence + 1,
      (await repo.highestSequence(tx, values.workshopId, values.madeOn)) + 1,
    );
    const input = { day: values.madeOn, productCode, sequence };
    const problem = batchCodeProblem(pattern, input);
    if (problem)
      throw conflict(
        productCode === '' && problem === 'The product has no product code'
          ? 'The product has no product code for the batch code: fill in the product identity of this formula first.'
          : `The batch code cannot be made: ${problem}.`,
      );
    const batchCode = formatBatchCode(pattern, input);
    try {
      return await tx.transaction((sp) => repo.insertBatch(sp, { ...values, batchCode, sequence }));
    } catch (err) {
      if (databaseFailure(err)?.kind !== 'conflict') throw err;
    }
  }
  throw conflict('No free batch code was found for that day: try again.');
}

/** A draft of the caller's workshop, locked for the change; 404 or 409 `record_released`. */
async function lockedDraft(tx: Database, actor: AuthUser, id: string) {
  const row = await repo.findBatchRow(tx, actor.workshopId, id, true);
  if (!row) throw notFound(BATCH);
  if (row.state === 'released') throw released(row);
  return row;
}

/**
 * Checks each recorded line against the weigh sheet: a line of the sheet, its material its own
 * or an approved substitute, its lots lots of that material in this workshop that weigh in grams.
 */
async function recordProblems(
  tx: Database,
  actor: AuthUser,
  row: BatchRow,
  input: BatchRecordFields,
) {
  const sheetLines = new Map(row.sheet.lines.map((l) => [l.lineNumber, l]));
  const lots = await repo.findLots(
    tx,
    actor.workshopId,
    input.lines.flatMap((l) => l.lotPicks.map((p) => p.lotId)),
  );
  const densities = await repo.gramsPerMillilitreOf(
    tx,
    actor.workshopId,
    input.lines.flatMap((l) => {
      const line = sheetLines.get(l.lineNumber);
      return line ? [usedMaterialOf(line, l.usedMaterialId).id] : [];
    }),
  );
  const errors: Record<string, string[]> = {};
  const add = (key: string, message: string) => (errors[key] ??= []).push(message);
  input.lines.forEach((entry, i) => {
    const line = sheetLines.get(entry.lineNumber);
    if (!line) {
      add(`lines.${i}.lineNumber`, `The weigh sheet has no line ${entry.lineNumber}`);
      return;
    }
    const problem = usedMaterialProblem(line, entry.usedMaterialId);
    if (problem) {
      add(`lines.${i}.usedMaterialId`, problem);
      return;
    }
    const used = usedMaterialOf(line, entry.usedMaterialId);
    for (const pick of entry.lotPicks) {
      const lot = lots.get(pick.lotId);
      if (!lot || lot.materialId !== used.id) {
        add(
          `lines.${i}.lotPicks`,
          lot
            ? `Lot ${lot.supplierLotNumber} is not a lot of ${used.name}: choose a lot of the material used`
            : `Choose a lot of ${used.name} recorded in this workshop`,
        );
        continue;
      }
      if (pickQuantity(pick.grams, lot.unit, densities.get(used.id) ?? null) === null)
        add(
          `lines.${i}.lotPicks`,
          `Lot ${lot.supplierLotNumber} is counted in ${lot.unit} and cannot be weighed out in grams${lot.unit === 'units' ? '' : ': enter the weight per millilitre on the material'}`,
        );
    }
  });
  return errors;
}

/** Records what production did on a draft batch; a released batch answers 409 `record_released`. */
export async function recordBatch(
  db: Database,
  actor: AuthUser,
  id: string,
  input: BatchRecordFields,
): Promise<Batch> {
  return db.transaction(async (tx) => {
    const row = await lockedDraft(tx, actor, id);
    const errors = await recordProblems(tx, actor, row, input);
    if (Object.keys(errors).length > 0) throw invalid(errors);
    await repo.updateBatch(tx, actor.workshopId, id, {
      record: input,
      readyOn: batchReadyOn(row.madeOn, input.timing.hoursInMould, input.timing.curingDays),
      unitsMade: input.mould.unitsMade,
    });
    await recordAudit(tx, actor, {
      action: 'batch.recorded',
      subjectType: 'batch',
      subjectId: id,
      detail: { batchCode: row.batchCode, lines: input.lines.length },
    });
    return (await repo.loadBatch(tx, actor.workshopId, id))!;
  });
}

/** Deletes a draft batch; a released one is kept (409 `record_released`). */
export async function deleteDraftBatch(db: Database, actor: AuthUser, id: string): Promise<void> {
  await db.transaction(async (tx) => {
    const row = await lockedDraft(tx, actor, id);
    await repo.deleteBatch(tx, actor.workshopId, id);
    await recordAudit(tx, actor, {
      action: 'batch.deleted',
      subjectType: 'batch',
      subjectId: id,
      detail: { batchCode: row.batchCode, formulaId: row.formulaId, madeOn: row.madeOn },
    });
  });
}

/** Half a hundredth of a gram: the finest scale step (common practice, no published source). */
const GRAMS_SLACK = 0.005;

/** Why each line of the batch cannot be released yet, keyed `lines.<index>.<field>`. */
function notReady(batch: Batch): Record<string, string[]> {
  const errors: Record<string, string[]> = {};
  batch.lines.forEach((line, i) => {
    if (line.actualGrams === null) {
      errors[`lines.${i}.actualGrams`] = [`${line.usedMaterialName}: not weighed yet`];
      return;
    }
    const picked = roundTo(
      line.lotPicks.reduce((s, p) => s + p.grams, 0),
      6,
    );
    if (Math.abs(picked - line.actualGrams) > GRAMS_SLACK)
      errors[`lines.${i}.lotPicks`] = [
        picked === 0
          ? `${line.usedMaterialName}: choose the lots the ${line.actualGrams} g came from`
          : `${line.usedMaterialName}: the lots cover ${picked} g of the ${line.actualGrams} g weighed`,
      ];
  });
  return errors;
}

/**
 * Releases a draft (owner or formulator): in one transaction, locks the batch and every lot it
 * picks (in id order), reads their stock, refuses 409 `stock_short` if any lot would go below
 * zero, records the stock taken and marks the batch released. A concurrent release of the same
 * lot waits for the locks and then sees this one's consumption, so stock never goes negative.
 */
export async function releaseBatch(db: Database, actor: AuthUser, id: string): Promise<Batch> {
  const { workshopId } = actor;
  return db.transaction(async (tx) => {
    const row = await repo.findBatchRow(tx, workshopId, id, true);
    if (!row) throw notFound(BATCH);
    if (row.state === 'released')
      throw new AppError(409, 'record_released', `Batch ${row.batchCode} is already released.`);
    const batch = (await repo.loadBatch(tx, workshopId, id))!;
    const errors = notReady(batch);
    const lotIds = batch.lines.flatMap((l) => l.lotPicks.map((p) => p.lotId));
    const locked = await repo.lockLots(tx, workshopId, lotIds);
    batch.lines.forEach((line, i) => {
      for (const pick of line.lotPicks)
        if (!locked.has(pick.lotId) || !(pick.quantity > 0))
          (errors[`lines.${i}.lotPicks`] ??= []).push(
            locked.has(pick.lotId)
              ? `Lot ${pick.supplierLotNumber} cannot be weighed out in grams: enter the material's weight per millilitre, or choose another lot`
              : `${line.usedMaterialName}: a lot picked was removed: choose another`,
          );
    });
    if (Object.keys(errors).length > 0)
      throw new AppError(
        409,
        'batch_not_ready',
        `Batch ${row.batchCode} is not ready to release: weigh every line and choose the lots that cover each weight.`,
        errors,
      );

    const stock = await repo.stockOnHandOf(tx, workshopId, lotIds);
    const need = new Map<string, number>();
    for (const line of batch.lines)
      for (const pick of line.lotPicks)
        need.set(pick.lotId, roundTo((need.get(pick.lotId) ?? 0) + pick.quantity, 4));
    const short: Record<string, string[]> = {};
    batch.lines.forEach((line, i) => {
      for (const pick of line.lotPicks) {
        const onHand = stock.get(pick.lotId) ?? 0;
        if (roundTo(onHand - need.get(pick.lotId)!, 4) < 0)
          (short[`lines.${i}.lotPicks`] ??= []).push(
            `Lot ${pick.supplierLotNumber} has only ${lotAmount(Math.max(0, onHand), pick.unit)} on hand; this batch needs ${lotAmount(need.get(pick.lotId)!, pick.unit)}`,
          );
      }
    });
    if (Object.keys(short).length > 0)
      throw new AppError(
        409,
        'stock_short',
        `Batch ${row.batchCode} needs more stock than is on hand: choose other lots or record goods-in first.`,
        short,
      );

    await repo.insertConsumptions(
      tx,
      batch.lines.flatMap((line) =>
        line.lotPicks.map((pick) => ({
          workshopId,
          lotId: pick.lotId,
          quantity: pick.quantity,
          kind: 'batch' as const,
          batchId: id,
          lineNumber: line.lineNumber,
          grams: pick.grams,
          createdBy: actor.id,
        })),
      ),
    );
    await repo.updateBatch(tx, workshopId, id, {
      state: 'released',
      releasedAt: new Date(),
      releasedBy: actor.id,
    });
    await recordAudit(tx, actor, {
      action: 'batch.released',
      subjectType: 'batch',
      subjectId: id,
      detail: {
        batchCode: row.batchCode,
        consumed: [...need].map(([lotId, quantity]) => ({ lotId, quantity })),
      },
    });
    return (await repo.loadBatch(tx, workshopId, id))!;
  });
}
