import { and, desc, eq, inArray } from 'drizzle-orm';
import type { ComplianceFinding, ComplianceMarket } from '@batchproof/shared';
import type { Database } from '../db/database';
import { assessments, formulaVersions } from '../db/schema';

/**
 * The safety assessment a version sold in the EU or the UK needs before it is sold there. Both
 * rest on Art. 10(1): "prior to placing a cosmetic product on the market, ensure that the
 * cosmetic product has undergone a safety assessment … and that a cosmetic product safety report
 * is set up in accordance with Annex I" (confirmed in the text at legislation.gov.uk,
 * eur/2009/1223/article/10, and for the UK the retained text as in force there).
 */
export const ASSESSMENT_SOURCES: Record<'EU' | 'UK', string> = {
  EU: 'Regulation (EC) No 1223/2009, Art. 10 and Annex I',
  UK: 'UK Cosmetics Regulation (retained Regulation (EC) No 1223/2009), Art. 10 and Annex I',
};

/** The markets whose sale needs a signed safety assessment, in the order findings list them. */
export const ASSESSED_MARKETS = ['EU', 'UK'] as const satisfies readonly ComplianceMarket[];

/** A version as the finding reads it. */
export interface AssessedVersion {
  id: string;
  number: number;
  markets: readonly ComplianceMarket[];
}

/** A version of a formula with a signed assessment. */
export interface SignedVersion {
  formulaId: string;
  versionId: string;
  versionNumber: number;
  assessmentId: string;
}

const REGION: Record<(typeof ASSESSED_MARKETS)[number], string> = { EU: 'EU', UK: 'UK' };

/**
 * The `SAFETY_ASSESSMENT_MISSING` findings of one version, given the formula's signed versions
 * (any order): one per EU or UK market of the version while the version itself has no signed
 * assessment; none once it has. The message names the newest other version that was assessed.
 */
export function missingAssessmentFindings(
  version: AssessedVersion,
  signed: readonly SignedVersion[],
): ComplianceFinding[] {
  if (signed.some((s) => s.versionId === version.id)) return [];
  const markets = ASSESSED_MARKETS.filter((m) => version.markets.includes(m));
  const assessed = signed
    .filter((s) => s.versionId !== version.id)
    .sort((a, b) => b.versionNumber - a.versionNumber)[0];
  const earlier = assessed ? `; version ${assessed.versionNumber} was assessed` : '';
  return markets.map((market) => ({
    code: 'SAFETY_ASSESSMENT_MISSING',
    severity: 'warn',
    market,
    subject: `Version ${version.number}`,
    message:
      `Version ${version.number} has no signed safety assessment${earlier}. ` +
      'An assessment covers one exact version, so a changed formula needs its own. ' +
      `A qualified safety assessor must assess and sign this version before it is sold in the ${REGION[market]}.`,
    source: ASSESSMENT_SOURCES[market],
    // Art. 10(1) read at legislation.gov.uk (eur/2009/1223/article/10): confirmed in the text.
    status: 'C',
    lines: [],
  }));
}

/** The signed assessments of the given formulas' versions, in one query, newest version first. */
export async function signedVersions(
  db: Database,
  workshopId: string,
  formulaIds: readonly string[],
): Promise<SignedVersion[]> {
  if (formulaIds.length === 0) return [];
  return db
    .select({
      formulaId: formulaVersions.formulaId,
      versionId: assessments.versionId,
      versionNumber: formulaVersions.number,
      assessmentId: assessments.id,
    })
    .from(assessments)
    .innerJoin(
      formulaVersions,
      and(
        eq(formulaVersions.workshopId, assessments.workshopId),
        eq(formulaVersions.id, assessments.versionId),
      ),
    )
    .where(
      and(
        eq(assessments.workshopId, workshopId),
        eq(assessments.status, 'signed'),
        inArray(formulaVersions.formulaId, [...new Set(formulaIds)]),
      ),
    )
    .orderBy(desc(formulaVersions.number));
}

/** Signed versions grouped by formula. */
export function byFormula(signed: readonly SignedVersion[]): Map<string, SignedVersion[]> {
  const map = new Map<string, SignedVersion[]>();
  for (const s of signed) map.set(s.formulaId, [...(map.get(s.formulaId) ?? []), s]);
  return map;
}

/**
 * What one version of a formula of the caller's workshop lacks in safety assessment: a
 * `SAFETY_ASSESSMENT_MISSING` warning per EU or UK market it is made for, while it has no signed
 * assessment. Shown beside the version's evaluation and on its labels, never counted with it.
 */
export async function assessmentFindings(
  db: Database,
  workshopId: string,
  formulaId: string,
  version: AssessedVersion,
): Promise<ComplianceFinding[]> {
  if (!ASSESSED_MARKETS.some((m) => version.markets.includes(m))) return [];
  return missingAssessmentFindings(version, await signedVersions(db, workshopId, [formulaId]));
}
