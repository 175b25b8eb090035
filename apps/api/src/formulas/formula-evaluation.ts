import {
  evaluateWithSubstitutes,
  todayIso,
  type ProductProfile,
  type ProductType,
} from '@batchproof/shared';
import { AppError } from '../core/app-error';
import type { Database } from '../db/database';
import { findMaterials } from '../materials/materials-repository';
import type { EvaluationFields } from './formulas-repository';

/** A line by weight, as stored, with its approved substitutes' material ids. */
export interface GramLine {
  materialId: string;
  grams: number;
  substitutes?: readonly string[] | undefined;
}

/** Stored lines (`findLines`) as the lines {@link evaluateLines} reads. */
export const gramLines = (
  lines: readonly { materialId: string; grams: number; substitutes: { materialId: string }[] }[],
): GramLine[] =>
  lines.map((l) => ({
    materialId: l.materialId,
    grams: l.grams,
    substitutes: l.substitutes.map((s) => s.materialId),
  }));

/**
 * Loads the lines' materials and their substitutes' from the caller's workshop. A material id that
 * is unknown here (deleted, mistyped or another workshop's) is a field error on that line or
 * substitute, never a leak.
 */
export async function loadLineMaterials(db: Database, workshopId: string, lines: GramLine[]) {
  const ids = [...new Set(lines.flatMap((l) => [l.materialId, ...(l.substitutes ?? [])]))];
  const rows = await findMaterials(db, workshopId, ids);
  const byId = new Map(rows.map((m) => [m.id, m]));
  const fieldErrors: Record<string, string[]> = {};
  const unknown = ['Choose one of this workshop’s materials'];
  lines.forEach((l, i) => {
    if (!byId.has(l.materialId)) fieldErrors[`lines.${i}.materialId`] = unknown;
    l.substitutes?.forEach((id, j) => {
      if (!byId.has(id)) fieldErrors[`lines.${i}.substitutes.${j}`] = unknown;
    });
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
 * `evaluateWithSubstitutes` (`prepareEvaluation` and the engine, once more per approved
 * substitute), the same path the editor's live check takes in the browser. When the draft cannot
 * be checked yet (no lines, 0 g, a market missing) the evaluation is null and the reasons are
 * kept, so a draft can still be saved; a substitute that cannot be checked is such a reason too,
 * beside the evaluation of the rest.
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
  const checked = evaluateWithSubstitutes(
    {
      // Rules with effective dates are checked as of the day of saving (the shared calendar day).
      asOf: todayIso(now),
      productName: formula.name,
      productType: formula.productType,
      profile,
      lines: lines.map((l) => ({ grams: l.grams, material: materials.get(l.materialId)! })),
    },
    lines.flatMap((l, lineIndex) =>
      (l.substitutes ?? []).map((materialId) => ({
        lineIndex,
        lineNumber: lineIndex + 1,
        materialId,
        material: materials.get(materialId)!,
      })),
    ),
  );
  if (!checked.ok) {
    return {
      evaluation: null,
      blockCount: null,
      warnCount: null,
      infoCount: null,
      evaluationProblems: checked.problems,
      evaluatedAt: now,
    };
  }
  const evaluation = checked.result;
  const countOf = (s: string) => evaluation.findings.filter((f) => f.severity === s).length;
  return {
    evaluation,
    blockCount: countOf('block'),
    warnCount: countOf('warn'),
    infoCount: countOf('info'),
    evaluationProblems: checked.problems,
    evaluatedAt: now,
  };
}
