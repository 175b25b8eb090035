import { and, eq } from 'drizzle-orm';
import type { ProductIdentity } from '@batchproof/shared';
import type { Database } from '../db/database';
import { productIdentities } from '../db/schema';

/** A formula's stored product identity, or undefined when none was entered. */
export async function findProductIdentity(db: Database, workshopId: string, formulaId: string) {
  const [row] = await db
    .select()
    .from(productIdentities)
    .where(
      and(eq(productIdentities.workshopId, workshopId), eq(productIdentities.formulaId, formulaId)),
    );
  return row;
}

/** Inserts or replaces a formula's product identity (one per formula). */
export async function upsertProductIdentity(
  db: Database,
  row: { workshopId: string; formulaId: string; identity: ProductIdentity; updatedBy: string },
) {
  await db
    .insert(productIdentities)
    .values(row)
    .onConflictDoUpdate({
      target: [productIdentities.workshopId, productIdentities.formulaId],
      set: { identity: row.identity, updatedBy: row.updatedBy, updatedAt: new Date() },
    });
}
