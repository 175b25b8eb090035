import { and, asc, eq, ilike, inArray, or, sql, type SQL } from 'drizzle-orm';
import type { CustomerFields, CustomerListQuery } from '@batchproof/shared';
import {
  containsPattern,
  listOrder,
  pageWindow,
  totalColumn,
  withTotal,
} from '../core/list-paging';
import { deleteOwnRow, rowsNamed, updateOwnRow } from '../core/workshop-rows';
import type { Database } from '../db/database';
import { customers, deliveries } from '../db/schema';
import { unlessArchived } from '../housekeeping/archiving';
import { foldedText } from '../housekeeping/folded-text';

// Spelled out in full: in a single-table select Drizzle renders `${customers.id}` as a bare "id",
// which inside the subquery would mean the delivery's own id.
const deliveryCount = sql<number>`(select count(*)::int from ${deliveries} where ${deliveries.customerId} = ${sql.raw('"customers"."id"')})`;
const columns = {
  id: customers.id,
  kind: customers.kind,
  name: customers.name,
  contact: customers.contact,
  email: customers.email,
  phone: customers.phone,
  address: customers.address,
  notes: customers.notes,
  archivedAt: customers.archivedAt,
  createdAt: customers.createdAt,
  updatedAt: customers.updatedAt,
  deliveryCount: deliveryCount.mapWith(Number),
};
const sortColumns = {
  name: customers.name,
  kind: customers.kind,
  createdAt: customers.createdAt,
  updatedAt: customers.updatedAt,
} as const;

/** One page of the workshop's customers, filtered and sorted in SQL. */
export async function pageCustomers(db: Database, workshopId: string, q: CustomerListQuery) {
  const conditions: (SQL | undefined)[] = [
    eq(customers.workshopId, workshopId),
    unlessArchived(customers.archivedAt, q.includeArchived),
  ];
  if (q.q) {
    const p = containsPattern(q.q);
    conditions.push(
      or(ilike(customers.name, p), ilike(customers.contact, p), ilike(customers.email, p)),
    );
  }
  if (q.kind) conditions.push(eq(customers.kind, q.kind));
  const where = and(...conditions);
  const { limit, offset } = pageWindow(q);
  const rows = await db
    .select({ ...columns, total: totalColumn(customers, where) })
    .from(customers)
    .where(where)
    .orderBy(...listOrder(sortColumns[q.sort], q.dir, customers.id))
    .limit(limit)
    .offset(offset);
  return withTotal(db, rows, { table: customers, where, page: q.page });
}

export async function findCustomer(db: Database, workshopId: string, id: string) {
  const [row] = await db
    .select(columns)
    .from(customers)
    .where(and(eq(customers.workshopId, workshopId), eq(customers.id, id)));
  return row;
}

export async function insertCustomer(db: Database, workshopId: string, values: CustomerFields) {
  const [row] = await db
    .insert(customers)
    .values({ ...values, workshopId })
    .returning({ id: customers.id });
  return row!.id;
}

export const updateCustomer = (
  db: Database,
  workshopId: string,
  id: string,
  values: CustomerFields,
) => updateOwnRow(db, customers, workshopId, id, values);

export const deleteCustomer = (db: Database, workshopId: string, id: string) =>
  deleteOwnRow(db, customers, workshopId, id);

/** The workshop's other customers with this name, case and spaces folded, oldest first. */
export const customersNamed = (db: Database, workshopId: string, name: string, exceptId?: string) =>
  rowsNamed(db, customers, workshopId, name, exceptId);

/**
 * The workshop's customers with one of these names, case and spaces folded (the CSV import's
 * `duplicateKey`), oldest first, so that a name shared by two customers resolves to the first.
 */
export async function customersByNames(db: Database, workshopId: string, names: string[]) {
  if (names.length === 0) return [];
  const folded = names.map((n) => n.trim().replace(/\s+/g, ' ').toLowerCase());
  return db
    .select({ id: customers.id, name: customers.name })
    .from(customers)
    .where(
      and(eq(customers.workshopId, workshopId), inArray(foldedText(customers.name, ' '), folded)),
    )
    .orderBy(asc(customers.createdAt), asc(customers.id));
}
