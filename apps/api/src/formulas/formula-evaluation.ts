import {
  evaluateFormula,
  evaluationInputSchema,
  materialToEngineInput,
  type ProductProfile,
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

/** Today as YYYY-MM-DD: rules with effective dates are checked as of the day of saving. */
export const today = (now = new Date()) => now.toISOString().slice(0, 10);

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

/**
 * Runs the shared compliance engine on stored lines and the product profile, exactly as the
 * editor does in the browser. When the draft cannot be checked yet (no lines, 0 g, a market
 * missing) the evaluation is null and the reasons are kept, so a draft can still be saved.
 */
export async function evaluateLines(
  db: Database,
  workshopId: string,
  productName: string,
  lines: GramLine[],
  profile: ProductProfile,
  now = new Date(),
): Promise<EvaluationFields> {
  const materials = await loadLineMaterials(db, workshopId, lines);
  const parsed = evaluationInputSchema.safeParse({
    asOf: today(now),
    markets: profile.markets,
    product: {
      name: productName,
      use: profile.use,
      contact: profile.contact,
      inBath: profile.inBath,
      adultsOnly: profile.adultsOnly,
      ifraCategory: profile.ifraCategory,
      ...(profile.netQuantity ? { netQuantity: profile.netQuantity } : {}),
    },
    lines: lines.map((l) => ({
      grams: l.grams,
      material: materialToEngineInput(materials.get(l.materialId)!),
    })),
  });
  if (!parsed.success) {
    return {
      evaluation: null,
      blockCount: null,
      warnCount: null,
      infoCount: null,
      evaluationProblems: [...new Set(parsed.error.issues.map((i) => i.message))],
      evaluatedAt: now,
    };
  }
  const evaluation = evaluateFormula(parsed.data);
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
