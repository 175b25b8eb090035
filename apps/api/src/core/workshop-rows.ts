import { and, asc, eq, ne, sql } from 'drizzle-orm';
import type { AnyPgColumn, PgTable } from 'drizzle-orm/pg-core';
import type { Database } from '../db/database';
import { foldedText } from '../housekeeping/folded-text';

/** A workshop table: its rows have an id and belong to one workshop. */
type WorkshopTable = PgTable & { id: AnyPgColumn; workshopId: AnyPgColumn };

/** The row `id` of the workshop, and only of the workshop. */
const ownRow = (table: WorkshopTable, workshopId: string, id: string) =>
  and(eq(table.workshopId, workshopId), eq(table.id, id));

/** Sets fields of one row of the workshop; the id, or undefined when the workshop has no such row. */
export async function updateOwnRow(
  db: Database,
  table: WorkshopTable,
  workshopId: string,
  id: string,
  values: Record<string, unknown>,
): Promise<string | undefined> {
  const [row] = await db
    .update(table)
    .set(values)
    .where(ownRow(table, workshopId, id))
    .returning({ id: table.id });
  return row?.id as string | undefined;
}

/** Deletes one row of the workshop; the id, or undefined when the workshop has no such row. */
export async function deleteOwnRow(
  db: Database,
  table: WorkshopTable,
  workshopId: string,
  id: string,
): Promise<string | undefined> {
  const [row] = await db
    .delete(table)
    .where(ownRow(table, workshopId, id))
    .returning({ id: table.id });
  return row?.id as string | undefined;
}

/**
 * The workshop's other rows whose `name` column is `name` once case and runs of white space are
 * folded (archived ones too), oldest first: a second "Larkspur  pantry" is most likely a typo.
 */
export async function rowsNamed(
  db: Database,
  table: WorkshopTable & { name: AnyPgColumn; archivedAt: AnyPgColumn; createdAt: AnyPgColumn },
  workshopId: string,
  name: string,
  exceptId?: string,
) {
  const rows = await db
    .select({ id: table.id, name: table.name, archivedAt: table.archivedAt })
    .from(table)
    .where(
      and(
        eq(table.workshopId, workshopId),
        sql`${foldedText(table.name, ' ')} = ${foldedText(name, ' ')}`,
        exceptId ? ne(table.id, exceptId) : undefined,
      ),
    )
    .orderBy(asc(table.createdAt), asc(table.id));
  return rows as { id: string; name: string; archivedAt: Date | null }[];
}
