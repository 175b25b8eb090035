import * as z from 'zod';
import type { KitchenMeasure } from '../compliance/volume-to-grams';
import { kitchenMeasureSchema } from '../compliance/volume-to-grams';

/** Average and spread of a material's calibrations for one measure. */
export const calibrationSummarySchema = z.object({
  unit: kitchenMeasureSchema,
  count: z.number().int(),
  /** Mean grams in one of the measure. */
  averageGrams: z.number(),
  minGrams: z.number(),
  maxGrams: z.number(),
  /** Sample standard deviation of grams per measure; 0 with a single calibration. */
  standardDeviationGrams: z.number(),
  /** (max − min) / average, percent: how much scooping varies. */
  spreadPercent: z.number(),
});
export type CalibrationSummary = z.infer<typeof calibrationSummarySchema>;

const round = (n: number, places = 3) => Math.round(n * 10 ** places) / 10 ** places;

/**
 * Sums up the maker's calibrations per measure: each calibration becomes grams per one measure,
 * then average, range and standard deviation. Scooped volumes vary, which is why the spread
 * is shown next to the average rather than hidden.
 */
export function summariseCalibrations(
  calibrations: readonly { unit: KitchenMeasure; amount: number; grams: number }[],
): CalibrationSummary[] {
  const byUnit = new Map<KitchenMeasure, number[]>();
  for (const c of calibrations) {
    const list = byUnit.get(c.unit) ?? [];
    list.push(c.grams / c.amount);
    byUnit.set(c.unit, list);
  }
  return [...byUnit.entries()].map(([unit, values]) => {
    const average = values.reduce((s, v) => s + v, 0) / values.length;
    const min = Math.min(...values);
    const max = Math.max(...values);
    const variance =
      values.length > 1
        ? values.reduce((s, v) => s + (v - average) ** 2, 0) / (values.length - 1)
        : 0;
    return {
      unit,
      count: values.length,
      averageGrams: round(average),
      minGrams: round(min),
      maxGrams: round(max),
      standardDeviationGrams: round(Math.sqrt(variance)),
      spreadPercent: average > 0 ? round(((max - min) / average) * 100, 1) : 0,
    };
  });
}
