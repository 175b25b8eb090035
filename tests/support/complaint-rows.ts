import { randomUUID } from 'node:crypto';
import type { BatchRecordFields } from '@batchproof/shared';
import type { Database } from '../../apps/api/src/db/database';
import { batches, formulaVersions } from '../../apps/api/src/db/schema';
import type { BatchSheet } from '../../apps/api/src/db/schema/batches';
import { and, eq } from 'drizzle-orm';

/**
 * Inserts a batch of a formula's newest version straight into the table (no weigh sheet, no
 * stock taken), for specs that only need a batch to point at.
 */
export async function buildBatchRow(
  db: Database,
  workshopId: string,
  formulaId: string,
  overrides: Partial<typeof batches.$inferInsert> = {},
) {
  const [version] = await db
    .select({ id: formulaVersions.id, number: formulaVersions.number })
    .from(formulaVersions)
    .where(
      and(eq(formulaVersions.workshopId, workshopId), eq(formulaVersions.formulaId, formulaId)),
    )
    .limit(1);
  const sheet: BatchSheet = {
    lines: [],
    sum: { batchGrams: 1000, roundedGrams: 1000, differenceGrams: 0, withinRounding: true },
    notes: [],
  };
  const [row] = await db
    .insert(batches)
    .values({
      workshopId,
      formulaId,
      versionId: version!.id,
      versionNumber: version!.number,
      batchCode: `T${randomUUID().slice(0, 8).toUpperCase()}`,
      sequence: 1,
      madeOn: '2026-11-01',
      targetGrams: 1000,
      lossPercent: 0,
      batchGrams: 1000,
      tolerancePercent: 2,
      sheet,
      record: {} as BatchRecordFields,
      ...overrides,
    })
    .returning();
  return row!;
}
