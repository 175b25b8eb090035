// Typed builders for the compliance specs (invented example data only). Not part of the public API.
import {
  evaluationInputSchema,
  type EvaluationInput,
  type EvaluationInputDraft,
} from './evaluation-input-schema';

type Draft = EvaluationInputDraft;
type LineDraft = Draft['lines'][number];
type MaterialDraft = LineDraft['material'];
type ProductDraft = Draft['product'];

/** A bath bomb: rinse-off, in the bath, IFRA Category 9, not adults-only. */
export function aBathBomb(overrides: Partial<ProductDraft> = {}): ProductDraft {
  return {
    name: 'Moonlit Fizz',
    use: 'rinse-off',
    contact: { mucousMembranes: false, eyeArea: false, lips: false },
    inBath: true,
    adultsOnly: false,
    ifraCategory: '9',
    ...overrides,
  };
}

/** A body lotion: leave-on, not in the bath, IFRA Category 5A. */
export function aBodyLotion(overrides: Partial<ProductDraft> = {}): ProductDraft {
  return {
    ...aBathBomb(),
    name: 'Meadow Lotion',
    use: 'leave-on',
    inBath: false,
    ifraCategory: '5A',
    ...overrides,
  };
}

/** A lip balm: leave-on, lips. */
export function aLipBalm(overrides: Partial<ProductDraft> = {}): ProductDraft {
  return {
    ...aBathBomb(),
    name: 'Pebble Lip Balm',
    use: 'leave-on',
    inBath: false,
    ifraCategory: '1',
    contact: { mucousMembranes: false, eyeArea: false, lips: true },
    ...overrides,
  };
}

/** A plain material line. */
export function aLine(
  grams: number,
  inci: string,
  material: Partial<MaterialDraft> = {},
): LineDraft {
  return { grams, material: { name: material.name ?? inci, inci, functions: [], ...material } };
}

/** A colourant line with its CI number. */
export function aColourLine(
  grams: number,
  inci: string,
  colourIndex: string,
  material: Partial<MaterialDraft> = {},
): LineDraft {
  return aLine(grams, inci, { functions: ['colourant'], colourIndex, ...material });
}

/** A fragrance oil line with IFRA maxima and allergens (percent of the oil). */
export function aFragranceLine(
  grams: number,
  name: string,
  maxima: Record<string, number>,
  allergens: { inci: string; cas?: string; percent: number }[] = [],
): LineDraft {
  return aLine(grams, 'Parfum', {
    name,
    functions: ['fragrance'],
    fragrance: { maxPercentByIfraCategory: maxima, allergens },
  });
}

/** A parsed evaluation input; throws if the draft is invalid so a spec fails loudly. */
export function aFormula(
  lines: LineDraft[],
  product: ProductDraft = aBathBomb(),
  extra: Partial<Draft> = {},
): EvaluationInput {
  return evaluationInputSchema.parse({
    asOf: '2026-09-01',
    markets: ['US', 'EU', 'UK', 'CA'],
    product,
    lines,
    ...extra,
  });
}
