import { eq } from 'drizzle-orm';
import type { ProductionSettings } from '@batchproof/shared';
import type { Database } from '../db/database';
import { workshops } from '../db/schema';

/** The workshop's name and address as labels print them. */
export async function findLabelDetails(db: Database, workshopId: string) {
  const [row] = await db
    .select({ name: workshops.name, address: workshops.address })
    .from(workshops)
    .where(eq(workshops.id, workshopId));
  return row;
}

export async function updateLabelDetails(
  db: Database,
  workshopId: string,
  details: { name: string; address: string },
) {
  await db
    .update(workshops)
    .set({ ...details, updatedAt: new Date() })
    .where(eq(workshops.id, workshopId));
}

/** The workshop's production settings: weighing tolerance, batch code pattern, small business. */
export async function findProductionSettings(
  db: Database,
  workshopId: string,
): Promise<ProductionSettings | undefined> {
  const [row] = await db
    .select({
      weighingTolerancePercent: workshops.weighingTolerancePercent,
      batchCodePattern: workshops.batchCodePattern,
      smallBusiness: workshops.smallBusiness,
    })
    .from(workshops)
    .where(eq(workshops.id, workshopId));
  return row;
}

export async function updateProductionSettings(
  db: Database,
  workshopId: string,
  settings: ProductionSettings,
) {
  await db
    .update(workshops)
    .set({ ...settings, updatedAt: new Date() })
    .where(eq(workshops.id, workshopId));
}
