import {
  batchReadyOn,
  effectiveRecord,
  recordFieldValue,
  recordLine,
  roundTo,
  usedMaterialProblem,
  type AppliedAmendment,
  type Batch,
  type BatchAmendmentFields,
  type BatchRecordFields,
} from '@batchproof/shared';
import { recordAudit } from '../audit/audit-log';
import type { AuthUser } from '../auth/authenticate';
import { AppError, conflict, notFound } from '../core/app-error';
import type { Database } from '../db/database';
import type { lotConsumptions } from '../db/schema';
import { lotAmount } from '../lots/stock-adjustments';
import * as amendmentsRepo from './batch-amendments-repository';
import { pickQuantity, usedMaterialOf, type BatchRow } from './batch-view';
import { getBatch } from './batches-domain';
import * as repo from './batches-repository';

/**
 * Amendments: a released batch never changes; a correction names the field, its new value and the
 * reason, and is kept beside the released record with the value it replaced. A corrected lot pick
 * (or weight or material that changes the picks) moves stock in the same transaction, under the
 * same lot locks as a release; a corrected unit count or timing updates the batch's effective
 * columns (`units_made`, `ready_on`), the only ones the database lets change after release.
 */

/** Half a hundredth of a gram: the finest scale step (common practice, no published source). */
const GRAMS_SLACK = 0.005;
const LINE_FIELD = /^lines\.(\d+)\.(usedMaterialId|lotPicks|actualGrams)$/;

type SheetLine = BatchRow['sheet']['lines'][number];
type Pick = { lotId: string; grams: number };

const invalid = (fieldErrors: Record<string, string[]>) =>
  new AppError(400, 'validation_failed', 'Some fields need attention.', fieldErrors);
const sameValue = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b);
const sumGrams = (picks: readonly Pick[]) =>
  roundTo(
    picks.reduce((s, p) => s + p.grams, 0),
    6,
  );

/** What an amendment of one field changes: its own row, the follow-on rows, and stock. */
interface Plan {
  amendments: AppliedAmendment[];
  /** The line whose lots are corrected, with its new picks and the material they are of. */
  picks?: { line: SheetLine; picks: Pick[]; materialId: string };
}

/**
 * The material the lots of a line are of: all lots of this workshop, of one material, the line's
 * own or an approved substitute, countable in grams. Refuses with 400 on `value` otherwise.
 */
async function pickedMaterial(
  tx: Database,
  workshopId: string,
  line: SheetLine,
  picks: readonly Pick[],
  fallback: string,
) {
  const lots = await repo.findLots(
    tx,
    workshopId,
    picks.map((p) => p.lotId),
  );
  const problems: string[] = [];
  const materials = new Set<string>();
  const allowed = new Map([
    [line.materialId, line.materialName],
    ...line.substitutes.map((s) => [s.materialId, s.materialName] as const),
  ]);
  for (const pick of picks) {
    const lot = lots.get(pick.lotId);
    if (!lot) problems.push('Choose lots recorded in this workshop');
    else if (!allowed.has(lot.materialId))
      problems.push(
        `Lot ${lot.supplierLotNumber} is not a lot of ${[...allowed.values()].join(' or ')}`,
      );
    else materials.add(lot.materialId);
  }
  if (materials.size > 1)
    problems.push('The lots of one line are of one material: its own or one approved substitute');
  if (problems.length > 0) throw invalid({ value: [...new Set(problems)] });
  const materialId = [...materials][0] ?? fallback;
  const density = (await repo.gramsPerMillilitreOf(tx, workshopId, [materialId])).get(materialId);
  for (const pick of picks) {
    const lot = lots.get(pick.lotId)!;
    if (pickQuantity(pick.grams, lot.unit, density ?? null) === null)
      problems.push(
        `Lot ${lot.supplierLotNumber} is counted in ${lot.unit} and cannot be weighed out in grams`,
      );
  }
  if (problems.length > 0) throw invalid({ value: problems });
  return { materialId, lots, density: density ?? null };
}

/** Plans an amendment of a line field, with the follow-on amendments that keep the line whole. */
async function planLine(
  tx: Database,
  actor: AuthUser,
  row: BatchRow,
  effective: BatchRecordFields,
  input: BatchAmendmentFields,
): Promise<Plan> {
  const [, number, key] = LINE_FIELD.exec(input.field)!;
  const lineNumber = Number(number);
  const line = row.sheet.lines.find((l) => l.lineNumber === lineNumber);
  if (!line) throw invalid({ field: [`Batch ${row.batchCode} has no line ${lineNumber}`] });
  const current = recordLine(effective, lineNumber);
  const main = { field: input.field, value: input.value };
  const usedNow = usedMaterialOf(line, current.usedMaterialId);

  if (key === 'usedMaterialId') {
    const materialId = input.value as string | null;
    const problem = usedMaterialProblem(line, materialId);
    if (problem) throw invalid({ value: [problem] });
    const used = usedMaterialOf(line, materialId);
    const lots = await repo.findLots(
      tx,
      actor.workshopId,
      current.lotPicks.map((p) => p.lotId),
    );
    if ([...lots.values()].some((lot) => lot.materialId !== used.id))
      throw invalid({
        value: [
          `Line ${lineNumber} was weighed from lots of ${usedNow.name}: correct its lots (lines.${lineNumber}.lotPicks) to lots of ${used.name}, and the material follows`,
        ],
      });
    return { amendments: [main] };
  }

  if (key === 'actualGrams') {
    const grams = input.value as number | null;
    if (grams === null)
      throw invalid({ value: [`A released line keeps its weight: enter the corrected weight`] });
    const picks = current.lotPicks;
    if (picks.length === 0) return { amendments: [main] };
    if (picks.length > 1) {
      if (Math.abs(sumGrams(picks) - grams) <= GRAMS_SLACK) return { amendments: [main] };
      throw invalid({
        value: [
          `Line ${lineNumber} was weighed from ${picks.length} lots: correct its lots (lines.${lineNumber}.lotPicks) and the weight follows`,
        ],
      });
    }
    // One lot: the pick follows the corrected weight.
    const newPicks = grams > 0 ? [{ lotId: picks[0]!.lotId, grams }] : [];
    return {
      amendments: [main, { field: `lines.${lineNumber}.lotPicks`, value: newPicks }],
      picks: { line, picks: newPicks, materialId: usedNow.id },
    };
  }

  // lotPicks: the material used and the weight follow the lots.
  const picks = input.value as Pick[];
  const { materialId } = await pickedMaterial(tx, actor.workshopId, line, picks, usedNow.id);
  const amendments: AppliedAmendment[] = [main];
  if (materialId !== usedNow.id)
    amendments.push({
      field: `lines.${lineNumber}.usedMaterialId`,
      value: materialId === line.materialId ? null : materialId,
    });
  const total = sumGrams(picks);
  if (current.actualGrams === null || Math.abs(total - current.actualGrams) > GRAMS_SLACK)
    amendments.push({ field: `lines.${lineNumber}.actualGrams`, value: total });
  return { amendments, picks: { line, picks, materialId } };
}

/**
 * Moves the stock of a line whose lots were corrected: every lot it took from so far (net of
 * earlier amendments) is given back and the new picks are taken, as `amendment` movements. The
 * lots are locked first (in id order, like a release); a lot that would go below zero refuses the
 * whole amendment with 409 `stock_short`.
 */
async function moveLineStock(
  tx: Database,
  actor: AuthUser,
  row: BatchRow,
  { line, picks, materialId }: NonNullable<Plan['picks']>,
) {
  const { workshopId } = actor;
  const taken = await amendmentsRepo.lineConsumption(tx, workshopId, row.id, line.lineNumber);
  const lotIds = [...taken.map((t) => t.lotId), ...picks.map((p) => p.lotId)];
  const locked = await repo.lockLots(tx, workshopId, lotIds);
  const density =
    (await repo.gramsPerMillilitreOf(tx, workshopId, [materialId])).get(materialId) ?? null;
  const base = {
    workshopId,
    kind: 'amendment' as const,
    batchId: row.id,
    lineNumber: line.lineNumber,
    createdBy: actor.id,
  };
  const rows: (typeof lotConsumptions.$inferInsert)[] = taken.map((t) => ({
    ...base,
    lotId: t.lotId,
    quantity: -t.quantity,
    grams: -t.grams,
  }));
  const net = new Map(taken.map((t) => [t.lotId, -t.quantity]));
  for (const pick of picks) {
    const lot = locked.get(pick.lotId);
    const quantity = lot ? pickQuantity(pick.grams, lot.unit, density) : null;
    if (!lot || quantity === null)
      throw invalid({ value: ['A lot picked cannot be weighed out in grams: choose another'] });
    rows.push({ ...base, lotId: pick.lotId, quantity, grams: pick.grams });
    net.set(pick.lotId, roundTo((net.get(pick.lotId) ?? 0) + quantity, 4));
  }
  const stock = await repo.stockOnHandOf(tx, workshopId, lotIds);
  const short: string[] = [];
  for (const [lotId, change] of net) {
    const onHand = stock.get(lotId) ?? 0;
    const lot = locked.get(lotId);
    if (lot && change > 0 && roundTo(onHand - change, 4) < 0)
      short.push(
        `Lot ${lot.supplierLotNumber} has only ${lotAmount(Math.max(0, onHand), lot.unit)} on hand; this correction takes ${lotAmount(change, lot.unit)} more`,
      );
  }
  if (short.length > 0)
    throw new AppError(
      409,
      'stock_short',
      `The corrected lots of batch ${row.batchCode} need more stock than is on hand: choose other lots or record goods-in first.`,
      { value: short },
    );
  await repo.insertConsumptions(
    tx,
    rows.filter((r) => r.quantity !== 0 || r.grams !== 0),
  );
  return [...net]
    .filter(([, change]) => change !== 0)
    .map(([lotId, quantity]) => ({ lotId, quantity }));
}

/** A finished lot's count cannot drop below the units already delivered from it (409). */
async function checkDelivered(tx: Database, actor: AuthUser, row: BatchRow, value: unknown) {
  const delivered = await amendmentsRepo.unitsDelivered(tx, actor.workshopId, row.id);
  if (delivered > 0 && (value === null || (value as number) < delivered))
    throw conflict(
      `${delivered} units of batch ${row.batchCode} are already on deliveries: the units made cannot be fewer.`,
      { value: [`At least ${delivered}: the units already delivered`] },
    );
}

/**
 * Corrects one field of a released batch (owner or formulator) with a reason. The released record
 * stays as it was; the amendment keeps the value it replaces (the released one, or an earlier
 * amendment's). A draft answers 409: its record is still edited directly.
 */
export async function amendBatch(
  db: Database,
  actor: AuthUser,
  id: string,
  input: BatchAmendmentFields,
): Promise<Batch> {
  const { workshopId } = actor;
  return db.transaction(async (tx) => {
    const row = await repo.findBatchRow(tx, workshopId, id, true);
    if (!row) throw notFound('That batch');
    if (row.state !== 'released')
      throw conflict(
        `Batch ${row.batchCode} is a draft: change its record directly. Amendments are for released batches.`,
      );
    const { amendments: earlier } = await getBatch(tx, actor, id);
    const effective = effectiveRecord(row.record, earlier);
    if (sameValue(recordFieldValue(effective, input.field), input.value))
      throw invalid({ value: ['That is the value the batch already has: nothing to correct'] });

    if (input.field === 'mould.unitsMade') await checkDelivered(tx, actor, row, input.value);
    const plan: Plan = LINE_FIELD.test(input.field)
      ? await planLine(tx, actor, row, effective, input)
      : { amendments: [{ field: input.field, value: input.value }] };
    const moved = plan.picks ? await moveLineStock(tx, actor, row, plan.picks) : [];

    await amendmentsRepo.insertAmendments(
      tx,
      plan.amendments.map((a) => ({
        workshopId,
        batchId: id,
        field: a.field,
        previousValue: recordFieldValue(effective, a.field),
        value: a.value,
        reason: input.reason,
        amendedBy: actor.id,
      })),
    );
    const after = effectiveRecord(effective, plan.amendments);
    const fields = plan.amendments.map((a) => a.field);
    if (fields.includes('mould.unitsMade'))
      await repo.updateBatch(tx, workshopId, id, { unitsMade: after.mould.unitsMade });
    if (fields.some((f) => f.startsWith('timing.')))
      await repo.updateBatch(tx, workshopId, id, {
        readyOn: batchReadyOn(row.madeOn, after.timing.hoursInMould, after.timing.curingDays),
      });
    await recordAudit(tx, actor, {
      action: 'batch.amended',
      subjectType: 'batch',
      subjectId: id,
      detail: {
        batchCode: row.batchCode,
        reason: input.reason,
        changes: plan.amendments.map((a) => ({
          field: a.field,
          previousValue: recordFieldValue(effective, a.field),
          value: a.value,
        })),
        stockMoved: moved,
      },
    });
    return getBatch(tx, actor, id);
  });
}
