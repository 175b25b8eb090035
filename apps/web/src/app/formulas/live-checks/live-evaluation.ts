import {
  evaluateWithSubstitutes,
  type EvaluationResult,
  type FizzBalance,
  fizzBalance,
  fizzReactants,
  type Material,
  type ProductType,
  type SubstituteSource,
} from '@batchproof/shared';
import { type FormulaFormValue, lineGrams, profileOf } from '../formula-editor/formula-form';
import { isEffervescent } from '../product-types';

/** One line of the composition, as typed. */
export interface CompositionLine {
  name: string;
  grams: number;
  percent: number;
}

/** The editor's live check of what is typed right now. */
export interface LiveEvaluation {
  /** The engine's result, or null while the draft cannot be checked. */
  result: EvaluationResult | null;
  /** Why the draft cannot be checked yet, in plain words. */
  problems: string[];
  /** Whether some lines' materials are still loading. */
  pending: boolean;
  /** Acid/base balance when the product fizzes, else null. */
  fizz: FizzBalance | null;
  composition: CompositionLine[];
  totalGrams: number;
}

/**
 * Runs the shared compliance engine on the editor's current value through
 * `evaluateWithSubstitutes` (once for the formula, once more per approved substitute), the same
 * path the server takes on save, with the profile as it would be saved. Lines without a chosen
 * material are left out (and said so); nothing here throws on half-typed input.
 */
export function evaluateDraft(
  value: FormulaFormValue,
  materials: ReadonlyMap<string, Material>,
  asOf: string,
): LiveEvaluation {
  const grams = lineGrams(value);
  const problems: string[] = [];
  let pending = false;
  const lines: { grams: number; material: Material }[] = [];
  const substitutes: SubstituteSource[] = [];
  value.lines.forEach((line, i) => {
    if (!line.materialId) {
      problems.push(`Line ${i + 1} has no material yet: choose one from the list.`);
      return;
    }
    const material = materials.get(line.materialId);
    if (!material) {
      pending = true;
      return;
    }
    for (const { materialId } of line.substitutes) {
      const substitute = materials.get(materialId);
      if (substitute)
        substitutes.push({
          lineIndex: lines.length,
          lineNumber: i + 1,
          materialId,
          material: substitute,
        });
      else pending = true;
    }
    lines.push({ grams: grams[i]!, material });
  });

  const totalGrams = lines.reduce((s, l) => s + l.grams, 0);
  const composition = lines.map((l) => ({
    name: l.material.tradeName,
    grams: l.grams,
    percent: totalGrams > 0 ? (l.grams / totalGrams) * 100 : 0,
  }));
  const fizz = fizzFor(value.productType, lines);

  const checked = evaluateWithSubstitutes(
    {
      asOf,
      productName: value.name,
      productType: value.productType,
      profile: profileOf(value),
      lines,
    },
    substitutes,
  );
  problems.push(...checked.problems);
  if (!checked.ok) return { result: null, problems, pending, fizz, composition, totalGrams };
  return {
    result: checked.result,
    problems,
    pending,
    fizz,
    composition,
    totalGrams,
  };
}

function fizzFor(
  type: ProductType,
  lines: readonly { grams: number; material: Material }[],
): FizzBalance | null {
  const balance = fizzBalance(
    lines.map((l) => ({ inci: l.material.inci, name: l.material.tradeName, grams: l.grams })),
  );
  const hasAcid = balance.reactants.some(
    (r) => fizzReactants.find((f) => f.id === r.reactant)?.role === 'acid',
  );
  return isEffervescent(type, hasAcid) ? balance : null;
}
