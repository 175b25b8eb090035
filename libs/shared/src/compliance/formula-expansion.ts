import type { EvaluationInput } from './evaluation-input-schema';
import { fragranceWordOf, isColourantFunction, type FragranceWord } from './ingredient-names';

/** One ingredient of the finished product: a line's material, or one component of a blend line. */
export interface ExpandedIngredient {
  /** Index of the formula line it comes from. */
  readonly line: number;
  /** Name of the material on that line. */
  readonly materialName: string;
  readonly inci: string;
  readonly usName: string | undefined;
  readonly colourIndex: string | undefined;
  /** CAS number, when the material or component gives one. */
  readonly cas: string | undefined;
  /** Whether it is a nanomaterial (named with "(nano)" in EU/UK lists). */
  readonly nano: boolean;
  readonly functions: readonly string[];
  /** Grams in the batch. */
  readonly grams: number;
  /** Percent of the finished product. */
  readonly percent: number;
  /** Whether it is a colourant (has a CI number or a colourant function). */
  readonly isColourant: boolean;
  /** Whether it is a fragrance/flavour designation rather than a named substance. */
  readonly fragranceWord: FragranceWord | null;
  /** Whether it may be left off the declaration (incidental ingredient). */
  readonly incidental: boolean;
}

/** A formula expanded into what the finished product contains. */
export interface ExpandedFormula {
  readonly totalGrams: number;
  readonly lines: { index: number; name: string; grams: number; percent: number }[];
  /** Ingredients with a positive weight, blends expanded into components, in line order. */
  readonly ingredients: ExpandedIngredient[];
}

/** Expands blends into their components and works out each line's and ingredient's share. */
export function expandFormula(input: Pick<EvaluationInput, 'lines'>): ExpandedFormula {
  const totalGrams = input.lines.reduce((sum, line) => sum + line.grams, 0);
  const lines = input.lines.map((line, index) => ({
    index,
    name: line.material.name,
    grams: line.grams,
    percent: (line.grams / totalGrams) * 100,
  }));
  const ingredients: ExpandedIngredient[] = [];
  input.lines.forEach((line, index) => {
    if (line.grams <= 0) return;
    const { material } = line;
    const parts = material.components ?? [
      {
        inci: material.inci,
        usName: material.usName,
        colourIndex: material.colourIndex,
        cas: material.cas,
        nano: material.nano,
        functions: material.functions,
        percent: 100,
        incidental: material.incidental,
      },
    ];
    for (const part of parts) {
      const grams = (line.grams * part.percent) / 100;
      const functions = part.functions ?? (material.components ? [] : material.functions);
      ingredients.push({
        line: index,
        materialName: material.name,
        inci: part.inci,
        usName: part.usName,
        colourIndex: part.colourIndex,
        cas: part.cas,
        nano: Boolean(part.nano),
        functions,
        grams,
        percent: (grams / totalGrams) * 100,
        isColourant: part.colourIndex !== undefined || isColourantFunction(functions),
        fragranceWord: fragranceWordOf(part.inci),
        incidental: Boolean(part.incidental || material.incidental),
      });
    }
  });
  return { totalGrams, lines, ingredients };
}
