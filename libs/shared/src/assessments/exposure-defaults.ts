/**
 * Exposure defaults for common product types (Annex I Part A item 6), shipped as sourced data.
 * PLACEHOLDER: filled in with the SCCS Notes of Guidance values and their source by the
 * reference-data work; keep this shape.
 */
export interface ExposureDefault {
  key: string;
  /** Plain label, e.g. "Shower gel (rinse-off)". */
  label: string;
  /** Daily amount applied, g/day. */
  dailyAmountGrams: number;
  retentionFactor: number;
  /** A as published, mg/kg bw/day (already includes the retention factor). */
  exposureMgPerKgDay: number;
  /** Product types of Batchproof this row is offered for first. */
  productTypes: readonly string[];
  source: string;
  /** 'C' confirmed against the source text, 'M' from memory, 'practice' common practice. */
  status: 'C' | 'C2' | 'M' | 'practice';
  note?: string;
}

export const EXPOSURE_DEFAULTS_SOURCE = {
  title:
    'SCCS Notes of Guidance for the Testing of Cosmetic Ingredients and their Safety Evaluation',
  reference: 'SCCS/1647/22, 12th revision',
  effectiveFrom: '2023-05-16',
} as const;

export const EXPOSURE_DEFAULTS: readonly ExposureDefault[] = [];

/** Default body weight, kg. */
export const DEFAULT_BODY_WEIGHT_KG = 60; // from memory (SCCS Notes of Guidance)
/** Dermal absorption assumed when there are no data, percent. */
export const DEFAULT_DERMAL_ABSORPTION_PERCENT = 100; // from memory (SCCS Notes of Guidance)
