import * as z from 'zod';
import {
  BLEND_TOLERANCE_PERCENT,
  blendComponentSchema,
  fragranceAllergenInputSchema,
  MAX_BLEND_COMPONENTS,
  MAX_DECLARED_ALLERGENS,
  MAX_FUNCTIONS,
  MAX_IFRA_CATEGORIES,
  MAX_LINES,
} from '../compliance/evaluation-input-schema';
import { parseColourIndex } from '../compliance/ingredient-names';
import { kitchenMeasureSchema } from '../compliance/volume-to-grams';
import { listQuerySchema, pageSchema } from '../lists/list-query-schema';
import {
  isoDate,
  optionalText,
  recordIdSchema,
  requiredText,
  storedRecordFields,
  textField,
} from '../records/record-fields';
import { archivedAtField, includeArchivedSchema } from '../records/housekeeping-schema';
import { calibrationSummarySchema } from './calibration-summary';
import { casProblems } from './cas-number';

/** Kinds of raw material; decides which extra data a material carries. */
export const MATERIAL_CATEGORIES = [
  'base',
  'acid',
  'binder',
  'hardener',
  'oil',
  'butter',
  'emulsifier',
  'surfactant',
  'colourant',
  'fragrance',
  'essential-oil',
  'preservative',
  'additive',
  'other',
] as const;
export const materialCategorySchema = z.enum(MATERIAL_CATEGORIES, {
  error: `Choose a category: ${MATERIAL_CATEGORIES.join(', ')}`,
});
export type MaterialCategory = z.infer<typeof materialCategorySchema>;

/** Whether materials of this category carry an IFRA certificate and an allergen declaration. */
export const isScentCategory = (category: MaterialCategory) =>
  category === 'fragrance' || category === 'essential-oil';

const positive = (label: string) =>
  z
    .number({ error: `Enter ${label} as a number` })
    .gt(0, { error: `${label} must be more than 0` });

/** Maximum percent of the finished product per IFRA category, from the supplier's certificate. */
export const ifraCertificateSchema = z.object({
  maxPercentByIfraCategory: z
    .record(
      textField('The IFRA category')
        .trim()
        .min(1, { error: 'Name the IFRA category, e.g. 9 or 5A' }),
      z
        .number({ error: 'Enter the maximum as a percentage' })
        .min(0, { error: 'A maximum cannot be negative' })
        .max(100, { error: 'A maximum cannot exceed 100 %' }),
    )
    .refine((maxima) => Object.keys(maxima).length <= MAX_IFRA_CATEGORIES, {
      error: `List at most ${MAX_IFRA_CATEGORIES} IFRA categories`,
    }),
  issuedOn: isoDate('the certificate issue date'),
  amendment: z
    .number({ error: 'Enter the IFRA amendment number, e.g. 51' })
    .int({ error: 'The amendment number is a whole number' })
    .positive({ error: 'The amendment number is a whole number' }),
});
export type IfraCertificate = z.infer<typeof ifraCertificateSchema>;

/** The supplier's allergen declaration: each allergen as a percent of the neat oil. */
export const allergenDeclarationSchema = z.object({
  documentDate: isoDate('the declaration date'),
  allergens: z
    .array(fragranceAllergenInputSchema)
    .max(MAX_DECLARED_ALLERGENS, { error: `List at most ${MAX_DECLARED_ALLERGENS} allergens` }),
});
export type AllergenDeclaration = z.infer<typeof allergenDeclarationSchema>;

/** Grams in one of each kitchen or lab measure, from a specification or the maker's own scale. */
export const weightPerVolumeSchema = z.partialRecord(kitchenMeasureSchema, positive('Grams'));
export type WeightPerVolume = z.infer<typeof weightPerVolumeSchema>;

/** One calibration: the maker weighed `grams` of `amount` × `unit` scooped or poured. */
export const calibrationSchema = z.object({
  unit: kitchenMeasureSchema,
  amount: positive('The measured amount'),
  grams: positive('The measured grams'),
  measuredOn: isoDate('the day it was measured')
    .nullish()
    .transform((v) => v ?? null),
});
export type Calibration = z.infer<typeof calibrationSchema>;

/** What the owner or formulator enters for a material (create and full update). */
export const materialCreateSchema = z
  .object({
    tradeName: requiredText('Trade name'),
    inci: requiredText('INCI name', 500),
    usName: optionalText('US label name', 500),
    cas: optionalText('CAS number', 100).superRefine((value, ctx) => {
      for (const message of value === null ? [] : casProblems(value))
        ctx.addIssue({ code: 'custom', message });
    }),
    ec: optionalText('EC number', 100),
    functions: z
      .array(
        textField('A function').trim().min(1, { error: 'A function cannot be empty' }).max(100),
      )
      .max(MAX_FUNCTIONS, { error: `List at most ${MAX_FUNCTIONS} functions` })
      .default([]),
    category: materialCategorySchema,
    supplierId: recordIdSchema('supplier')
      .nullish()
      .transform((v) => v ?? null),
    notes: optionalText('Notes', 4000),
    colourIndex: optionalText('Colour Index number', 50).refine(
      (v) => v === null || parseColourIndex(v) !== null,
      { error: 'Enter a Colour Index number such as CI 77891 or 15850:1' },
    ),
    /** Whether the material is a nanomaterial: EU/UK ingredient lists add "(nano)" to its name. */
    nano: z.boolean().default(false),
    components: z
      .array(blendComponentSchema)
      .max(MAX_BLEND_COMPONENTS, {
        error: `A blend has at most ${MAX_BLEND_COMPONENTS} components`,
      })
      .default([]),
    ifraCertificate: ifraCertificateSchema.nullish().transform((v) => v ?? null),
    allergenDeclaration: allergenDeclarationSchema.nullish().transform((v) => v ?? null),
    weightPerVolume: weightPerVolumeSchema.default({}),
    calibrations: z.array(calibrationSchema).max(100).default([]),
  })
  .superRefine((m, ctx) => {
    if (m.components.length > 0) {
      const sum = m.components.reduce((total, c) => total + c.percent, 0);
      if (Math.abs(sum - 100) > BLEND_TOLERANCE_PERCENT) {
        ctx.addIssue({
          code: 'custom',
          path: ['components'],
          message: `Components add up to ${Math.round(sum * 1000) / 1000} %; they must add up to 100 %`,
        });
      }
    }
    if (!isScentCategory(m.category)) {
      for (const key of ['ifraCertificate', 'allergenDeclaration'] as const) {
        if (m[key]) {
          ctx.addIssue({
            code: 'custom',
            path: [key],
            message: 'Only fragrances and essential oils carry this document',
          });
        }
      }
    }
  });
/** Material input as a form sends it. */
export type MaterialCreate = z.input<typeof materialCreateSchema>;
/** Material input after parsing (defaults filled, blanks as null). */
export type MaterialFields = z.output<typeof materialCreateSchema>;
/** Full replacement of a material's fields (PUT). */
export const materialUpdateSchema = materialCreateSchema;

/** A material as the API returns it. */
export const materialSchema = z.object({
  ...storedRecordFields,
  tradeName: z.string(),
  inci: z.string(),
  usName: z.string().nullable(),
  cas: z.string().nullable(),
  ec: z.string().nullable(),
  functions: z.array(z.string()),
  category: materialCategorySchema,
  supplierId: z.string().nullable(),
  supplierName: z.string().nullable(),
  notes: z.string().nullable(),
  colourIndex: z.string().nullable(),
  nano: z.boolean(),
  components: z.array(blendComponentSchema),
  ifraCertificate: ifraCertificateSchema.nullable(),
  allergenDeclaration: allergenDeclarationSchema.nullable(),
  weightPerVolume: weightPerVolumeSchema,
  calibrations: z.array(calibrationSchema),
  /** Average and spread of the calibrations, per measure. */
  calibrationSummary: z.array(calibrationSummarySchema),
  archivedAt: archivedAtField,
});
export type Material = z.infer<typeof materialSchema>;

/**
 * Query of `GET /api/materials`: `q` matches trade name, INCI, US name and CAS, and the INCI names
 * of a blend's components (ranked after own-name matches, see `materialListItemSchema`).
 * Archived materials only with `includeArchived=true`, so pickers built on the list never offer
 * them.
 */
export const materialListQuerySchema = listQuerySchema(
  ['tradeName', 'inci', 'category', 'createdAt', 'updatedAt'],
  'tradeName',
).extend({
  category: materialCategorySchema.optional(),
  supplierId: recordIdSchema('supplier').optional(),
  includeArchived: includeArchivedSchema,
});
export type MaterialListQuery = z.output<typeof materialListQuerySchema>;

/** A material row in a list: the identity, without the bulky certificate data. */
export const materialSummarySchema = materialSchema.pick({
  id: true,
  tradeName: true,
  inci: true,
  usName: true,
  cas: true,
  category: true,
  supplierId: true,
  supplierName: true,
  colourIndex: true,
  functions: true,
  updatedAt: true,
  archivedAt: true,
});
export type MaterialSummary = z.infer<typeof materialSummarySchema>;

/**
 * Where `q` of `GET /api/materials` found a material: in its own trade name, INCI, US name or CAS
 * (`name`), or only in the INCI name of one of its blend's components (`components`).
 */
export const MATERIAL_MATCH_FIELDS = ['name', 'components'] as const;
export type MaterialMatchField = (typeof MATERIAL_MATCH_FIELDS)[number];

/**
 * A row of the materials list. Filtered by `q`, each row says where it matched, and the rows that
 * matched on their own names come before those found only through a component.
 */
export const materialListItemSchema = materialSummarySchema.extend({
  /** Where `q` matched; absent when the list is not filtered by text. */
  matchedIn: z.enum(MATERIAL_MATCH_FIELDS).optional(),
  /** The INCI name of the component that matched, when `matchedIn` is `components`. */
  matchedComponent: z.string().optional(),
});
export type MaterialListItem = z.infer<typeof materialListItemSchema>;
export const materialPageSchema = pageSchema(materialListItemSchema);
export type MaterialPage = z.infer<typeof materialPageSchema>;

/** Most ids one `GET /api/materials?ids=` names: as many as a formula has lines. */
export const MAX_MATERIAL_IDS = MAX_LINES;
const materialId = recordIdSchema('material');

/**
 * Query of `GET /api/materials?ids=a,b,c`: the full records of the named materials in one request
 * (a formula's lines), in place of one request per material. Repeated ids count once. Archived
 * materials are answered too, so an old version that uses one still opens.
 */
export const materialIdsQuerySchema = z.object({
  ids: z
    .string({ error: 'List material ids separated by commas' })
    .transform((text) => [...new Set(text.split(',').map((id) => id.trim()))])
    .pipe(
      z
        .array(z.string())
        .max(MAX_MATERIAL_IDS, { error: `Ask for at most ${MAX_MATERIAL_IDS} materials at once` })
        // One message on `ids` itself rather than one per position: the query is one field.
        .refine((ids) => ids.every((id) => materialId.safeParse(id).success), {
          error: 'Name each material by its id, separated by commas',
        }),
    ),
});
export type MaterialIdsQuery = z.output<typeof materialIdsQuerySchema>;

/** The answer to `GET /api/materials?ids=`: those of the named materials the workshop has. */
export const materialsByIdSchema = z.object({ items: z.array(materialSchema) });
export type MaterialsById = z.infer<typeof materialsByIdSchema>;
