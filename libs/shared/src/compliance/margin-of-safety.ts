import * as z from 'zod';

/** MoS at or above which a margin is generally considered adequate (10 inter-species × 10 intra-species). */
export const MINIMUM_MARGIN_OF_SAFETY = 100; // from memory (SCCS Notes of Guidance)

/** Input of {@link marginOfSafety}. */
export const marginOfSafetyInputSchema = z.object({
  /** A: daily exposure to the product per kg body weight, mg/kg bw/day (already includes the retention factor). */
  exposureMgPerKgDay: z.number().gt(0, { error: 'Exposure must be more than 0' }),
  /** C: concentration of the substance in the finished product, percent. */
  concentrationPercent: z
    .number()
    .gt(0, { error: 'Concentration must be more than 0 %' })
    .max(100, { error: 'Concentration cannot exceed 100 %' }),
  /** DAp: dermal absorption, percent of the applied amount (100 % when there are no data). */
  dermalAbsorptionPercent: z
    .number()
    .gt(0, { error: 'Dermal absorption must be more than 0 %' })
    .max(100, { error: 'Dermal absorption cannot exceed 100 %' }),
  /** PoD_sys: systemic point of departure (e.g. NOAEL), mg/kg bw/day. */
  pointOfDepartureMgPerKgDay: z.number().gt(0, { error: 'Point of departure must be more than 0' }),
});
/** Input of {@link marginOfSafety}. */
export type MarginOfSafetyInput = z.input<typeof marginOfSafetyInputSchema>;

/** Result of {@link marginOfSafety}. */
export interface MarginOfSafety {
  /** Systemic exposure dosage, mg/kg bw/day. */
  readonly sedMgPerKgDay: number;
  /** Margin of safety = PoD_sys / SED. */
  readonly marginOfSafety: number;
  /** Whether MoS is below 100 and needs the assessor's attention. */
  readonly flagged: boolean;
  readonly message: string;
}

/**
 * Systemic exposure dosage and margin of safety by the SCCS Notes of Guidance method (from memory):
 * SED = A × C/100 × DAp/100; MoS = PoD_sys / SED; MoS < 100 is flagged. A tool for the qualified
 * safety assessor, not a substitute. Throws a ZodError with field paths on invalid input.
 */
export function marginOfSafety(input: MarginOfSafetyInput): MarginOfSafety {
  const {
    exposureMgPerKgDay,
    concentrationPercent,
    dermalAbsorptionPercent,
    pointOfDepartureMgPerKgDay,
  } = marginOfSafetyInputSchema.parse(input);
  const sed = exposureMgPerKgDay * (concentrationPercent / 100) * (dermalAbsorptionPercent / 100);
  const mos = pointOfDepartureMgPerKgDay / sed;
  const flagged = mos < MINIMUM_MARGIN_OF_SAFETY;
  const shown = mos >= 10 ? Math.round(mos).toString() : mos.toFixed(1);
  return {
    sedMgPerKgDay: sed,
    marginOfSafety: mos,
    flagged,
    message: flagged
      ? `Margin of safety ${shown} is below ${MINIMUM_MARGIN_OF_SAFETY}: this level could harm people who use the product. Your qualified safety assessor must review it before release.`
      : `Margin of safety ${shown} (at least ${MINIMUM_MARGIN_OF_SAFETY} is generally considered adequate); your qualified safety assessor makes the final judgement.`,
  };
}
