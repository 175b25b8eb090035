import * as z from 'zod';
import { US_UNITS } from './us-customary-units';

/** Kitchen and lab measures {@link volumeToGrams} converts. US customary measures per NIST. */
export const kitchenMeasureSchema = z.enum([
  'cup',
  'tablespoon',
  'teaspoon',
  'fluid-ounce',
  'millilitre',
  'drop',
]);
/** A kitchen or lab measure. */
export type KitchenMeasure = z.infer<typeof kitchenMeasureSchema>;

/** A drop, millilitres: common practice, no published source. Droppers and liquids vary widely. */
export const DROP_MILLILITRES = 0.05;

/** Millilitres in one of each measure (US customary, NIST Handbook 44/133; drop by common practice). */
export const MILLILITRES_PER_MEASURE: Readonly<Record<KitchenMeasure, number>> = {
  cup: US_UNITS.cupMillilitres,
  tablespoon: US_UNITS.tablespoonMillilitres,
  teaspoon: US_UNITS.teaspoonMillilitres,
  'fluid-ounce': US_UNITS.fluidOunceMillilitres,
  millilitre: 1,
  drop: DROP_MILLILITRES,
};

const amountSchema = z.number().gt(0, { error: 'Enter an amount more than 0' });

/** Input of {@link volumeToGrams}. */
export const volumeToGramsInputSchema = z.object({
  amount: amountSchema,
  unit: kitchenMeasureSchema,
  /**
   * The material's weight per volume, as the maker measured it (e.g. 1 cup weighed 240 g) or from
   * its specification (e.g. 0.92 g per 1 mL).
   */
  weightPerVolume: z.object({
    grams: z.number().gt(0, { error: 'Enter the measured grams' }),
    amount: amountSchema,
    unit: kitchenMeasureSchema,
  }),
});
/** Input of {@link volumeToGrams}. */
export type VolumeToGramsInput = z.input<typeof volumeToGramsInputSchema>;

/** Result of {@link volumeToGrams}. */
export interface VolumeToGrams {
  readonly grams: number;
  readonly millilitres: number;
  /** Grams per millilitre the conversion used. */
  readonly gramsPerMillilitre: number;
  /** Always true: volume measures of powders and oils vary with packing and temperature. */
  readonly approximate: true;
  readonly notes: string[];
}

/**
 * Converts a volume measure (cups, tablespoons, teaspoons, fluid ounces, millilitres, drops) to grams
 * through the material's weight per volume. A one-off aid for converting old recipes: weigh, don't scoop.
 * Throws a ZodError with field paths on invalid input.
 */
export function volumeToGrams(input: VolumeToGramsInput): VolumeToGrams {
  const { amount, unit, weightPerVolume } = volumeToGramsInputSchema.parse(input);
  const millilitres = amount * MILLILITRES_PER_MEASURE[unit];
  const gramsPerMillilitre =
    weightPerVolume.grams /
    (weightPerVolume.amount * MILLILITRES_PER_MEASURE[weightPerVolume.unit]);
  const notes = [
    'Approximate: a cup or spoon of powder varies with packing and sifting; weigh the material once and use grams from then on.',
  ];
  if (unit === 'drop' || weightPerVolume.unit === 'drop') {
    notes.push(
      `A drop is taken as ${DROP_MILLILITRES} mL by common practice (no published standard); droppers and oils vary.`,
    );
  }
  return {
    grams: millilitres * gramsPerMillilitre,
    millilitres,
    gramsPerMillilitre,
    approximate: true,
    notes,
  };
}
