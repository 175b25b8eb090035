import {
  compareVersions,
  scaleFormula,
  type FormulaListQuery,
  type FormulaVersion,
  type ScaledVersion,
  type scaleRequestSchema,
} from '@batchproof/shared';
import type { z } from 'zod';
import type { AuthUser } from '../auth/authenticate';
import { AppError, notFound } from '../core/app-error';
import { withIsoDates } from '../core/list-paging';
import type { Database } from '../db/database';
import { assessmentFindings } from '../readiness/assessment-findings';
import * as repo from './formulas-repository';

const iso = (d: Date | null) => (d ? d.toISOString() : null);

/** A stored version with its lines, percentages and evaluation, in the API shape. */
export async function versionView(
  db: Database,
  workshopId: string,
  row: repo.VersionRow,
): Promise<FormulaVersion> {
  // One after the other: `db` may be a transaction, which runs one query at a time.
  const lines = await repo.findLines(db, workshopId, row.id);
  const missingAssessment = await assessmentFindings(db, workshopId, row.formulaId, {
    id: row.id,
    number: row.number,
    markets: row.profile.markets,
  });
  const totalGrams = lines.reduce((s, l) => s + l.grams, 0);
  return {
    id: row.id,
    formulaId: row.formulaId,
    number: row.number,
    state: row.state,
    lines: lines.map((l) => ({ ...l, percent: totalGrams > 0 ? (l.grams / totalGrams) * 100 : 0 })),
    totalGrams,
    profile: row.profile,
    notes: row.notes,
    evaluation: row.evaluation,
    counts:
      row.blockCount === null
        ? null
        : { block: row.blockCount, warn: row.warnCount ?? 0, info: row.infoCount ?? 0 },
    evaluationProblems: row.evaluationProblems,
    evaluatedAt: iso(row.evaluatedAt),
    releasedAt: iso(row.releasedAt),
    overrideReason: row.overrideReason,
    assessmentFindings: missingAssessment,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

/** A page of the caller's workshop's formulas. */
export async function listFormulas(db: Database, actor: AuthUser, q: FormulaListQuery) {
  const { items, total } = await repo.pageFormulas(db, actor.workshopId, q);
  return { items: items.map(withIsoDates), total, page: q.page, pageSize: q.pageSize };
}

/** A formula with its version history; 404 for another workshop's. */
export async function getFormula(db: Database, actor: AuthUser, id: string) {
  const formula = await repo.findFormula(db, actor.workshopId, id);
  if (!formula) throw notFound('That formula');
  const versions = await repo.listVersionSummaries(db, actor.workshopId, id);
  return {
    id: formula.id,
    name: formula.name,
    productType: formula.productType,
    notes: formula.notes,
    archivedAt: iso(formula.archivedAt),
    createdAt: formula.createdAt.toISOString(),
    updatedAt: formula.updatedAt.toISOString(),
    versions: versions.map((v) => ({
      number: v.number,
      state: v.state,
      counts:
        v.blockCount === null
          ? null
          : { block: v.blockCount, warn: v.warnCount ?? 0, info: v.infoCount ?? 0 },
      releasedAt: iso(v.releasedAt),
      updatedAt: v.updatedAt.toISOString(),
    })),
  };
}

/** Finds a version of a formula of the caller's workshop, or 404. */
export async function requireVersion(db: Database, actor: AuthUser, formulaId: string, n: number) {
  const row = await repo.findVersion(db, actor.workshopId, formulaId, n);
  if (!row) throw notFound(`Version ${n} of that formula`);
  return row;
}

export async function getVersion(db: Database, actor: AuthUser, formulaId: string, n: number) {
  return versionView(db, actor.workshopId, await requireVersion(db, actor, formulaId, n));
}

/** Line, declaration and finding changes between two versions of one formula. */
export async function compare(
  db: Database,
  actor: AuthUser,
  formulaId: string,
  from: number,
  to: number,
) {
  const [a, b] = await Promise.all([
    getVersion(db, actor, formulaId, from),
    getVersion(db, actor, formulaId, to),
  ]);
  return compareVersions(a, b);
}

/**
 * Scales a version to a number of units (unit mass from the request, else the profile) or to a
 * total mass, with a loss allowance, through the shared `scaleFormula`.
 */
export async function scale(
  db: Database,
  actor: AuthUser,
  formulaId: string,
  n: number,
  request: z.output<typeof scaleRequestSchema>,
): Promise<ScaledVersion> {
  const version = await getVersion(db, actor, formulaId, n);
  if (version.totalGrams <= 0) {
    throw new AppError(409, 'conflict', 'This version weighs 0 g; add lines before scaling.');
  }
  let units = 1;
  let unitGrams = request.totalGrams ?? 0;
  if (request.units !== undefined) {
    const mass = request.unitMassGrams ?? version.profile.unitMassGrams;
    if (!mass) {
      throw new AppError(400, 'validation_failed', 'Some fields need attention.', {
        unitMassGrams: ['Enter the unit mass, or set it on the version’s product profile'],
      });
    }
    units = request.units;
    unitGrams = mass;
  }
  const scaled = scaleFormula(version.lines, {
    units,
    unitGrams,
    lossPercent: request.lossPercent,
  });
  return {
    targetGrams: scaled.targetGrams,
    batchGrams: scaled.batchGrams,
    lossPercent: request.lossPercent,
    lines: scaled.lines.map((l) => ({
      materialId: l.materialId,
      materialName: l.materialName,
      percent: l.percent,
      grams: l.scaledGrams,
    })),
  };
}
