import type { ComplianceMarket } from '../reference-data/reference-row';
import type { Declaration } from './evaluation-result-schema';
import type { ExpandedIngredient } from './formula-expansion';
import { usLabelNames } from '../reference-data/us-label-names';
import { baseColourIndex, compareColourIndex, normaliseName } from './ingredient-names';

const usNameForEuName = new Map(usLabelNames.map((row) => [normaliseName(row.euName), row.usName]));

/**
 * The US common name for an EU glossary name that has one (Aqua → Water, Cera Alba → Beeswax), so a
 * Latin glossary name is never printed on a US label without its US name (21 CFR 701.3(c), 701.30).
 */
export function usCommonName(name: string): string {
  return usNameForEuName.get(normaliseName(name)) ?? name;
}

/** A fragrance allergen the label must name, with the grams that arrive through fragrances. */
export interface AllergenAddition {
  readonly name: string;
  readonly grams: number;
}

/** Tolerance for percent comparisons, so float noise (1.0000000002 %) does not move a boundary. */
const EPSILON = 1e-9;

/**
 * Label name of an ingredient in a market.
 * US (21 CFR 701.3): the US name where given, else the listed colour additive name (with its lake
 * designation), else INCI with any EU-only glossary name replaced by its US name; fragrance as
 * "Fragrance" (701.3(a)). EU/UK (Art. 19(1)(g)) and CA: INCI; colourants by CI number; fragrance as
 * "Parfum", flavour as "Aroma"; in the EU/UK a nanomaterial is followed by "(nano)" (Art. 19(1)(g)).
 */
export function labelNameFor(
  market: ComplianceMarket,
  ingredient: ExpandedIngredient,
  usListedName: string | undefined,
): string {
  if (market === 'US') {
    if (ingredient.fragranceWord === 'fragrance') return 'Fragrance';
    if (ingredient.fragranceWord === 'flavour') return 'Flavor';
    if (ingredient.usName !== undefined) return ingredient.usName;
    if (ingredient.isColourant && usListedName !== undefined) return usListedName;
    return usCommonName(ingredient.inci);
  }
  if (ingredient.fragranceWord === 'fragrance') return 'Parfum';
  if (ingredient.fragranceWord === 'flavour') return 'Aroma';
  const name =
    ingredient.isColourant && ingredient.colourIndex !== undefined
      ? `CI ${baseColourIndex(ingredient.colourIndex)}`
      : ingredient.inci;
  return ingredient.nano && (market === 'EU' || market === 'UK') ? `${name} (nano)` : name;
}

interface Entry {
  name: string;
  grams: number;
  colourant: boolean;
  colourIndex: string | undefined;
}

/**
 * Builds a market's ingredient declaration. Blends arrive already expanded; the same label name
 * arriving through several lines is declared once with its summed weight; incidental ingredients are
 * left off (21 CFR 701.3(l)). Ingredients are ordered by weight. The "any order" group is ≤ 1 % in the
 * US (701.3(f)(2): "not more than 1 percent") and < 1 % in the EU/UK (Art. 19(1)(g)); Batchproof
 * keeps that group descending too. Colourants come last: in the US in any order (701.3(f)(3), kept by
 * weight), in the EU/UK/CA by CI number.
 */
export function buildDeclaration(
  market: ComplianceMarket,
  ingredients: readonly ExpandedIngredient[],
  totalGrams: number,
  usListedNames: ReadonlyMap<ExpandedIngredient, string>,
  allergenAdditions: readonly AllergenAddition[] = [],
): Declaration {
  const entries = new Map<string, Entry>();
  const add = (
    name: string,
    grams: number,
    colourant: boolean,
    colourIndex: string | undefined,
  ) => {
    const key = normaliseName(name);
    const entry = entries.get(key);
    if (entry) {
      entry.grams += grams;
      entry.colourant ||= colourant;
      entry.colourIndex ??= colourIndex;
    } else entries.set(key, { name, grams, colourant, colourIndex });
  };
  for (const ingredient of ingredients) {
    if (ingredient.incidental) continue;
    const name = labelNameFor(market, ingredient, usListedNames.get(ingredient));
    add(name, ingredient.grams, ingredient.isColourant, ingredient.colourIndex);
  }
  for (const allergen of allergenAdditions) add(allergen.name, allergen.grams, false, undefined);

  const byWeight = (a: Entry, b: Entry) => b.grams - a.grams || a.name.localeCompare(b.name);
  const all = [...entries.values()];
  const others = all.filter((e) => !e.colourant).sort(byWeight);
  const colourants = all.filter((e) => e.colourant);
  if (market === 'US') colourants.sort(byWeight);
  else
    colourants.sort((a, b) => {
      if (a.colourIndex && b.colourIndex)
        return compareColourIndex(a.colourIndex, b.colourIndex) || a.name.localeCompare(b.name);
      if (a.colourIndex) return -1;
      if (b.colourIndex) return 1;
      return a.name.localeCompare(b.name);
    });

  const percentOf = (e: Entry) => (e.grams / totalGrams) * 100;
  // US and (from memory) Canada: the free group is "not more than 1 percent"; EU/UK: "less than 1 %".
  const inAnyOrderGroup =
    market === 'US' || market === 'CA'
      ? (e: Entry) => percentOf(e) <= 1 + EPSILON
      : (e: Entry) => percentOf(e) < 1 - EPSILON;
  const ordered = others.filter((e) => !inAnyOrderGroup(e)).map((e) => e.name);
  const anyOrder = others.filter(inAnyOrderGroup).map((e) => e.name);
  const colourantNames = colourants.map((e) => e.name);
  const names = [...ordered, ...anyOrder, ...colourantNames];
  const heading = market === 'CA' ? 'Ingredients/Ingrédients' : 'Ingredients';
  return {
    ingredients: names,
    text: names.length > 0 ? `${heading}: ${names.join(', ')}.` : '',
    groups: { ordered, anyOrder, colourants: colourantNames },
  };
}
