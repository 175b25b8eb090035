import { and, asc, eq, isNull, sql } from 'drizzle-orm';
import type { MarketRecordKind, MarketRecordParsed } from '@batchproof/shared';
import type { Database } from '../db/database';
import {
  assessments,
  formulas,
  formulaVersions,
  labelRuns,
  marketRecords,
  productIdentities,
} from '../db/schema';

/**
 * Reads for market readiness: one query per table for all of the workshop's products, never one
 * per formula.
 */

/** Every non-archived formula with a released version, by name, with that version. */
export async function releasedProducts(db: Database, workshopId: string) {
  return db
    .select({
      formulaId: formulas.id,
      formulaName: formulas.name,
      productType: formulas.productType,
      versionId: formulaVersions.id,
      versionNumber: formulaVersions.number,
      profile: formulaVersions.profile,
    })
    .from(formulas)
    .innerJoin(
      formulaVersions,
      and(
        eq(formulaVersions.workshopId, formulas.workshopId),
        eq(formulaVersions.formulaId, formulas.id),
        eq(formulaVersions.state, 'released'),
      ),
    )
    .where(and(eq(formulas.workshopId, workshopId), isNull(formulas.archivedAt)))
    .orderBy(asc(formulas.name), asc(formulas.id));
}

/**
 * The markets printed from each version, from the runs whose PDF was made (a run still rendering
 * or one that failed printed nothing).
 */
export async function printedMarkets(db: Database, workshopId: string) {
  return db
    .select({
      versionId: labelRuns.versionId,
      market: sql<string>`jsonb_array_elements_text(${labelRuns.markets})`.as('market'),
    })
    .from(labelRuns)
    .where(and(eq(labelRuns.workshopId, workshopId), eq(labelRuns.status, 'ready')))
    .groupBy(labelRuns.versionId, sql`2`);
}

/** The workshop's recorded references, every formula and kind. */
export async function allMarketRecords(db: Database, workshopId: string) {
  return db.select().from(marketRecords).where(eq(marketRecords.workshopId, workshopId));
}
export type MarketRecordRow = typeof marketRecords.$inferSelect;

/** The workshop's product identities, every formula. */
export async function allProductIdentities(db: Database, workshopId: string) {
  return db
    .select({ formulaId: productIdentities.formulaId, identity: productIdentities.identity })
    .from(productIdentities)
    .where(eq(productIdentities.workshopId, workshopId));
}

/** Inserts or replaces one formula's record of one kind, and answers the stored row. */
export async function upsertMarketRecord(
  db: Database,
  row: {
    workshopId: string;
    formulaId: string;
    kind: MarketRecordKind;
    updatedBy: string;
  } & MarketRecordParsed,
) {
  const values = {
    reference: row.reference,
    recordedOn: row.recordedOn,
    firstSaleOn: row.firstSaleOn,
    smallBusinessExempt: row.smallBusinessExempt,
    notes: row.notes,
    updatedBy: row.updatedBy,
  };
  const [stored] = await db
    .insert(marketRecords)
    .values({ workshopId: row.workshopId, formulaId: row.formulaId, kind: row.kind, ...values })
    .onConflictDoUpdate({
      target: [marketRecords.workshopId, marketRecords.formulaId, marketRecords.kind],
      set: { ...values, updatedAt: new Date() },
    })
    .returning();
  return stored!;
}

/**
 * Released versions of formulas in use, made for the EU or the UK, with no signed safety
 * assessment (the home page's `assessment-missing`), by formula name, with the newest version of
 * the formula that was assessed and how many there are in all.
 */
export async function releasedWithoutAssessment(db: Database, workshopId: string, limit: number) {
  const result = await db.execute<{
    formulaId: string;
    formulaName: string;
    versionNumber: number;
    markets: string[];
    lastAssessedVersion: number | null;
    matched: number;
  }>(sql`
    select ${formulas.id} as "formulaId", ${formulas.name} as "formulaName",
      v.number as "versionNumber",
      array(select m from jsonb_array_elements_text(v.profile -> 'markets') m
        where m in ('EU', 'UK') order by m) as "markets",
      (select max(av.number) from ${assessments} a
        join ${formulaVersions} av on av.workshop_id = a.workshop_id and av.id = a.version_id
        where a.workshop_id = ${formulas.workshopId} and av.formula_id = ${formulas.id}
          and a.status = 'signed') as "lastAssessedVersion",
      (count(*) over ())::int as "matched"
    from ${formulas}
    join ${formulaVersions} v on v.workshop_id = ${formulas.workshopId}
      and v.formula_id = ${formulas.id} and v.state = 'released'
    where ${formulas.workshopId} = ${workshopId} and ${formulas.archivedAt} is null
      and v.profile -> 'markets' ?| array['EU', 'UK']
      and not exists (select 1 from ${assessments} s
        where s.workshop_id = v.workshop_id and s.version_id = v.id and s.status = 'signed')
    order by ${formulas.name}, ${formulas.id}
    limit ${limit}`);
  return result.rows;
}
