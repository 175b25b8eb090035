import type { ReferenceRow } from './reference-row';

/**
 * An ingredient whose EU glossary (INCI) name is Latin or EU-only while US labels use a different
 * name: the US ingredient declaration takes the name in the order of 21 CFR 701.3 (an FDA-established
 * name in 701.30, else the name in the Personal Care Products Council's International Cosmetic
 * Ingredient Dictionary, the former CTFA dictionary, else a consumer name), and that dictionary gives
 * the US name for these entries.
 */
export interface UsLabelName extends ReferenceRow {
  /** The EU glossary / INCI name, as printed on EU labels. */
  readonly euName: string;
  /** The name to print on a US label. */
  readonly usName: string;
}

/** The US dictionary convention, not read here (the dictionary is not public). */
const INCI_US = 'International Cosmetic Ingredient Dictionary (PCPC), US/EU name convention';

/**
 * EU-only ingredient names and the US name to print instead. Colour additives are not listed here:
 * a CI number is replaced by the FDA listed name from the US colour additive list. Only the Parfum and
 * Aroma rows rest on text read (21 CFR 701.3(a); Art. 19(1)(g)); the rest are from memory and warn.
 */
export const usLabelNames: readonly UsLabelName[] = [
  {
    id: 'us-name-parfum',
    euName: 'Parfum',
    usName: 'Fragrance',
    source: '21 CFR 701.3(a); Regulation (EC) No 1223/2009, Art. 19(1)(g)',
    status: 'C2',
    note: '701.3(a): "fragrance or flavor may be listed as fragrance or flavor" (C); the EU term "parfum" confirmed secondarily (C2).',
  },
  {
    id: 'us-name-aroma',
    euName: 'Aroma',
    usName: 'Flavor',
    source: '21 CFR 701.3(a); Regulation (EC) No 1223/2009, Art. 19(1)(g)',
    status: 'C2',
    note: '701.3(a): "fragrance or flavor may be listed as fragrance or flavor" (C); the EU term "aroma" confirmed secondarily (C2).',
  },
  {
    id: 'us-name-aqua',
    euName: 'Aqua',
    usName: 'Water',
    source: INCI_US,
    status: 'M',
    note: 'Many labels print "Water (Aqua)" or "Aqua/Water" to serve both markets.',
  }, // from memory
  {
    id: 'us-name-cera-alba',
    euName: 'Cera Alba',
    usName: 'Beeswax',
    source: INCI_US,
    status: 'M',
  }, // from memory
  {
    id: 'us-name-paraffinum-liquidum',
    euName: 'Paraffinum Liquidum',
    usName: 'Mineral Oil',
    source: INCI_US,
    status: 'M',
  }, // from memory
  {
    id: 'us-name-cera-microcristallina',
    euName: 'Cera Microcristallina',
    usName: 'Microcrystalline Wax',
    source: INCI_US,
    status: 'M',
  }, // from memory
  {
    id: 'us-name-mel',
    euName: 'Mel',
    usName: 'Honey',
    source: INCI_US,
    status: 'M',
  }, // from memory
  {
    id: 'us-name-mel-extract',
    euName: 'Mel Extract',
    usName: 'Honey Extract',
    source: INCI_US,
    status: 'M',
  }, // from memory
  {
    id: 'us-name-lac',
    euName: 'Lac',
    usName: 'Milk',
    source: INCI_US,
    status: 'M',
    note: 'Goat milk soap: the dictionary also has species-specific entries; use the name on the supplier document.',
  }, // from memory
  {
    id: 'us-name-lactis-proteinum',
    euName: 'Lactis Proteinum',
    usName: 'Milk Protein',
    source: INCI_US,
    status: 'M',
  }, // from memory
  {
    id: 'us-name-lactis-lipida',
    euName: 'Lactis Lipida',
    usName: 'Milk Lipids',
    source: INCI_US,
    status: 'M',
  }, // from memory
  {
    id: 'us-name-maris-sal',
    euName: 'Maris Sal',
    usName: 'Sea Salt',
    source: INCI_US,
    status: 'M',
  }, // from memory
  {
    id: 'us-name-maris-aqua',
    euName: 'Maris Aqua',
    usName: 'Sea Water',
    source: INCI_US,
    status: 'M',
  }, // from memory
  {
    id: 'us-name-solum-diatomeae',
    euName: 'Solum Diatomeae',
    usName: 'Diatomaceous Earth',
    source: INCI_US,
    status: 'M',
  }, // from memory
  {
    id: 'us-name-propolis-cera',
    euName: 'Propolis Cera',
    usName: 'Propolis Wax',
    source: INCI_US,
    status: 'M',
  }, // from memory
  {
    id: 'us-name-lanolin-cera',
    euName: 'Lanolin Cera',
    usName: 'Lanolin Wax',
    source: INCI_US,
    status: 'M',
  }, // from memory
  {
    id: 'us-name-ovum',
    euName: 'Ovum',
    usName: 'Egg',
    source: INCI_US,
    status: 'M',
  }, // from memory
  {
    id: 'us-name-alcohol-denat',
    euName: 'Alcohol Denat.',
    usName: 'SD Alcohol',
    source: `${INCI_US}; US specially denatured alcohol formulas (27 CFR Part 21, from memory)`,
    status: 'M',
    note: 'US labels name the formula, e.g. "SD Alcohol 40-B"; take the formula number from the supplier. Plain undenatured ethanol is "Alcohol" in both.',
  }, // from memory
];
