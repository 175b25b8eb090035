import * as z from 'zod';
import { complianceMarketSchema } from '../reference-data/reference-row';
import { LABEL_FIELD_KEYS } from './label-content';

/**
 * What a refused print run carries in the error envelope (`label_incomplete`, `label_does_not_fit`).
 * Kept apart from the label-run contract so the envelope, which every client reads from its first
 * screen, does not pull the whole run and product-identity schemas into the web app's first load.
 */

/** One element a market's label lacks, as the 409 `label_incomplete` lists them. */
export const missingLabelElementSchema = z.object({
  market: complianceMarketSchema,
  /** Dotted path of the field to fill in, e.g. `identity.euResponsiblePerson.address`, `workshop.address`. */
  field: z.string(),
  item: z.string(),
  source: z.string(),
});
export type MissingLabelElementRecord = z.infer<typeof missingLabelElementSchema>;

/** A field that cannot fit at its legal minimum letter height (422 `label_does_not_fit`). */
export const labelFitProblemSchema = z.object({
  market: complianceMarketSchema,
  /** The label in the maker's words: "front label (66.7 × 25.4 mm)". */
  label: z.string(),
  field: z.enum(LABEL_FIELD_KEYS),
  fieldName: z.string(),
  message: z.string(),
  minimumMm: z.number(),
  source: z.string(),
});
export type LabelFitProblem = z.infer<typeof labelFitProblemSchema>;
