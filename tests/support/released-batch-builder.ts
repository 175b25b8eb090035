import { batchRecordInputSchema, type BatchRecordInput } from '@batchproof/shared';
import { eq } from 'drizzle-orm';
import type { Database } from '../../apps/api/src/db/database';
import { batches, lotConsumptions, type BatchSheet } from '../../apps/api/src/db/schema';
import { buildFinishedLot, buildReleasedFormula } from './finished-lot-builder';

// A batch with weighed lines straight in the database, released with its stock taken as a
// release takes it (one `batch` movement per lot pick), for the amendment and weigh sheet specs.

export interface BuiltLine {
  materialId: string;
  materialName: string;
  /** Target and weighed grams (the batch is weighed exactly). */
  grams: number;
  /** Lots it was weighed from; every lot here is counted in kg. */
  picks: { lotId: string; grams: number }[];
  substitutes?: { materialId: string; materialName: string }[];
}

let codes = 0;

/**
 * A batch of `lines`, released (or a draft, with nothing taken) with `unitsMade` units; its
 * `kg` lots lose each pick's grams / 1000 on release.
 */
export async function buildWeighedBatch(
  db: Database,
  workshopId: string,
  options: {
    lines: BuiltLine[];
    unitsMade?: number;
    state?: 'draft' | 'released';
    record?: Omit<BatchRecordInput, 'lines'>;
    releasedBy?: string;
  },
) {
  const formula = await buildReleasedFormula(db, workshopId);
  const state = options.state ?? 'released';
  const batch = await buildFinishedLot(db, workshopId, {
    ...formula,
    batchCode: `AMD-${++codes}-${Date.now() % 100000}`,
    unitsMade: options.unitsMade ?? 24,
    state: 'draft',
  });
  const total = options.lines.reduce((s, l) => s + l.grams, 0);
  const sheet: BatchSheet = {
    lines: options.lines.map((l, i) => ({
      lineNumber: i + 1,
      materialId: l.materialId,
      materialName: l.materialName,
      percent: (l.grams / total) * 100,
      grams: l.grams,
      weighGrams: l.grams,
      stepGrams: l.grams < 10 ? 0.01 : l.grams < 1000 ? 0.1 : 1,
      substitutes: l.substitutes ?? [],
      suggestedPicks: { status: 'none', picks: [], shortGrams: 0, split: null, notes: [] },
    })),
    sum: { batchGrams: total, roundedGrams: total, differenceGrams: 0, withinRounding: true },
    notes: [],
  };
  const record = batchRecordInputSchema.parse({
    mould: { unitsMade: options.unitsMade ?? 24 },
    ...options.record,
    lines: options.lines.map((l, i) => ({
      lineNumber: i + 1,
      lotPicks: l.picks,
      actualGrams: l.grams,
    })),
  });
  // A released row takes no change but ready_on and units_made (the trigger), so the record
  // goes onto the draft first, which is then released.
  await db
    .update(batches)
    .set({ sheet, record, batchGrams: total, targetGrams: total })
    .where(eq(batches.id, batch.id));
  if (state === 'released') {
    await db
      .update(batches)
      .set({ state: 'released', releasedAt: new Date(), releasedBy: options.releasedBy ?? null })
      .where(eq(batches.id, batch.id));
    const rows = options.lines.flatMap((l, i) =>
      l.picks.map((p) => ({
        workshopId,
        lotId: p.lotId,
        quantity: p.grams / 1000,
        kind: 'batch' as const,
        batchId: batch.id,
        lineNumber: i + 1,
        grams: p.grams,
      })),
    );
    if (rows.length > 0) await db.insert(lotConsumptions).values(rows);
  }
  return { id: batch.id, batchCode: batch.batchCode, formula };
}
