import * as z from 'zod';
import { gramsText, roundTo } from './batch-size';

/**
 * Actual weights against the weigh sheet, and finished units against the declared net quantity.
 */

/** Default weighing tolerance, ± percent of the target (common practice, no published source). */
export const DEFAULT_WEIGHING_TOLERANCE_PERCENT = 2;
/** Bounds of the workshop's weighing tolerance setting, percent. */
export const WEIGHING_TOLERANCE_BOUNDS = { min: 0.1, max: 20 } as const;

/** The workshop's weighing tolerance, ± percent of each line's target. */
export const weighingToleranceSchema = z
  .number({ error: 'Enter the weighing tolerance as a percentage' })
  .min(WEIGHING_TOLERANCE_BOUNDS.min, {
    error: `The weighing tolerance must be ${WEIGHING_TOLERANCE_BOUNDS.min} to ${WEIGHING_TOLERANCE_BOUNDS.max} %`,
  })
  .max(WEIGHING_TOLERANCE_BOUNDS.max, {
    error: `The weighing tolerance must be ${WEIGHING_TOLERANCE_BOUNDS.min} to ${WEIGHING_TOLERANCE_BOUNDS.max} %`,
  })
  .default(DEFAULT_WEIGHING_TOLERANCE_PERCENT);

/** One weighed line. */
export interface WeighedLine {
  /** What the maker reads on the sheet, e.g. the material's trade name. */
  readonly name: string;
  readonly targetGrams: number;
  /** The weight entered, or null while the line is not weighed yet. */
  readonly actualGrams: number | null;
}

/** `ok`: within tolerance; `out`: outside it; `not-weighed`: no weight entered yet. */
export type WeighingStatus = 'ok' | 'out' | 'not-weighed';

/** The check of one line. */
export interface WeighingCheck {
  readonly status: WeighingStatus;
  /** (actual − target) / target, percent, to 4 decimals; null when not weighed or the target is 0. */
  readonly deviationPercent: number | null;
  /** A plain sentence when the line needs attention, else null. */
  readonly message: string | null;
}

/**
 * Checks each actual weight against its target at ± `tolerancePercent` (the workshop's setting,
 * 2 % unless set). Exactly at the tolerance is inside it: 510 g against 500 g at 2 % is fine,
 * 510.05 g (2.01 %) is out. The deviation is rounded to 4 decimals before the comparison, so
 * binary noise never moves a line across the edge.
 */
export function checkWeighing(
  lines: readonly WeighedLine[],
  tolerancePercent: number = DEFAULT_WEIGHING_TOLERANCE_PERCENT,
): WeighingCheck[] {
  const tolerance = weighingToleranceSchema.parse(tolerancePercent);
  return lines.map(({ name, targetGrams, actualGrams }): WeighingCheck => {
    if (actualGrams === null)
      return { status: 'not-weighed', deviationPercent: null, message: `${name}: not weighed yet` };
    if (targetGrams === 0)
      return actualGrams === 0
        ? { status: 'ok', deviationPercent: null, message: null }
        : {
            status: 'out',
            deviationPercent: null,
            message: `${name}: ${gramsText(actualGrams)} weighed, but this line is 0 g in the formula`,
          };
    const deviation = roundTo(((actualGrams - targetGrams) / targetGrams) * 100, 4);
    if (Math.abs(deviation) <= tolerance)
      return { status: 'ok', deviationPercent: deviation, message: null };
    const direction = deviation > 0 ? 'over' : 'under';
    return {
      status: 'out',
      deviationPercent: deviation,
      message: `${name}: ${gramsText(actualGrams, 0.01)} weighed against ${gramsText(targetGrams, 0.01)}, ${roundTo(Math.abs(deviation), 2)} % ${direction} (allowed ±${tolerance} %)`,
    };
  });
}

/** The finished units' weights against the declared net quantity. */
export interface UnitWeightCheck {
  readonly count: number;
  readonly averageGrams: number;
  readonly lightestGrams: number;
  /** 1-based positions of the units below the declared net quantity. */
  readonly belowDeclared: number[];
  /** `ok`; `light-units`: some units below but the average is not; `average-below`: the average is below. */
  readonly status: 'ok' | 'light-units' | 'average-below';
  readonly messages: string[];
}

/**
 * Weighed units against the declared net weight. US: single units may vary in good packaging
 * practice, but the average must not fall below the declared quantity and no unit may be
 * unreasonably short (16 CFR 500.25(c), checked; 21 CFR 701.13(q) says the same for cosmetics,
 * from memory). Every light unit is named so the maker can decide what is unreasonable. A net
 * quantity in mL cannot be checked with a scale: the caller passes grams only.
 */
export function checkUnitWeights(
  unitWeightsGrams: readonly number[],
  declaredNetGrams: number,
): UnitWeightCheck {
  if (unitWeightsGrams.length === 0) throw new RangeError('Weigh at least one finished unit');
  if (!(declaredNetGrams > 0))
    throw new RangeError('The declared net quantity must be more than 0 g');
  const count = unitWeightsGrams.length;
  const averageGrams = roundTo(unitWeightsGrams.reduce((s, w) => s + w, 0) / count, 2);
  const lightestGrams = Math.min(...unitWeightsGrams);
  const belowDeclared = unitWeightsGrams.flatMap((w, i) => (w < declaredNetGrams ? [i + 1] : []));
  const messages: string[] = [];
  const declared = gramsText(declaredNetGrams, 0.1);
  if (averageGrams < declaredNetGrams)
    messages.push(
      `The average unit weighs ${gramsText(averageGrams, 0.01)}, below the declared ${declared}: the units must weigh at least the declared net quantity on average`,
    );
  if (belowDeclared.length > 0)
    messages.push(
      `${belowDeclared.length} of ${count} units weigh less than the declared ${declared} (unit${belowDeclared.length === 1 ? '' : 's'} ${belowDeclared.join(', ')}; the lightest ${gramsText(lightestGrams, 0.1)})`,
    );
  const status =
    averageGrams < declaredNetGrams
      ? 'average-below'
      : belowDeclared.length > 0
        ? 'light-units'
        : 'ok';
  return { count, averageGrams, lightestGrams, belowDeclared, status, messages };
}
