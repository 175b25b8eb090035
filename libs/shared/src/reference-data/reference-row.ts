import * as z from 'zod';

/**
 * How sure Batchproof is of a reference value, as tagged beside each row:
 * `C` confirmed in a copy of the primary text, `C2` confirmed in a secondary source quoting it,
 * `CALC` computed from confirmed inputs, `M` from memory and not yet confirmed.
 */
export const referenceStatusSchema = z.enum(['C', 'C2', 'CALC', 'M']);
/** How sure Batchproof is of a reference value (see {@link referenceStatusSchema}). */
export type ReferenceStatus = z.infer<typeof referenceStatusSchema>;

/** The four markets the compliance engine knows. */
export const complianceMarketSchema = z.enum(['US', 'EU', 'UK', 'CA']);
/** A market the compliance engine knows: United States, European Union, United Kingdom, Canada. */
export type ComplianceMarket = z.infer<typeof complianceMarketSchema>;

/** Fields every reference-data row carries, so a list page can show where each value comes from. */
export interface ReferenceRow {
  /** Stable identifier, safe to use as a database key. */
  readonly id: string;
  /** The published text the row rests on, e.g. `21 CFR 73.2725`. */
  readonly source: string;
  /** How sure we are of the row's rule; a rule resting on `M` warns rather than blocks. */
  readonly status: ReferenceStatus;
  /** First day (YYYY-MM-DD) the row applies, when it matters. */
  readonly effectiveFrom?: string;
  /** Last day (YYYY-MM-DD) the row applies, when it matters. */
  readonly effectiveTo?: string;
  /** Anything a reader of the list should know: partial confirmation, caveats. */
  readonly note?: string;
}

/** Whether a row applies on the given day (dates compared as YYYY-MM-DD strings, both ends inclusive). */
export function isInEffect(
  row: Pick<ReferenceRow, 'effectiveFrom' | 'effectiveTo'>,
  asOf: string,
): boolean {
  if (row.effectiveFrom !== undefined && asOf < row.effectiveFrom) return false;
  if (row.effectiveTo !== undefined && asOf > row.effectiveTo) return false;
  return true;
}
