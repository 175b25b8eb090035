import { and, eq, ilike, or, sql, type SQL } from 'drizzle-orm';
import type { SupplierListQuery } from '@batchproof/shared';
import {
  containsPattern,
  listOrder,
  pageWindow,
  totalColumn,
  withTotal,
} from '../core/list-paging';
import { deleteOwnRow, rowsNamed, updateOwnRow } from '../core/workshop-rows';
import type { Database } from '../db/database';
import { unlessArchived } from '../housekeeping/archiving';
import { materials, suppliers } from '../db/schema';

/** A supplier row as stored. */
export type SupplierRow = typeof suppliers.$inferSelect;
/** The editable fields of a supplier. */
export type SupplierValues = Pick<SupplierRow, 'name' | 'contact' | 'email' | 'website' | 'notes'>;

// Spelled out in full: in a single-table select Drizzle renders `${suppliers.id}` as a bare "id",
// which inside the subquery would mean the material's own id.
const materialCount = sql<number>`(select count(*)::int from ${materials} where ${materials.supplierId} = ${sql.raw('"suppliers"."id"')})`;
const columns = {
  id: suppliers.id,
  name: suppliers.name,
  contact: suppliers.contact,
  email: suppliers.email,
  website: suppliers.website,
  notes: suppliers.notes,
  archivedAt: suppliers.archivedAt,
  createdAt: suppliers.createdAt,
  updatedAt: suppliers.updatedAt,
  materialCount,
};
const sortColumns = {
  name: suppliers.name,
  createdAt: suppliers.createdAt,
  updatedAt: suppliers.updatedAt,
} as const;

/** One page of the workshop's suppliers, filtered and sorted in SQL. */
export async function pageSuppliers(db: Database, workshopId: string, q: SupplierListQuery) {
  const conditions: (SQL | undefined)[] = [
    eq(suppliers.workshopId, workshopId),
    unlessArchived(suppliers.archivedAt, q.includeArchived),
  ];
  if (q.q) {
    const p = containsPattern(q.q);
    conditions.push(
      or(ilike(suppliers.name, p), ilike(suppliers.contact, p), ilike(suppliers.email, p)),
    );
  }
  const where = and(...conditions);
  const { limit, offset } = pageWindow(q);
  const rows = await db
    .select({ ...columns, total: totalColumn(suppliers, where) })
    .from(suppliers)
    .where(where)
    .orderBy(...listOrder(sortColumns[q.sort], q.dir, suppliers.id))
    .limit(limit)
    .offset(offset);
  return withTotal(db, rows, { table: suppliers, where, page: q.page });
}

export async function findSupplier(db: Database, workshopId: string, id: string) {
  const [row] = await db
    .select(columns)
    .from(suppliers)
    .where(and(eq(suppliers.workshopId, workshopId), eq(suppliers.id, id)));
  return row;
}

export async function insertSupplier(db: Database, workshopId: string, values: SupplierValues) {
  const [row] = await db
    .insert(suppliers)
    .values({ ...values, workshopId })
    .returning({ id: suppliers.id });
  return row!.id;
}

export const updateSupplier = (
  db: Database,
  workshopId: string,
  id: string,
  values: SupplierValues,
) => updateOwnRow(db, suppliers, workshopId, id, values);

export const deleteSupplier = (db: Database, workshopId: string, id: string) =>
  deleteOwnRow(db, suppliers, workshopId, id);

/**
 * The workshop's other suppliers whose name is `name` once case and runs of white space are
 * folded (archived ones too), oldest first: a second "Alder  chemicals" is most likely a typo.
 */
export const suppliersNamed = (db: Database, workshopId: string, name: string, exceptId?: string) =>
  rowsNamed(db, suppliers, workshopId, name, exceptId);

/** Suppliers of the workshop by lower-cased name, for the CSV import. */
export async function suppliersByName(db: Database, workshopId: string) {
  const rows = await db
    .select({ id: suppliers.id, name: suppliers.name })
    .from(suppliers)
    .where(eq(suppliers.workshopId, workshopId));
  return new Map(rows.map((r) => [r.name.trim().toLowerCase(), r.id]));
}
