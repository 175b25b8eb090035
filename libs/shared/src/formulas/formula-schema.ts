import * as z from 'zod';
import {
  complianceFindingSchema,
  evaluationResultSchema,
} from '../compliance/evaluation-result-schema';
import { listQuerySchema, pageSchema } from '../lists/list-query-schema';
import { complianceMarketSchema } from '../reference-data/reference-row';
import { archivedAtField, includeArchivedSchema } from '../records/housekeeping-schema';
import {
  optionalText,
  quantity,
  recordIdSchema,
  requiredText,
  storedRecordFields,
  wholeNumber,
} from '../records/record-fields';

import { productTypeSchema } from '../compliance/product-types';
import { MAX_LINES, MAX_MARKETS } from '../compliance/evaluation-input-schema';

/** Life of a version: a draft until released; releasing the next one supersedes it. */
export const versionStateSchema = z.enum(['draft', 'released', 'superseded']);
export type VersionState = z.infer<typeof versionStateSchema>;

/** Sum of percent lines must hit 100 within this tolerance. */
export const PERCENT_TOLERANCE = 0.01;

/** Heaviest unit or net quantity a profile names: far beyond any bath product (1 tonne). */
export const MAX_UNIT_GRAMS = 1e6;

/** How the product is used: decides which rules the engine applies. */
export const productProfileSchema = z.object({
  use: z.enum(['rinse-off', 'leave-on'], { error: 'Choose rinse-off or leave-on' }),
  contact: z
    .object({
      mucousMembranes: z.boolean().default(false),
      eyeArea: z.boolean().default(false),
      lips: z.boolean().default(false),
    })
    .default({ mucousMembranes: false, eyeArea: false, lips: false }),
  /** Whether the product is used in the bath (bath water reaches mucous membranes). */
  inBath: z.boolean({ error: 'Say whether it is used in the bath' }),
  /** Whether the label says "for adults only". */
  adultsOnly: z.boolean().default(false),
  /** Whether a soap is labelled and sold solely as soap (21 CFR 701.20: then not a cosmetic in the US). */
  soldAsSoap: z.boolean().default(false),
  ifraCategory: requiredText('IFRA category', 10),
  markets: z
    .array(complianceMarketSchema, { error: 'Choose at least one market' })
    .min(1, { error: 'Choose at least one market' })
    .max(MAX_MARKETS, { error: `Name at most ${MAX_MARKETS} markets` })
    .transform((m) => [...new Set(m)]),
  unitMassGrams: z
    .number({ error: 'Enter the unit mass in grams' })
    .gt(0, { error: 'The unit mass must be more than 0 g' })
    .max(MAX_UNIT_GRAMS, { error: 'The unit mass is too large (1,000,000 g at most)' })
    .nullish()
    .transform((v) => v ?? null),
  netQuantity: z
    .object({
      amount: z
        .number({ error: 'Enter the net quantity' })
        .gt(0, { error: 'The net quantity must be more than 0' })
        .max(MAX_UNIT_GRAMS, { error: 'The net quantity is too large (1,000,000 at most)' }),
      unit: z.enum(['g', 'mL'], { error: 'Net quantity is in g or mL' }),
    })
    .nullish()
    .transform((v) => v ?? null),
});
export type ProductProfile = z.output<typeof productProfileSchema>;

/** Most approved substitutes one line may name (each is checked by the engine like the line's own). */
export const MAX_SUBSTITUTES_PER_LINE = 5;

/**
 * Approved alternatives to a line's material (one starch or another; issue 11, item 2): material
 * ids, at most {@link MAX_SUBSTITUTES_PER_LINE}, each once. That none is the line's own material is
 * checked on the line ({@link substituteRules}).
 */
export const lineSubstitutesSchema = z
  .array(recordIdSchema('material'), { error: 'List the substitutes as materials' })
  .max(MAX_SUBSTITUTES_PER_LINE, {
    error: `A line has at most ${MAX_SUBSTITUTES_PER_LINE} approved substitutes`,
  })
  .superRefine((ids, ctx) => {
    ids.forEach((id, i) => {
      if (ids.indexOf(id) !== i)
        ctx.addIssue({
          code: 'custom',
          path: [i],
          message: 'This substitute is listed twice: name each material once',
        });
    });
  })
  .optional();

/** A line's own material is not a substitute for itself. */
function substituteRules(
  line: { materialId: string; substitutes?: string[] | undefined },
  ctx: z.RefinementCtx,
) {
  line.substitutes?.forEach((id, i) => {
    if (id === line.materialId)
      ctx.addIssue({
        code: 'custom',
        path: ['substitutes', i],
        message: 'A line’s own material cannot be its substitute: choose another material',
      });
  });
}

/** One line by weight. */
export const formulaLineSchema = z
  .object({
    materialId: recordIdSchema('material'),
    // Stored as numeric(18, 6).
    grams: quantity('Grams', { decimals: 6, max: 1e9, zero: 'allowed' }),
    substitutes: lineSubstitutesSchema,
  })
  .superRefine(substituteRules);
/** One line by percent, converted to grams with the batch total. */
export const percentLineSchema = z
  .object({
    materialId: recordIdSchema('material'),
    percent: z
      .number({ error: 'Enter a percentage' })
      .min(0, { error: 'A percentage cannot be negative' })
      .max(100, { error: 'A percentage cannot exceed 100' }),
    substitutes: lineSubstitutesSchema,
  })
  .superRefine(substituteRules);

/**
 * A draft version's content. Lines come by weight (`lines`) or by percent with a batch total
 * (`byPercent`); the server stores grams either way.
 */
export const formulaVersionInputSchema = z
  .object({
    lines: z
      .array(formulaLineSchema)
      .max(MAX_LINES, { error: `A formula has at most ${MAX_LINES} lines` })
      .optional(),
    byPercent: z
      .object({
        batchGrams: quantity('The batch total in grams', {
          decimals: 6,
          max: 1e9,
          zero: 'refused',
        }),
        lines: z
          .array(percentLineSchema)
          .max(MAX_LINES, { error: `A formula has at most ${MAX_LINES} lines` }),
      })
      .optional(),
    profile: productProfileSchema,
    notes: optionalText('Notes', 4000),
  })
  .superRefine((v, ctx) => {
    if (!v.lines === !v.byPercent) {
      ctx.addIssue({
        code: 'custom',
        path: ['lines'],
        message: 'Send the lines either in grams or by percent with a batch total',
      });
    }
    if (v.byPercent && v.byPercent.lines.length > 0) {
      const sum = v.byPercent.lines.reduce((s, l) => s + l.percent, 0);
      if (Math.abs(sum - 100) > PERCENT_TOLERANCE) {
        ctx.addIssue({
          code: 'custom',
          path: ['byPercent', 'lines'],
          message: `The lines add up to ${Math.round(sum * 1000) / 1000} %; they must add up to 100 %`,
        });
      }
    }
  });
export type FormulaVersionInput = z.input<typeof formulaVersionInputSchema>;
export type FormulaVersionFields = z.output<typeof formulaVersionInputSchema>;

/** A line in grams with its approved substitutes (material ids, in order). */
export interface GramLineWithSubstitutes {
  materialId: string;
  grams: number;
  substitutes: string[];
}

/** The lines of a version input in grams, whichever way they were entered. */
export function linesInGrams(v: FormulaVersionFields): GramLineWithSubstitutes[] {
  if (v.lines)
    return v.lines.map((l) => ({
      materialId: l.materialId,
      grams: l.grams,
      substitutes: l.substitutes ?? [],
    }));
  const { batchGrams, lines } = v.byPercent!;
  return lines.map((l) => ({
    materialId: l.materialId,
    grams: (l.percent / 100) * batchGrams,
    substitutes: l.substitutes ?? [],
  }));
}

/** A new formula with its first draft. */
export const formulaCreateSchema = z.object({
  name: requiredText('Formula name'),
  productType: productTypeSchema,
  notes: optionalText('Notes', 4000),
  draft: formulaVersionInputSchema,
});
export type FormulaCreate = z.input<typeof formulaCreateSchema>;

/** Renaming or re-describing a formula (its versions are changed through their own routes). */
export const formulaUpdateSchema = z.object({
  name: requiredText('Formula name'),
  productType: productTypeSchema,
  notes: optionalText('Notes', 4000),
});
export type FormulaUpdate = z.input<typeof formulaUpdateSchema>;

/** Most versions one formula may have: far more than any formula reaches, inside `integer`. */
export const MAX_VERSION_NUMBER = 1_000_000;

/** A version number in a body, a query or (`fromText`) a path. */
export const versionNumberSchema = (label: string, fromText = false) =>
  wholeNumber(label, { min: 1, max: MAX_VERSION_NUMBER, fromText });

/** Starts a new draft copied from an existing version (the latest when none is named). */
export const newVersionSchema = z.object({
  fromVersion: versionNumberSchema('The version to copy').optional(),
});

/** Releases a version; an owner may override blocking findings with a recorded reason. */
export const releaseSchema = z.object({
  override: z
    .object({
      reason: requiredText('Reason for the override', 2000).min(10, {
        error: 'Explain the override in at least 10 characters',
      }),
    })
    .optional(),
});
export type ReleaseRequest = z.input<typeof releaseSchema>;

/** Counts of the evaluation's findings by severity. */
export const evaluationCountsSchema = z.object({
  block: z.number().int(),
  warn: z.number().int(),
  info: z.number().int(),
});

/** A version in a formula's history. */
export const versionSummarySchema = z.object({
  number: z.number().int(),
  state: versionStateSchema,
  counts: evaluationCountsSchema.nullable(),
  releasedAt: z.string().nullable(),
  updatedAt: z.string(),
});

/** An approved substitute as a version answers it. */
export const storedSubstituteSchema = z.object({
  materialId: z.string(),
  materialName: z.string(),
});
export type StoredSubstitute = z.infer<typeof storedSubstituteSchema>;

/** A stored line with its material's name, share of the batch and approved substitutes. */
export const storedLineSchema = z.object({
  materialId: z.string(),
  materialName: z.string(),
  grams: z.number(),
  percent: z.number(),
  /** Approved alternatives in the order the formulator listed them. */
  substitutes: z.array(storedSubstituteSchema).default([]),
});

/** One version with its lines, profile and stored evaluation. */
export const formulaVersionSchema = z.object({
  ...storedRecordFields,
  formulaId: z.string(),
  number: z.number().int(),
  state: versionStateSchema,
  lines: z.array(storedLineSchema),
  totalGrams: z.number(),
  profile: productProfileSchema,
  notes: z.string().nullable(),
  /** The server's evaluation at the last save or release; null while the draft can't be checked. */
  evaluation: evaluationResultSchema.nullable(),
  counts: evaluationCountsSchema.nullable(),
  /** Why the draft could not be evaluated (no lines, a weight of 0 g …). */
  evaluationProblems: z.array(z.string()),
  evaluatedAt: z.string().nullable(),
  releasedAt: z.string().nullable(),
  overrideReason: z.string().nullable(),
  /**
   * What the version lacks in safety assessment (`SAFETY_ASSESSMENT_MISSING` per EU or UK market
   * while it has no signed assessment), worked out when read; never part of `evaluation` or
   * `counts`. Absent from answers that do not look it up.
   */
  assessmentFindings: z.array(complianceFindingSchema).optional(),
});
export type FormulaVersion = z.infer<typeof formulaVersionSchema>;

/** A formula with its version history. */
export const formulaSchema = z.object({
  ...storedRecordFields,
  name: z.string(),
  productType: productTypeSchema,
  notes: z.string().nullable(),
  versions: z.array(versionSummarySchema),
  archivedAt: archivedAtField,
});
export type Formula = z.infer<typeof formulaSchema>;

/** A formula row in the list. */
export const formulaListItemSchema = z.object({
  id: z.string(),
  name: z.string(),
  productType: productTypeSchema,
  updatedAt: z.string(),
  latestVersion: z.number().int().nullable(),
  latestState: versionStateSchema.nullable(),
  releasedVersion: z.number().int().nullable(),
  /** The latest version's findings by severity; null before its first evaluation. */
  latestCounts: evaluationCountsSchema.nullable(),
  archivedAt: archivedAtField,
});
/** Query of `GET /api/formulas`; archived formulas only with `includeArchived=true`. */
export const formulaListQuerySchema = listQuerySchema(
  ['name', 'productType', 'createdAt', 'updatedAt'],
  'name',
).extend({ productType: productTypeSchema.optional(), includeArchived: includeArchivedSchema });
export type FormulaListQuery = z.output<typeof formulaListQuerySchema>;
export const formulaPageSchema = pageSchema(formulaListItemSchema);
/** One page of the formulas list. */
export type FormulaPage = z.infer<typeof formulaPageSchema>;

/** Query of the compare route. */
export const compareQuerySchema = z.object({
  from: versionNumberSchema('The version to compare from', true),
  to: versionNumberSchema('The version to compare to', true),
});
