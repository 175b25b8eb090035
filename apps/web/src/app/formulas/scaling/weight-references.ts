import type { KitchenMeasure, Material } from '@batchproof/shared';

/** Measures in words. */
export const MEASURE_NAMES: Record<KitchenMeasure, string> = {
  cup: 'cups',
  tablespoon: 'tablespoons',
  teaspoon: 'teaspoons',
  'fluid-ounce': 'fluid ounces',
  millilitre: 'millilitres',
  drop: 'drops',
};

/** A known weight of one measure of a material, and where it comes from. */
export interface WeightReference {
  key: string;
  unit: KitchenMeasure;
  /** Grams in one of `unit`. */
  grams: number;
  /** How it reads in the select, e.g. "1 cup = 238 g, your 3 weighings (spread 6 %)". */
  label: string;
}

const singular = (unit: KitchenMeasure) => MEASURE_NAMES[unit].replace(/s$/, '');

/**
 * The weights per volume a material carries: the maker's own calibrations (average, with their
 * spread) first, as they were weighed on the maker's own scoops, then the specification values.
 */
export function weightReferences(m: Material): WeightReference[] {
  const own = m.calibrationSummary.map((c) => ({
    key: `own:${c.unit}`,
    unit: c.unit,
    grams: c.averageGrams,
    label: `1 ${singular(c.unit)} = ${c.averageGrams} g, your ${c.count} weighing${
      c.count === 1 ? '' : 's'
    } (spread ${c.spreadPercent} %)`,
  }));
  const spec = Object.entries(m.weightPerVolume).map(([unit, grams]) => ({
    key: `spec:${unit}`,
    unit: unit as KitchenMeasure,
    grams: grams!,
    label: `1 ${singular(unit as KitchenMeasure)} = ${grams} g (material record)`,
  }));
  return [...own, ...spec];
}
