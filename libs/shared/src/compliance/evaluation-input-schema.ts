import * as z from 'zod';
import { complianceMarketSchema } from '../reference-data/reference-row';
import { parseColourIndex } from './ingredient-names';
import { casCheckDigit, isValidCas } from '../materials/cas-number';
import { productTypeSchema } from './product-types';
import { isoDate, requiredText, textField } from '../records/record-fields';

/** A CAS Registry Number as written, e.g. 122-99-6. */
const casSchema = textField('The CAS number')
  .trim()
  .regex(/^\d{2,7}-\d{2}-\d$/, { error: 'Enter a CAS number such as 122-99-6' })
  .refine(isValidCas, {
    error: (issue) =>
      `CAS ${String(issue.input)} fails its check digit (the other digits call for ${casCheckDigit(String(issue.input))}): check the number`,
  });

/** Largest line weight the engine accepts: 1,000 tonnes, far above any small batch, keeps sums finite. */
const MAX_GRAMS = 1e9;
/** Most lines a formula may have: far more than any real formula, small enough to check quickly. */
export const MAX_LINES = 200;
/** Most functions one material or blend component lists. */
export const MAX_FUNCTIONS = 20;
/** Most components of one blend. */
export const MAX_BLEND_COMPONENTS = 50;
/** Most allergens one declaration lists (the EU's 2023 list names about 80). */
export const MAX_DECLARED_ALLERGENS = 200;
/** Most categories one IFRA certificate names (the 51st amendment has 18, 1 to 12 with sub-categories). */
export const MAX_IFRA_CATEGORIES = 30;
/** Most entries of a markets list; each market is checked once whatever the count. */
export const MAX_MARKETS = 10;
/** Blend components must add up to 100 % within this tolerance. */
export const BLEND_TOLERANCE_PERCENT = 0.01;

const text = (label: string) => requiredText(label, 200);

const percentSchema = z
  .number({ error: 'Enter a percentage' })
  .min(0, { error: 'A percentage cannot be negative' })
  .max(100, { error: 'A percentage cannot exceed 100' });

const colourIndexSchema = textField('The Colour Index number')
  .trim()
  .refine((value) => parseColourIndex(value) !== null, {
    error: 'Enter a Colour Index number such as CI 77891 or 15850:1',
  })
  .transform((value) => parseColourIndex(value) ?? value);

/** One ingredient inside a blend (a mica blend, a base), as a percent of the blend. */
export const blendComponentSchema = z.object({
  inci: text('INCI name'),
  usName: text('US name').optional(),
  colourIndex: colourIndexSchema.optional(),
  cas: casSchema.optional(),
  /** Whether this component is a nanomaterial: EU/UK lists name it followed by "(nano)" (Art. 19(1)(g)). */
  nano: z.boolean().optional(),
  functions: z
    .array(textField('A function').trim().min(1))
    .max(MAX_FUNCTIONS, { error: `List at most ${MAX_FUNCTIONS} functions` })
    .optional(),
  percent: percentSchema.refine((p) => p > 0, {
    error: 'A component must be more than 0 % of its blend',
  }),
  /** Whether it is an incidental ingredient (21 CFR 701.3(l)) that need not be declared. */
  incidental: z.boolean().optional(),
});

/** A fragrance allergen as the supplier declares it: percent of the neat fragrance or essential oil. */
export const fragranceAllergenInputSchema = z.object({
  inci: text('Allergen name'),
  cas: casSchema.optional(),
  percent: percentSchema,
});

/** Fragrance data from the supplier's IFRA certificate and allergen declaration. */
export const fragranceInputSchema = z
  .object({
    /** Maxima by IFRA category from the certificate; empty when no certificate is entered. */
    maxPercentByIfraCategory: z
      .record(textField('The IFRA category').trim().min(1), percentSchema)
      .refine((maxima) => Object.keys(maxima).length <= MAX_IFRA_CATEGORIES, {
        error: `List at most ${MAX_IFRA_CATEGORIES} IFRA categories`,
      }),
    allergens: z
      .array(fragranceAllergenInputSchema)
      .max(MAX_DECLARED_ALLERGENS, { error: `List at most ${MAX_DECLARED_ALLERGENS} allergens` }),
    /**
     * Whether `allergens` comes from the supplier's allergen declaration. False when only the IFRA
     * certificate is entered: an empty list then means "unknown", not "none".
     */
    allergensDeclared: z.boolean().default(true),
  })
  .superRefine((fragrance, ctx) => {
    const sum = fragrance.allergens.reduce((total, a) => total + a.percent, 0);
    if (sum > 100 + BLEND_TOLERANCE_PERCENT) {
      ctx.addIssue({
        code: 'custom',
        path: ['allergens'],
        message: `Allergens add up to ${round(sum)} % of the fragrance; they cannot exceed 100 %`,
      });
    }
  });

/** A raw material as the engine needs it. */
export const materialInputSchema = z
  .object({
    name: text('Material name'),
    inci: text('INCI name'),
    usName: text('US name').optional(),
    functions: z.array(textField('A function').trim().min(1)).max(MAX_FUNCTIONS, {
      error: `List at most ${MAX_FUNCTIONS} functions`,
    }),
    /** The material's kind as the workshop files it; `fragrance` and `essential-oil` mark scent materials. */
    category: textField('The category').trim().min(1).max(50).optional(),
    colourIndex: colourIndexSchema.optional(),
    cas: casSchema.optional(),
    /** Whether the material is a nanomaterial (Regulation (EC) No 1223/2009, Art. 2(1)(k), 19(1)(g)). */
    nano: z.boolean().optional(),
    components: z
      .array(blendComponentSchema)
      .min(1, { error: 'A blend needs at least one component' })
      .max(MAX_BLEND_COMPONENTS, {
        error: `A blend has at most ${MAX_BLEND_COMPONENTS} components`,
      })
      .optional(),
    fragrance: fragranceInputSchema.optional(),
    /** Whether it is an incidental ingredient (21 CFR 701.3(l)) that need not be declared. */
    incidental: z.boolean().optional(),
  })
  .superRefine((material, ctx) => {
    if (!material.components) return;
    const sum = material.components.reduce((total, c) => total + c.percent, 0);
    if (Math.abs(sum - 100) > BLEND_TOLERANCE_PERCENT) {
      ctx.addIssue({
        code: 'custom',
        path: ['components'],
        message: `Blend components add up to ${round(sum)} %; they must add up to 100 % (± ${BLEND_TOLERANCE_PERCENT})`,
      });
    }
  });

/** One formula line: a weight of one material. */
export const formulaLineInputSchema = z.object({
  grams: z
    .number({ error: 'Enter a weight in grams' })
    .min(0, { error: 'Grams cannot be negative' })
    .max(MAX_GRAMS, { error: 'Enter at most 1,000,000,000 g' }),
  material: materialInputSchema,
});

/** The product the formula makes: how it is used decides which rules apply. */
export const productInputSchema = z.object({
  name: text('Product name'),
  /** What kind of product it is; listings that name product types are applied to it. */
  type: productTypeSchema.default('other'),
  /** A soap labelled and sold solely as soap: not a cosmetic in the US (21 CFR 701.20). */
  soldAsSoap: z.boolean().default(false),
  use: z.enum(['rinse-off', 'leave-on'], { error: 'Choose rinse-off or leave-on' }),
  contact: z.object({ mucousMembranes: z.boolean(), eyeArea: z.boolean(), lips: z.boolean() }),
  /** Whether it is used in the bath (bath bomb, salts, bubble bar): treated as mucous-membrane contact. */
  inBath: z.boolean(),
  /** Whether the label says it is for adults only (exempts it from the 21 CFR 740.17 caution). */
  adultsOnly: z.boolean(),
  ifraCategory: text('IFRA category'),
  netQuantity: z
    .object({
      amount: z.number().gt(0, { error: 'Net quantity must be more than 0' }).max(MAX_GRAMS),
      unit: z.enum(['g', 'mL']),
    })
    .optional(),
  /** Mass of one unit as made, grams (a label and a batch need it). */
  unitMassGrams: z
    .number()
    .gt(0, { error: 'Unit mass must be more than 0 g' })
    .max(MAX_GRAMS)
    .optional(),
});

/** Input of {@link evaluateFormula}: a formula by weight, the product and the markets to check. */
export const evaluationInputSchema = z
  .object({
    asOf: isoDate('the date to check against'),
    markets: z
      .array(complianceMarketSchema, { error: 'Choose at least one market' })
      .min(1, { error: 'Choose at least one market' })
      .max(MAX_MARKETS, { error: `Name at most ${MAX_MARKETS} markets` })
      .transform((markets) => [...new Set(markets)]),
    product: productInputSchema,
    lines: z
      .array(formulaLineInputSchema)
      .min(1, { error: 'Add at least one line' })
      .max(MAX_LINES, { error: `A formula has at most ${MAX_LINES} lines` }),
  })
  .superRefine((input, ctx) => {
    const total = input.lines.reduce((sum, line) => sum + line.grams, 0);
    if (!(total > 0)) {
      ctx.addIssue({
        code: 'custom',
        path: ['lines'],
        message: 'The formula weighs 0 g: enter grams for at least one line',
      });
    }
  });

/** Evaluation input after parsing (CI numbers normalised, markets de-duplicated). */
export type EvaluationInput = z.output<typeof evaluationInputSchema>;
/** Evaluation input as a client sends it, before parsing. */
export type EvaluationInputDraft = z.input<typeof evaluationInputSchema>;
/** One parsed formula line. */
export type FormulaLineInput = EvaluationInput['lines'][number];
/** One parsed material. */
export type MaterialInput = FormulaLineInput['material'];
/** The parsed product. */
export type ProductInput = EvaluationInput['product'];

function round(n: number): number {
  return Math.round(n * 1000) / 1000;
}
