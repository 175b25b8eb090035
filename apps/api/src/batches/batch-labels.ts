import { and, asc, eq, like } from 'drizzle-orm';
import type { EvaluationResult } from '@batchproof/shared';
import { conflict, notFound } from '../core/app-error';
import type { Database } from '../db/database';
import { batchAmendments, batches } from '../db/schema';
import { evaluateLines } from '../formulas/formula-evaluation';
import * as formulasRepo from '../formulas/formulas-repository';

/** A batch row as stored. */
export type BatchRow = typeof batches.$inferSelect;

/** One line of a batch as its labels read it: the formula's material and the one used. */
export interface BatchLabelLine {
  lineNumber: number;
  materialId: string;
  materialName: string;
  /** The material the line was made with: the line's own or an approved substitute. */
  usedMaterialId: string;
}

/** A batch with the evaluation of what it was actually made of. */
export interface EvaluatedBatch {
  batch: BatchRow;
  formula: NonNullable<Awaited<ReturnType<typeof formulasRepo.findFormula>>>;
  version: formulasRepo.VersionRow;
  lines: BatchLabelLine[];
  evaluation: EvaluationResult;
}

const LINE_MATERIAL = /^lines\.(\d+)\.usedMaterialId$/;

/**
 * The material each line was made with, by line number: the record's `usedMaterialId`, then any
 * amendment of it in the order they were made (a released batch's record never changes; a
 * correction is an amendment, and the label follows the corrected value).
 */
async function usedMaterials(db: Database, batch: BatchRow) {
  const used = new Map<number, string | null>();
  for (const line of batch.record.lines) used.set(line.lineNumber, line.usedMaterialId);
  const amendments = await db
    .select({ field: batchAmendments.field, value: batchAmendments.value })
    .from(batchAmendments)
    .where(
      and(
        eq(batchAmendments.workshopId, batch.workshopId),
        eq(batchAmendments.batchId, batch.id),
        like(batchAmendments.field, 'lines.%.usedMaterialId'),
      ),
    )
    .orderBy(asc(batchAmendments.createdAt), asc(batchAmendments.id));
  for (const a of amendments) {
    const match = LINE_MATERIAL.exec(a.field);
    if (match) used.set(Number(match[1]), typeof a.value === 'string' ? a.value : null);
  }
  return used;
}

/**
 * The evaluation of the batch's formula version with each line's material replaced by the one
 * actually used (`record.lines[].usedMaterialId`, null = the line's own), through the same
 * `evaluateLines` as a save or release, so its declaration names what went into the batch.
 * 404 for another workshop's batch; 409 when the version cannot be evaluated.
 */
export async function evaluateBatch(
  db: Database,
  workshopId: string,
  batchId: string,
  now = new Date(),
): Promise<EvaluatedBatch> {
  const [batch] = await db
    .select()
    .from(batches)
    .where(and(eq(batches.workshopId, workshopId), eq(batches.id, batchId)));
  if (!batch) throw notFound('That batch');
  const formula = (await formulasRepo.findFormula(db, workshopId, batch.formulaId))!;
  const version = (await formulasRepo.findVersion(
    db,
    workshopId,
    batch.formulaId,
    batch.versionNumber,
  ))!;
  const used = await usedMaterials(db, batch);
  const lines = (await formulasRepo.findLines(db, workshopId, version.id)).map((l, i) => ({
    lineNumber: i + 1,
    materialId: l.materialId,
    materialName: l.materialName,
    usedMaterialId: used.get(i + 1) ?? l.materialId,
    grams: l.grams,
  }));
  const evaluated = await evaluateLines(
    db,
    workshopId,
    formula,
    lines.map((l) => ({ materialId: l.usedMaterialId, grams: l.grams })),
    version.profile,
    now,
  );
  if (!evaluated.evaluation)
    throw conflict(
      `Batch ${batch.batchCode} cannot be checked: ${evaluated.evaluationProblems.join('; ')}`,
    );
  return {
    batch,
    formula,
    version,
    lines: lines.map(({ grams: _grams, ...l }) => l),
    evaluation: evaluated.evaluation,
  };
}
