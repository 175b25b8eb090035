import { eq } from 'drizzle-orm';
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
