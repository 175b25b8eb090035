import {
  complianceMarketSchema,
  marketReadiness,
  type ComplianceMarket,
  type MarketReadinessInput,
  type MarketRecord,
  type MarketRecordKind,
  type MarketRecordParsed,
  type ReadinessList,
} from '@batchproof/shared';
import { recordAudit } from '../audit/audit-log';
import type { AuthUser } from '../auth/authenticate';
import { notFound } from '../core/app-error';
import type { Database } from '../db/database';
import { findFormula } from '../formulas/formulas-repository';
import { findLabelDetails } from '../workshop/workshop-repository';
import { byFormula, signedVersions } from './assessment-findings';
import * as repo from './readiness-repository';

/** A stored record in the API's shape. */
export function marketRecord(row: repo.MarketRecordRow): MarketRecord {
  return {
    kind: row.kind,
    reference: row.reference,
    recordedOn: row.recordedOn,
    firstSaleOn: row.firstSaleOn,
    smallBusinessExempt: row.smallBusinessExempt,
    notes: row.notes,
    updatedAt: row.updatedAt.toISOString(),
  };
}

const isMarket = (m: string): m is ComplianceMarket => complianceMarketSchema.safeParse(m).success;

/** Groups rows by a key. */
function grouped<T>(rows: readonly T[], key: (row: T) => string): Map<string, T[]> {
  const map = new Map<string, T[]>();
  for (const row of rows) map.set(key(row), [...(map.get(key(row)) ?? []), row]);
  return map;
}

/**
 * Every product of the caller's workshop with a released version (archived formulas left out),
 * each market of that version with what is in place and what is missing. One query per table for
 * all products.
 */
export async function listReadiness(
  db: Database,
  actor: AuthUser,
  today: string,
): Promise<ReadinessList> {
  const workshopId = actor.workshopId;
  const products = await repo.releasedProducts(db, workshopId);
  if (products.length === 0) return { items: [] };
  const [signed, printed, records, identities, workshop] = await Promise.all([
    signedVersions(
      db,
      workshopId,
      products.map((p) => p.formulaId),
    ),
    repo.printedMarkets(db, workshopId),
    repo.allMarketRecords(db, workshopId),
    repo.allProductIdentities(db, workshopId),
    findLabelDetails(db, workshopId),
  ]);
  const signedOf = byFormula(signed);
  const printedOf = grouped(printed, (r) => r.versionId);
  const recordsOf = grouped(records, (r) => r.formulaId);
  const identityOf = new Map(identities.map((i) => [i.formulaId, i.identity]));

  return {
    items: products.map((p) => {
      // Newest version first, as `signedVersions` answers them: the latest signed assessment.
      const newest = (signedOf.get(p.formulaId) ?? [])[0];
      const formulaRecords = (recordsOf.get(p.formulaId) ?? []).map(marketRecord);
      const input: MarketReadinessInput = {
        formulaId: p.formulaId,
        markets: p.profile.markets,
        releasedVersionNumber: p.versionNumber,
        signedAssessment: newest
          ? { id: newest.assessmentId, versionNumber: newest.versionNumber }
          : null,
        labelRunMarkets: (printedOf.get(p.versionId) ?? []).map((r) => r.market).filter(isMarket),
        records: formulaRecords,
        identity: identityOf.get(p.formulaId) ?? null,
        // The name and address every label prints (the CA item asks for both).
        workshopAddressPresent: !!workshop?.name && !!workshop.address,
        today,
      };
      return {
        formulaId: p.formulaId,
        formulaName: p.formulaName,
        productType: p.productType,
        versionId: p.versionId,
        versionNumber: p.versionNumber,
        markets: marketReadiness(input),
        records: formulaRecords.sort((a, b) => a.kind.localeCompare(b.kind)),
      };
    }),
  };
}

/**
 * Records (or replaces) one reference of a formula of the caller's workshop, with its audit entry
 * in the same transaction; 404 for a formula of another workshop.
 */
export async function saveMarketRecord(
  db: Database,
  actor: AuthUser,
  formulaId: string,
  kind: MarketRecordKind,
  input: MarketRecordParsed,
): Promise<MarketRecord> {
  return db.transaction(async (tx) => {
    if (!(await findFormula(tx, actor.workshopId, formulaId))) throw notFound('That formula');
    const row = await repo.upsertMarketRecord(tx, {
      workshopId: actor.workshopId,
      formulaId,
      kind,
      updatedBy: actor.id,
      ...input,
    });
    await recordAudit(tx, actor, {
      action: 'market_record.saved',
      subjectType: 'market_record',
      subjectId: row.id,
      detail: { formulaId, kind, ...input },
    });
    return marketRecord(row);
  });
}
