import { and, eq, inArray, isNull } from 'drizzle-orm';
import { productIdentitySchema } from '@batchproof/shared';
import type { Database } from '../db/database';
import { formulas, productIdentities, workshops } from '../db/schema';
import { demoIdentities, demoWorkshopAddress } from './hollowmere-labels';

/**
 * Makes the demo workshop ready to print: its address when it has none, and a product identity
 * for each demo formula that has none, so a new user can print the released formulas at once.
 * Never overwrites what a user entered; safe on every start.
 */
export async function seedDemoLabels(db: Database, workshopId: string) {
  await db
    .update(workshops)
    .set({ address: demoWorkshopAddress })
    .where(and(eq(workshops.id, workshopId), isNull(workshops.address)));
  const rows = await db
    .select({ id: formulas.id, name: formulas.name })
    .from(formulas)
    .where(
      and(eq(formulas.workshopId, workshopId), inArray(formulas.name, Object.keys(demoIdentities))),
    );
  if (rows.length === 0) return;
  await db
    .insert(productIdentities)
    .values(
      rows.map((f) => ({
        workshopId,
        formulaId: f.id,
        identity: productIdentitySchema.parse(demoIdentities[f.name]),
      })),
    )
    .onConflictDoNothing();
}
