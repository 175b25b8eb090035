import { and, asc, eq, ilike, inArray, max, sql, type SQL } from 'drizzle-orm';
import type { FormulaListQuery, ProductProfile, ProductType } from '@batchproof/shared';
import {
  containsPattern,
  listOrder,
  pageWindow,
  totalColumn,
  withTotal,
} from '../core/list-paging';
import type { Database } from '../db/database';
import { unlessArchived } from '../housekeeping/archiving';
import {
  formulaLines,
  formulaLineSubstitutes,
  formulas,
  formulaVersions,
  materials,
} from '../db/schema';

/** A stored version row. */
export type VersionRow = typeof formulaVersions.$inferSelect;
/** Fields of a formula the user edits directly. */
export interface FormulaValues {
  name: string;
  productType: ProductType;
  notes: string | null;
}
/** What a stored evaluation consists of. */
export type EvaluationFields = Pick<
  VersionRow,
  'evaluation' | 'blockCount' | 'warnCount' | 'infoCount' | 'evaluationProblems' | 'evaluatedAt'
>;

// Spelled out in full: in a single-table select Drizzle renders `${formulas.id}` as a bare "id",
// which inside the subquery would mean the version's own id.
const outerFormulaId = sql.raw('"formulas"."id"');
const latestNumber = sql<
  number | null
>`(select max(${formulaVersions.number}) from ${formulaVersions} where ${formulaVersions.formulaId} = ${outerFormulaId})`;
const latestState = sql<
  string | null
>`(select ${formulaVersions.state} from ${formulaVersions} where ${formulaVersions.formulaId} = ${outerFormulaId} order by ${formulaVersions.number} desc limit 1)`;
const releasedNumber = sql<
  number | null
>`(select ${formulaVersions.number} from ${formulaVersions} where ${formulaVersions.formulaId} = ${outerFormulaId} and ${formulaVersions.state} = 'released')`;
const latestCounts = sql<{
  block: number;
  warn: number;
  info: number;
} | null>`(select case when ${formulaVersions.blockCount} is null then null else json_build_object('block', ${formulaVersions.blockCount}, 'warn', coalesce(${formulaVersions.warnCount}, 0), 'info', coalesce(${formulaVersions.infoCount}, 0)) end from ${formulaVersions} where ${formulaVersions.formulaId} = ${outerFormulaId} order by ${formulaVersions.number} desc limit 1)`;
const sortColumns = {
  name: formulas.name,
  productType: formulas.productType,
  createdAt: formulas.createdAt,
  updatedAt: formulas.updatedAt,
} as const;

/** One page of the workshop's formulas with their latest and released version numbers. */
export async function pageFormulas(db: Database, workshopId: string, q: FormulaListQuery) {
  const conditions: (SQL | undefined)[] = [
    eq(formulas.workshopId, workshopId),
    unlessArchived(formulas.archivedAt, q.includeArchived),
  ];
  if (q.q) conditions.push(ilike(formulas.name, containsPattern(q.q)));
  if (q.productType) conditions.push(eq(formulas.productType, q.productType));
  const where = and(...conditions);
  const { limit, offset } = pageWindow(q);
  const rows = await db
    .select({
      id: formulas.id,
      name: formulas.name,
      productType: formulas.productType,
      updatedAt: formulas.updatedAt,
      latestVersion: latestNumber,
      latestState: latestState.mapWith(String),
      releasedVersion: releasedNumber,
      latestCounts,
      archivedAt: formulas.archivedAt,
      total: totalColumn(formulas, where),
    })
    .from(formulas)
    .where(where)
    .orderBy(...listOrder(sortColumns[q.sort], q.dir, formulas.id))
    .limit(limit)
    .offset(offset);
  return withTotal(db, rows, { table: formulas, where, page: q.page });
}

export async function findFormula(db: Database, workshopId: string, id: string, lock = false) {
  const query = db
    .select()
    .from(formulas)
    .where(and(eq(formulas.workshopId, workshopId), eq(formulas.id, id)));
  const [row] = lock ? await query.for('update') : await query;
  return row;
}

export async function listVersionSummaries(db: Database, workshopId: string, formulaId: string) {
  return db
    .select({
      number: formulaVersions.number,
      state: formulaVersions.state,
      blockCount: formulaVersions.blockCount,
      warnCount: formulaVersions.warnCount,
      infoCount: formulaVersions.infoCount,
      releasedAt: formulaVersions.releasedAt,
      updatedAt: formulaVersions.updatedAt,
    })
    .from(formulaVersions)
    .where(
      and(eq(formulaVersions.workshopId, workshopId), eq(formulaVersions.formulaId, formulaId)),
    )
    .orderBy(asc(formulaVersions.number));
}

export async function insertFormula(db: Database, workshopId: string, values: FormulaValues) {
  const [row] = await db
    .insert(formulas)
    .values({ ...values, workshopId })
    .returning({ id: formulas.id });
  return row!.id;
}

export async function updateFormula(
  db: Database,
  workshopId: string,
  id: string,
  values: Partial<FormulaValues>,
) {
  const [row] = await db
    .update(formulas)
    .set({ ...values, updatedAt: new Date() })
    .where(and(eq(formulas.workshopId, workshopId), eq(formulas.id, id)))
    .returning({ id: formulas.id });
  return row?.id;
}

/** A version by formula and number; `lock` takes a row lock for the rest of the transaction. */
export async function findVersion(
  db: Database,
  workshopId: string,
  formulaId: string,
  number: number,
  lock = false,
) {
  const query = db
    .select()
    .from(formulaVersions)
    .where(
      and(
        eq(formulaVersions.workshopId, workshopId),
        eq(formulaVersions.formulaId, formulaId),
        eq(formulaVersions.number, number),
      ),
    );
  const [row] = lock ? await query.for('update') : await query;
  return row;
}

/** The formula's versions in a state (at most one draft and one released exist). */
export async function findVersionInState(
  db: Database,
  workshopId: string,
  formulaId: string,
  state: VersionRow['state'],
) {
  const [row] = await db
    .select()
    .from(formulaVersions)
    .where(
      and(
        eq(formulaVersions.workshopId, workshopId),
        eq(formulaVersions.formulaId, formulaId),
        eq(formulaVersions.state, state),
      ),
    );
  return row;
}

export async function latestVersionNumber(db: Database, workshopId: string, formulaId: string) {
  const [row] = await db
    .select({ n: max(formulaVersions.number) })
    .from(formulaVersions)
    .where(
      and(eq(formulaVersions.workshopId, workshopId), eq(formulaVersions.formulaId, formulaId)),
    );
  return row?.n ?? 0;
}

/** Lines of a version in order, with each material's trade name and the line's approved substitutes. */
export async function findLines(db: Database, workshopId: string, versionId: string) {
  const lines = await db
    .select({
      id: formulaLines.id,
      materialId: formulaLines.materialId,
      materialName: materials.tradeName,
      grams: formulaLines.grams,
    })
    .from(formulaLines)
    .innerJoin(materials, eq(materials.id, formulaLines.materialId))
    .where(and(eq(formulaLines.workshopId, workshopId), eq(formulaLines.versionId, versionId)))
    .orderBy(asc(formulaLines.position));
  const substitutes = await findSubstitutes(
    db,
    workshopId,
    lines.map((l) => l.id),
  );
  return lines.map(({ id, ...line }) => ({ ...line, substitutes: substitutes.get(id) ?? [] }));
}

/** Approved substitutes of some lines, by line id, each line's in the formulator's order. */
export async function findSubstitutes(db: Database, workshopId: string, lineIds: string[]) {
  const byLine = new Map<string, { materialId: string; materialName: string }[]>();
  if (lineIds.length === 0) return byLine;
  const rows = await db
    .select({
      lineId: formulaLineSubstitutes.lineId,
      materialId: formulaLineSubstitutes.materialId,
      materialName: materials.tradeName,
    })
    .from(formulaLineSubstitutes)
    .innerJoin(materials, eq(materials.id, formulaLineSubstitutes.materialId))
    .where(
      and(
        eq(formulaLineSubstitutes.workshopId, workshopId),
        inArray(formulaLineSubstitutes.lineId, lineIds),
      ),
    )
    .orderBy(asc(formulaLineSubstitutes.position));
  for (const { lineId, ...sub } of rows) {
    const list = byLine.get(lineId) ?? [];
    list.push(sub);
    byLine.set(lineId, list);
  }
  return byLine;
}

export async function insertVersion(
  db: Database,
  row: {
    workshopId: string;
    formulaId: string;
    number: number;
    profile: ProductProfile;
    notes: string | null;
  } & EvaluationFields,
) {
  const [created] = await db
    .insert(formulaVersions)
    .values(row)
    .returning({ id: formulaVersions.id });
  return created!.id;
}

/**
 * Replaces a version's lines and their approved substitutes: one delete (substitutes go with their
 * lines, cascade) and one multi-row insert each.
 */
export async function replaceLines(
  db: Database,
  workshopId: string,
  versionId: string,
  lines: { materialId: string; grams: number; substitutes?: readonly string[] }[],
) {
  await db
    .delete(formulaLines)
    .where(and(eq(formulaLines.workshopId, workshopId), eq(formulaLines.versionId, versionId)));
  if (lines.length === 0) return;
  const inserted = await db
    .insert(formulaLines)
    .values(
      lines.map((l, position) => ({
        materialId: l.materialId,
        grams: l.grams,
        position,
        workshopId,
        versionId,
      })),
    )
    .returning({ id: formulaLines.id, position: formulaLines.position });
  const lineIds = new Map(inserted.map((r) => [r.position, r.id]));
  const substitutes = lines.flatMap((l, i) =>
    (l.substitutes ?? []).map((materialId, position) => ({
      workshopId,
      lineId: lineIds.get(i)!,
      materialId,
      position,
    })),
  );
  if (substitutes.length > 0) await db.insert(formulaLineSubstitutes).values(substitutes);
}

export async function updateVersion(
  db: Database,
  workshopId: string,
  versionId: string,
  values: Partial<Omit<VersionRow, 'id' | 'workshopId' | 'formulaId' | 'number' | 'createdAt'>>,
) {
  await db
    .update(formulaVersions)
    .set(values)
    .where(and(eq(formulaVersions.workshopId, workshopId), eq(formulaVersions.id, versionId)));
}

/** How many of the formula's versions were ever released (released or superseded). */
export async function countReleasedVersions(db: Database, workshopId: string, formulaId: string) {
  const [row] = await db
    .select({ n: sql<number>`count(*)::int` })
    .from(formulaVersions)
    .where(
      and(
        eq(formulaVersions.workshopId, workshopId),
        eq(formulaVersions.formulaId, formulaId),
        sql`${formulaVersions.state} <> 'draft'`,
      ),
    );
  return row?.n ?? 0;
}

/** Deletes a formula; its versions and lines go with it (cascade). */
export async function deleteFormula(db: Database, workshopId: string, id: string) {
  await db.delete(formulas).where(and(eq(formulas.workshopId, workshopId), eq(formulas.id, id)));
}
