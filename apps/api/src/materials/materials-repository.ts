import { and, eq, inArray, like, sql, type SQL } from 'drizzle-orm';
import type { MaterialFields, MaterialListQuery } from '@batchproof/shared';
import {
  containsPattern,
  listOrder,
  pageWindow,
  totalColumn,
  withTotal,
} from '../core/list-paging';
import type { Database } from '../db/database';
import { formulaLines, lots, materials, suppliers } from '../db/schema';

/** The full material with its supplier's name. */
const fullColumns = {
  id: materials.id,
  tradeName: materials.tradeName,
  inci: materials.inci,
  usName: materials.usName,
  cas: materials.cas,
  ec: materials.ec,
  functions: materials.functions,
  category: materials.category,
  supplierId: materials.supplierId,
  supplierName: suppliers.name,
  notes: materials.notes,
  colourIndex: materials.colourIndex,
  nano: materials.nano,
  components: materials.components,
  ifraCertificate: materials.ifraCertificate,
  allergenDeclaration: materials.allergenDeclaration,
  weightPerVolume: materials.weightPerVolume,
  calibrations: materials.calibrations,
  createdAt: materials.createdAt,
  updatedAt: materials.updatedAt,
};
/** A stored material with its supplier's name. */
export type MaterialRow = Awaited<ReturnType<typeof findMaterials>>[number];

const summaryColumns = {
  id: materials.id,
  tradeName: materials.tradeName,
  inci: materials.inci,
  usName: materials.usName,
  cas: materials.cas,
  category: materials.category,
  supplierId: materials.supplierId,
  supplierName: suppliers.name,
  colourIndex: materials.colourIndex,
  functions: materials.functions,
  updatedAt: materials.updatedAt,
};
const sortColumns = {
  tradeName: materials.tradeName,
  inci: materials.inci,
  category: materials.category,
  createdAt: materials.createdAt,
  updatedAt: materials.updatedAt,
} as const;

function listWhere(workshopId: string, q: MaterialListQuery) {
  const conditions: (SQL | undefined)[] = [eq(materials.workshopId, workshopId)];
  // Trade name, INCI, US name and CAS, lower-cased in one column; PostgreSQL lower-cases the
  // pattern too, so both sides fold case the same way.
  if (q.q) conditions.push(like(materials.searchText, sql`lower(${containsPattern(q.q)})`));
  if (q.category) conditions.push(eq(materials.category, q.category));
  if (q.supplierId) conditions.push(eq(materials.supplierId, q.supplierId));
  return and(...conditions);
}

/** One page of the workshop's materials, filtered, sorted and paged in SQL. */
export async function pageMaterials(db: Database, workshopId: string, q: MaterialListQuery) {
  const where = listWhere(workshopId, q);
  const { limit, offset } = pageWindow(q);
  const rows = await db
    .select({ ...summaryColumns, total: totalColumn(materials, where) })
    .from(materials)
    .leftJoin(suppliers, eq(suppliers.id, materials.supplierId))
    .where(where)
    .orderBy(...listOrder(sortColumns[q.sort], q.dir, materials.id))
    .limit(limit)
    .offset(offset);
  return withTotal(db, rows, { table: materials, where, page: q.page });
}

/** Materials of the workshop by id (all of them when `ids` is omitted), with supplier names. */
export async function findMaterials(db: Database, workshopId: string, ids?: readonly string[]) {
  if (ids && ids.length === 0) return [];
  return db
    .select(fullColumns)
    .from(materials)
    .leftJoin(suppliers, eq(suppliers.id, materials.supplierId))
    .where(
      and(eq(materials.workshopId, workshopId), ids ? inArray(materials.id, [...ids]) : undefined),
    )
    .orderBy(materials.tradeName, materials.id);
}

export async function findMaterial(db: Database, workshopId: string, id: string) {
  const [row] = await findMaterials(db, workshopId, [id]);
  return row;
}

/** Inserts materials in one statement; returns their ids in input order. */
export async function insertMaterials(db: Database, workshopId: string, rows: MaterialFields[]) {
  if (rows.length === 0) return [];
  const inserted = await db
    .insert(materials)
    .values(rows.map((r) => ({ ...r, workshopId })))
    .returning({ id: materials.id });
  return inserted.map((r) => r.id);
}

export async function updateMaterial(
  db: Database,
  workshopId: string,
  id: string,
  values: MaterialFields,
) {
  const [row] = await db
    .update(materials)
    .set(values)
    .where(and(eq(materials.workshopId, workshopId), eq(materials.id, id)))
    .returning({ id: materials.id });
  return row?.id;
}

export async function deleteMaterial(db: Database, workshopId: string, id: string) {
  const [row] = await db
    .delete(materials)
    .where(and(eq(materials.workshopId, workshopId), eq(materials.id, id)))
    .returning({ id: materials.id });
  return row?.id;
}

/** How many lots and formula lines still point at the material. */
export async function countMaterialUses(db: Database, workshopId: string, id: string) {
  const [row] = await db
    .select({
      lots: sql<number>`(select count(*)::int from ${lots} where ${lots.workshopId} = ${workshopId} and ${lots.materialId} = ${id})`,
      lines: sql<number>`(select count(*)::int from ${formulaLines} where ${formulaLines.workshopId} = ${workshopId} and ${formulaLines.materialId} = ${id})`,
    })
    .from(sql`(select 1) as one`);
  return row!;
}

/** Whether the supplier exists in the workshop. */
export async function supplierExists(db: Database, workshopId: string, supplierId: string) {
  const [row] = await db
    .select({ id: suppliers.id })
    .from(suppliers)
    .where(and(eq(suppliers.workshopId, workshopId), eq(suppliers.id, supplierId)));
  return row !== undefined;
}
