import { randomUUID } from 'node:crypto';
import { batchRecordInputSchema } from '@batchproof/shared';
import type { Database } from '../../apps/api/src/db/database';
import { batches, formulas, formulaVersions } from '../../apps/api/src/db/schema';
import { aBathProfile } from '../../fixtures/builders/formula-builder';

// Finished lots (released batches) inserted straight into the database, for specs that need
// lots to deliver, trace or recall without making and releasing a batch through the routes.

/** A formula with one released version (no lines), inserted straight into the database. */
export async function buildReleasedFormula(
  db: Database,
  workshopId: string,
  options: { name?: string } = {},
) {
  const [formula] = await db
    .insert(formulas)
    .values({
      workshopId,
      name: options.name ?? `Test Fizzer ${randomUUID().slice(0, 6)}`,
      productType: 'fizzer',
    })
    .returning();
  const [version] = await db
    .insert(formulaVersions)
    .values({
      workshopId,
      formulaId: formula!.id,
      number: 1,
      state: 'released',
      profile: aBathProfile() as typeof formulaVersions.$inferInsert.profile,
      releasedAt: new Date(),
    })
    .returning();
  return { formulaId: formula!.id, versionId: version!.id, versionNumber: 1, name: formula!.name };
}

export interface FinishedLotOptions {
  formulaId: string;
  versionId: string;
  versionNumber?: number;
  /** The lot code (batch code); GS1 (10) characters, unique in the workshop. */
  batchCode: string;
  /** The lot's quantity; null when not yet counted. */
  unitsMade: number | null;
  /** Default 2026-01-15. */
  madeOn?: string;
  /** Default `released` (a finished lot); `draft` for a batch still being made. */
  state?: 'draft' | 'released';
}

let sequence = 0;

/**
 * Inserts a batch straight into `batches`, released by default: a finished lot whose lot code is
 * `batchCode` and whose quantity is `unitsMade`. Its sheet and record are empty but valid.
 */
export async function buildFinishedLot(
  db: Database,
  workshopId: string,
  options: FinishedLotOptions,
) {
  const state = options.state ?? 'released';
  const [row] = await db
    .insert(batches)
    .values({
      workshopId,
      formulaId: options.formulaId,
      versionId: options.versionId,
      versionNumber: options.versionNumber ?? 1,
      batchCode: options.batchCode,
      sequence: ++sequence,
      state,
      madeOn: options.madeOn ?? '2026-01-15',
      targetGrams: 1000,
      lossPercent: 0,
      batchGrams: 1000,
      tolerancePercent: 2,
      sheet: {
        lines: [],
        sum: { batchGrams: 1000, roundedGrams: 1000, differenceGrams: 0, withinRounding: true },
        notes: [],
      },
      record: batchRecordInputSchema.parse({ mould: { unitsMade: options.unitsMade } }),
      unitsMade: options.unitsMade,
      releasedAt: state === 'released' ? new Date() : null,
    })
    .returning();
  return row!;
}
