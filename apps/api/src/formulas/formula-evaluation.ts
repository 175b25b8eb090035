import {
  evaluateFormula,
  prepareEvaluation,
  todayIso,
  type ProductProfile,
  type ProductType,
} from '@batchproof/shared';
import { AppError } from '../core/app-error';
import type { Database } from '../db/database';
import { findMaterials } from '../materials/materials-repository';
import type { EvaluationFields } from './formulas-repository';

/** A line by weight, as stored. */
export interface GramLine {
  materialId: string;
  grams: number;
}

/**
 * Loads the lines' materials from the caller's workshop. A material id that is unknown here
 * (deleted, mistyped or another workshop's) is a field error on that line, never a leak.
 */
export async function loadLineMaterials(db: Database, workshopId: string, lines: GramLine[]) {
  const ids = [...new Set(lines.map((l) => l.materialId))];
  const rows = await findMaterials(db, workshopId, ids);
  const byId = new Map(rows.map((m) => [m.id, m]));
  const fieldErrors: Record<string, string[]> = {};
  lines.forEach((l, i) => {
    if (!byId.has(l.materialId)) {
      fieldErrors[`lines.${i}.materialId`] = ['Choose one of this workshop’s materials'];
    }
  });
  if (Object.keys(fieldErrors).length > 0) {
    throw new AppError(
      400,
      'validation_failed',
      'Some lines name an unknown material.',
      fieldErrors,
    );
  }
  return byId;
}

/** The formula a version belongs to, as far as the check reads it. */
export interface EvaluatedFormula {
  name: string;
  productType: ProductType;
}

/**
 * Runs the shared compliance engine on stored lines and the product profile through
 * `prepareEvaluation`, the same builder the editor's live check uses in the browser. When the
 * draft cannot be checked yet (no lines, 0 g, a market missing) the evaluation is null and the
 * reasons are kept, so a draft can still be saved.
 */
export async function evaluateLines(
  db: Database,
  workshopId: string,
  formula: EvaluatedFormula,
  lines: GramLine[],
  profile: ProductProfile,
  now = new Date(),
): Promise<EvaluationFields> {
  const materials = await loadLineMaterials(db, workshopId, lines);
  const prepared = prepareEvaluation({
    // Rules with effective dates are checked as of the day of saving (the shared calendar day).
    asOf: todayIso(now),
    productName: formula.name,
    productType: formula.productType,
    profile,
    lines: lines.map((l) => ({ grams: l.grams, material: materials.get(l.materialId)! })),
  });
  if (!prepared.ok) {
    return {
      evaluation: null,
      blockCount: null,
      warnCount: null,
      infoCount: null,
      evaluationProblems: prepared.problems,
      evaluatedAt: now,
    };
  }
  const evaluation = evaluateFormula(prepared.input);
  const countOf = (s: string) => evaluation.findings.filter((f) => f.severity === s).length;
  return {
    evaluation,
    blockCount: countOf('block'),
    warnCount: countOf('warn'),
    infoCount: countOf('info'),
    evaluationProblems: [],
    evaluatedAt: now,
  };
}
