import { and, desc, eq, inArray, like, or, sql, type SQL } from 'drizzle-orm';
import type { MaterialFields, MaterialListQuery } from '@batchproof/shared';
import {
  containsPattern,
  listOrder,
  pageWindow,
  totalColumn,
  withTotal,
} from '../core/list-paging';
import type { Database } from '../db/database';
import { unlessArchived } from '../housekeeping/archiving';
import { documents, formulaLines, lots, materials, suppliers } from '../db/schema';

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
  archivedAt: materials.archivedAt,
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
  archivedAt: materials.archivedAt,
};
const sortColumns = {
  tradeName: materials.tradeName,
  inci: materials.inci,
  category: materials.category,
  createdAt: materials.createdAt,
  updatedAt: materials.updatedAt,
} as const;

/**
 * The text filter's two tests: the material's own trade name, INCI, US name and CAS (lower-cased
 * in one column), and its blend components' INCI names. PostgreSQL lower-cases the pattern too,
 * so both sides fold case the same way.
 */
function textMatch(q: string) {
  const pattern = sql`lower(${containsPattern(q)})`;
  return {
    pattern,
    own: like(materials.searchText, pattern),
    component: like(materials.componentSearchText, pattern),
  };
}

function listWhere(workshopId: string, q: MaterialListQuery) {
  const conditions: (SQL | undefined)[] = [
    eq(materials.workshopId, workshopId),
    unlessArchived(materials.archivedAt, q.includeArchived),
  ];
  if (q.q) {
    const match = textMatch(q.q);
    conditions.push(or(match.own, match.component));
  }
  if (q.category) conditions.push(eq(materials.category, q.category));
  if (q.supplierId) conditions.push(eq(materials.supplierId, q.supplierId));
  return and(...conditions);
}

/**
 * What the text filter found in each row: whether the material's own names matched (null when the
 * list is not filtered by text) and, when only a component did, that component's INCI name.
 */
function matchColumns(q: MaterialListQuery) {
  if (!q.q) {
    return { ownMatch: sql<boolean | null>`null`, matchedComponent: sql<string | null>`null` };
  }
  const { pattern, own } = textMatch(q.q);
  return {
    ownMatch: sql<boolean | null>`${own}`,
    matchedComponent: sql<string | null>`case when ${own} then null else (
      select c ->> 'inci' from jsonb_array_elements(${materials.components}) as c
      where lower(c ->> 'inci') like ${pattern} limit 1) end`,
  };
}

/**
 * One page of the workshop's materials, filtered, sorted and paged in SQL. Filtered by text, the
 * materials whose own names match come first (then the chosen order), and those found only
 * through a blend component after them.
 */
export async function pageMaterials(db: Database, workshopId: string, q: MaterialListQuery) {
  const where = listWhere(workshopId, q);
  const { limit, offset } = pageWindow(q);
  const order = listOrder(sortColumns[q.sort], q.dir, materials.id);
  const rows = await db
    .select({ ...summaryColumns, ...matchColumns(q), total: totalColumn(materials, where) })
    .from(materials)
    .leftJoin(suppliers, eq(suppliers.id, materials.supplierId))
    .where(where)
    .orderBy(...(q.q ? [desc(textMatch(q.q).own), ...order] : order))
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

/** How many lots, formula lines and documents still point at the material. */
export async function countMaterialUses(db: Database, workshopId: string, id: string) {
  const [row] = await db
    .select({
      lots: sql<number>`(select count(*)::int from ${lots} where ${lots.workshopId} = ${workshopId} and ${lots.materialId} = ${id})`,
      lines: sql<number>`(select count(*)::int from ${formulaLines} where ${formulaLines.workshopId} = ${workshopId} and ${formulaLines.materialId} = ${id})`,
      documents: sql<number>`(select count(*)::int from ${documents} where ${documents.workshopId} = ${workshopId} and ${documents.materialId} = ${id})`,
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

/**
 * Every material of the workshop as the CSV import matches it: trade name and supplier, those in
 * use before archived ones, then oldest first (so a row matches the material most likely meant).
 */
export async function materialIdentities(db: Database, workshopId: string) {
  return db
    .select({ id: materials.id, tradeName: materials.tradeName, supplierId: materials.supplierId })
    .from(materials)
    .where(eq(materials.workshopId, workshopId))
    .orderBy(sql`${materials.archivedAt} is not null`, materials.createdAt, materials.id);
}
