import * as z from 'zod';
import { complianceMarketSchema, referenceStatusSchema } from '../reference-data/reference-row';

/**
 * How sure a finding is: the status of the reference row it rests on, or `interpretation` when it
 * rests on Batchproof's own reading of a rule (a product used in the bath touches mucous membranes).
 * An interpretation may block, and the owner may record a reasoned override at release.
 */
export const findingStatusSchema = z.enum([...referenceStatusSchema.options, 'interpretation']);
/** How sure a finding is. */
export type FindingStatus = z.infer<typeof findingStatusSchema>;

/** Stable codes for every finding the engine can raise. */
export const findingCodeSchema = z.enum([
  'COLOURANT_NOT_PERMITTED',
  'COLOURANT_OVER_MAXIMUM',
  'COLOURANT_CONDITION',
  'COLOURANT_CERTIFIED_BATCH',
  'COLOURANT_NOT_LISTED',
  'COLOURANT_AMBIGUOUS',
  'COLOURANT_NOT_CHECKED',
  'FRAGRANCE_OVER_MAXIMUM',
  'FRAGRANCE_NO_MAXIMUM',
  'FRAGRANCE_DATA_MISSING',
  'IFRA_CATEGORY_CHECK',
  'ALLERGEN_UPCOMING',
  'ALLERGEN_NOT_LISTED',
  'ALLERGEN_OVER_MAXIMUM',
  'ALLERGEN_PROHIBITED',
  'ALLERGEN_CLASSIFICATION_CHECK',
  'ALLERGEN_NO_US_RULE',
  'WARNING_FOAMING_BATH_CAUTION',
  'WARNING_FOAMING_BATH_ADULTS_ONLY',
  'WARNING_SURFACTANT_ROLE_CHECK',
  'DECLARATION_INCIDENTAL_OMITTED',
  'FRAGRANCE_ALLERGEN_DATA_MISSING',
  'RESTRICTED_OVER_MAXIMUM',
  'RESTRICTED_NOT_ALLOWED',
  'RESTRICTED_CONDITION',
  'RESTRICTED_UPCOMING',
  'PROHIBITED_SUBSTANCE',
  'PROHIBITED_UPCOMING',
  'WARNING_FOAMING_BATH_DIRECTIONS',
  'SOAP_NOT_A_COSMETIC',
  'LABEL_DETAILS_MISSING',
  'SAFETY_ASSESSMENT_MISSING',
]);
/** A finding code. */
export type FindingCode = z.infer<typeof findingCodeSchema>;

/** How serious a finding is; the UI shows Blocks / Check / Note. */
export const findingSeveritySchema = z.enum(['block', 'warn', 'info']);
/** How serious a finding is. */
export type FindingSeverity = z.infer<typeof findingSeveritySchema>;

/** The approved substitute a finding holds for (see `evaluateWithSubstitutes`). */
export const findingSubstituteSchema = z.object({
  /** The formula line (1-based, as the editor numbers it) whose material it replaces. */
  lineNumber: z.number().int(),
  materialId: z.string(),
  materialName: z.string(),
  /** The line's own material's name. */
  replacesName: z.string(),
});
/** The approved substitute a finding holds for. */
export type FindingSubstitute = z.infer<typeof findingSubstituteSchema>;

/** One thing the engine found, with the rule it comes from. */
export const complianceFindingSchema = z.object({
  code: findingCodeSchema,
  severity: findingSeveritySchema,
  /** Market the finding is about; null when it applies whatever the market (IFRA maxima). */
  market: complianceMarketSchema.nullable(),
  /** What it is about: a material, ingredient or colourant name. */
  subject: z.string(),
  message: z.string(),
  /** The published rule it rests on. */
  source: z.string(),
  /** How sure we are of that rule; `M` findings never block; `interpretation` is our reading. */
  status: findingStatusSchema,
  /** Indexes of the formula lines involved. */
  lines: z.array(z.number().int()),
  /**
   * Set when the finding holds only with an approved substitute in place of a line's material;
   * it counts, and blocks a release, like any other finding.
   */
  substitute: findingSubstituteSchema.optional(),
});
/** One compliance finding. */
export type ComplianceFinding = z.infer<typeof complianceFindingSchema>;

/** An ingredient declaration for one market. */
export const declarationSchema = z.object({
  /** Label names in the order to print them. */
  ingredients: z.array(z.string()),
  /** The printed line, e.g. `Ingredients: Sodium Bicarbonate, Citric Acid, Fragrance.` */
  text: z.string(),
  /** The same names grouped by the ordering rule: ordered by weight, any order (≤ 1 % US / < 1 % EU), colourants. */
  groups: z.object({
    ordered: z.array(z.string()),
    anyOrder: z.array(z.string()),
    colourants: z.array(z.string()),
  }),
});
/** An ingredient declaration for one market. */
export type Declaration = z.infer<typeof declarationSchema>;

/** One fragrance allergen's amount in the product and whether the market's label must name it. */
export const allergenResultSchema = z.object({
  inci: z.string(),
  percent: z.number(),
  declared: z.boolean(),
  /** Threshold used, percent (0.001 leave-on, 0.01 rinse-off); null when the market has no rule. */
  thresholdPercent: z.number().nullable(),
  /** Annex III reference, or null when the substance is not on the list Batchproof holds. */
  annexRef: z.string().nullable(),
  /** First day (YYYY-MM-DD) naming it is required in this market, when known. */
  requiredFrom: z.string().nullable(),
});
/** One allergen result. */
export type AllergenResult = z.infer<typeof allergenResultSchema>;

/** A colourant's verdict in one market for this product's exposure. */
export const colourantVerdictSchema = z.object({
  subject: z.string(),
  colourIndex: z.string().nullable(),
  /** Name of the listing or Annex IV entry matched, when one was. */
  listing: z.string().nullable(),
  verdict: z.enum([
    'permitted',
    'permitted-with-conditions',
    'not-permitted',
    'not-listed',
    'not-checked',
  ]),
  conditions: z.array(z.string()),
  /** Percent of the finished product in this form (a dye, or its lake, or one blend's share). */
  percent: z.number(),
  /**
   * Percent of the same colour in all its forms (the dye and its lakes and salts, every blend it comes
   * in): limits apply to this total (21 CFR 74.2333(c) "total color"; Annex IV preamble).
   */
  totalPercent: z.number().optional(),
  source: z.string(),
  status: findingStatusSchema.nullable(),
  lines: z.array(z.number().int()),
});
/** A colourant verdict. */
export type ColourantVerdict = z.infer<typeof colourantVerdictSchema>;

/** A formula line with its share of the batch. */
export const evaluatedLineSchema = z.object({
  index: z.number().int(),
  name: z.string(),
  grams: z.number(),
  percent: z.number(),
});

/** Output of {@link evaluateFormula}. Keys of the per-market records are the markets evaluated. */
export const evaluationResultSchema = z.object({
  asOf: z.string(),
  markets: z.array(complianceMarketSchema),
  totalGrams: z.number(),
  lines: z.array(evaluatedLineSchema),
  declarations: z.partialRecord(complianceMarketSchema, declarationSchema),
  allergens: z.partialRecord(complianceMarketSchema, z.array(allergenResultSchema)),
  colourants: z.partialRecord(complianceMarketSchema, z.array(colourantVerdictSchema)),
  warnings: z.partialRecord(complianceMarketSchema, z.array(z.string())),
  findings: z.array(complianceFindingSchema),
  /** Approved substitutes checked with the formula (each one line's material replaced); absent when none. */
  substitutes: z.array(findingSubstituteSchema).optional(),
});
/** Output of `evaluateFormula`. */
export type EvaluationResult = z.infer<typeof evaluationResultSchema>;

/** Sentence added to findings that could hurt someone. */
export const DEFER_TO_ASSESSOR =
  'This could harm the people who use the product: ask your qualified safety assessor and check the law where you sell before releasing it.';

/** Added to the message of a finding whose status is `interpretation`. */
export const INTERPRETATION_NOTE =
  "This rests on Batchproof's reading, not on the regulation's words: the owner may record a reasoned override at release, ideally with the safety assessor's view.";
