import type { ProductType } from '../compliance/product-types';
import type { ExposureInput } from './assessment-api';

/**
 * Exposure defaults for common product types (Annex I Part A item 6), shipped as sourced data.
 * Values from the SCCS Notes of Guidance, 12th revision, Table 3A (adult daily exposure by product
 * category); where each value was read is recorded in docs/reference-sources/safety-assessment.md.
 * The qualified safety assessor chooses, confirms or replaces them.
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
  /** Product types of Batchproof this row is offered for (best first in `exposureDefaultsFor`). */
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

/** Default body weight, kg. */
export const DEFAULT_BODY_WEIGHT_KG = 60; // from memory (SCCS Notes of Guidance); [C2] Danish EPA survey "an adult of 60 kg"
/** Dermal absorption assumed when there are no data, percent. */
export const DEFAULT_DERMAL_ABSORPTION_PERCENT = 100; // [C2] "Without this data, the safety assessor would use a value of 100% for absorption"

const TABLE_3A = 'SCCS/1647/22 (12th revision), Table 3A';
const TABLE_3B = 'SCCS/1647/22 (12th revision), Table 3B';

type ExposureRow = Omit<ExposureDefault, 'productTypes'>;

/** The rows, without their product types (those come from {@link PRESETS_BY_PRODUCT_TYPE}). */
const ROWS: readonly ExposureRow[] = [
  // SCCS/1647/22 Table 3A: shower gel 18.67 g/d, RF 0.01, A 2.79 mg/kg bw/d [C2]
  {
    key: 'shower-gel',
    label: 'Shower gel (rinse-off)',
    dailyAmountGrams: 18.67,
    retentionFactor: 0.01,
    exposureMgPerKgDay: 2.79,
    source: TABLE_3A,
    status: 'C2',
  },
  // SCCS Notes of Guidance, hand wash soap 20.00 g/d, RF 0.01, A 3.33 mg/kg bw/d: from memory
  {
    key: 'hand-wash-soap',
    label: 'Hand wash soap (rinse-off)',
    dailyAmountGrams: 20,
    retentionFactor: 0.01,
    exposureMgPerKgDay: 3.33,
    source: `${TABLE_3B} (from memory)`,
    status: 'M',
    note: 'Not read in a copy of the table yet: confirm against the Notes of Guidance.',
  },
  // SCCS/1647/22 Table 3A: body lotion 7.82 g/d, RF 1.0, A 123.20 mg/kg bw/d [C2]
  {
    key: 'body-lotion',
    label: 'Body lotion (leave-on)',
    dailyAmountGrams: 7.82,
    retentionFactor: 1,
    exposureMgPerKgDay: 123.2,
    source: TABLE_3A,
    status: 'C2',
  },
  // SCCS/1647/22 Table 3A: hand cream 2.16 g/d, RF 1.0, A 32.70 mg/kg bw/d [C2]
  {
    key: 'hand-cream',
    label: 'Hand cream (leave-on)',
    dailyAmountGrams: 2.16,
    retentionFactor: 1,
    exposureMgPerKgDay: 32.7,
    source: TABLE_3A,
    status: 'C2',
  },
  // SCCS/1647/22 Table 3A: face cream 1.54 g/d, RF 1.0, A 24.14 mg/kg bw/d [C2]
  {
    key: 'face-cream',
    label: 'Face cream (leave-on)',
    dailyAmountGrams: 1.54,
    retentionFactor: 1,
    exposureMgPerKgDay: 24.14,
    source: TABLE_3A,
    status: 'C2',
  },
  // SCCS/1647/22 Table 3A: liquid foundation 0.51 g/d, RF 1.0, A 7.90 mg/kg bw/d [C2]
  {
    key: 'liquid-foundation',
    label: 'Liquid foundation (leave-on)',
    dailyAmountGrams: 0.51,
    retentionFactor: 1,
    exposureMgPerKgDay: 7.9,
    source: TABLE_3A,
    status: 'C2',
  },
  // SCCS/1647/22 Table 3A: lipstick / lip salve 0.057 g/d, RF 1.0, A 0.90 mg/kg bw/d [C2]
  {
    key: 'lipstick',
    label: 'Lipstick or lip salve (leave-on)',
    dailyAmountGrams: 0.057,
    retentionFactor: 1,
    exposureMgPerKgDay: 0.9,
    source: TABLE_3A,
    status: 'C2',
  },
  // SCCS/1647/22 Table 3A: deodorant non-spray 1.50 g/d, RF 1.0, A 22.08 mg/kg bw/d [C2]
  {
    key: 'deodorant-non-spray',
    label: 'Deodorant, non-spray (leave-on)',
    dailyAmountGrams: 1.5,
    retentionFactor: 1,
    exposureMgPerKgDay: 22.08,
    source: TABLE_3A,
    status: 'C2',
  },
  // SCCS/1647/22 Table 3A: deodorant spray 0.69 g/d, RF 1.0, A 10.00 mg/kg bw/d [C2]
  {
    key: 'deodorant-spray',
    label: 'Deodorant, spray (leave-on)',
    dailyAmountGrams: 0.69,
    retentionFactor: 1,
    exposureMgPerKgDay: 10,
    source: TABLE_3A,
    status: 'C2',
  },
  // SCCS/1647/22 Table 3A: shampoo 10.46 g/d, RF 0.01, A 1.51 mg/kg bw/d [C2]
  {
    key: 'shampoo',
    label: 'Shampoo (rinse-off)',
    dailyAmountGrams: 10.46,
    retentionFactor: 0.01,
    exposureMgPerKgDay: 1.51,
    source: TABLE_3A,
    status: 'C2',
  },
  // SCCS/1647/22 Table 3B: hair conditioner 3.92 g/d, RF 0.01, A 0.67 mg/kg bw/d [C2]
  {
    key: 'hair-conditioner',
    label: 'Hair conditioner (rinse-off)',
    dailyAmountGrams: 3.92,
    retentionFactor: 0.01,
    exposureMgPerKgDay: 0.67,
    source: TABLE_3B,
    status: 'C2',
  },
  // SCCS/1647/22 Table 3A: hair styling 4.00 g/d, RF 0.1, A 5.74 mg/kg bw/d [C2]
  {
    key: 'hair-styling',
    label: 'Hair styling product (leave-on, RF 0.1)',
    dailyAmountGrams: 4,
    retentionFactor: 0.1,
    exposureMgPerKgDay: 5.74,
    source: TABLE_3A,
    status: 'C2',
  },
  // Common practice, no published source: the Notes of Guidance have no row for bath products.
  {
    key: 'bath-product-assumed',
    label: 'Bath product, assumed like shower gel (rinse-off)',
    dailyAmountGrams: 18.67,
    retentionFactor: 0.01,
    exposureMgPerKgDay: 2.79,
    source: `Common practice, no published source: the shower gel row of ${TABLE_3A} taken for a product used in the bath or shower`,
    status: 'practice',
    note: 'The Notes of Guidance publish no row for bath bombs, bath salts, bubble bars or shower steamers. This takes the shower gel values as the nearest rinse-off, whole-body use; the assessor must confirm it fits (amount per bath, how often, dilution in the bath water) or enter their own.',
  },
];

/**
 * Which rows each Batchproof product type is offered, best first. Our mapping (common practice,
 * no published source): the nearest SCCS category by how the product is used.
 */
export const PRESETS_BY_PRODUCT_TYPE: Readonly<Record<ProductType, readonly string[]>> = {
  fizzer: ['bath-product-assumed', 'shower-gel'],
  'foaming-fizzer': ['bath-product-assumed', 'shower-gel'],
  'bubble-bar': ['bath-product-assumed', 'shower-gel'],
  'bath-salts': ['bath-product-assumed', 'shower-gel'],
  'shower-steamer': ['bath-product-assumed', 'shower-gel'],
  soap: ['hand-wash-soap', 'shower-gel'],
  'body-wash': ['shower-gel', 'hand-wash-soap'],
  'body-oil': ['body-lotion'],
  'body-butter': ['body-lotion', 'hand-cream'],
  lotion: ['body-lotion', 'hand-cream', 'face-cream'],
  scrub: ['shower-gel'],
  'lip-balm': ['lipstick'],
  lipstick: ['lipstick'],
  deodorant: ['deodorant-non-spray', 'deodorant-spray'],
  'hair-care': ['shampoo', 'hair-conditioner', 'hair-styling'],
  'face-care': ['face-cream', 'liquid-foundation'],
  'eye-area-product': [],
  'nail-product': [],
  other: [],
};

export const EXPOSURE_DEFAULTS: readonly ExposureDefault[] = ROWS.map((row) => ({
  ...row,
  productTypes: (Object.keys(PRESETS_BY_PRODUCT_TYPE) as ProductType[]).filter((type) =>
    PRESETS_BY_PRODUCT_TYPE[type].includes(row.key),
  ),
}));

/** The row with this key, or undefined. */
export function findExposureDefault(key: string): ExposureDefault | undefined {
  return EXPOSURE_DEFAULTS.find((row) => row.key === key);
}

/** The rows offered for a product type, best first; empty when none fits (the assessor enters their own). */
export function exposureDefaultsFor(productType: string): ExposureDefault[] {
  const keys = PRESETS_BY_PRODUCT_TYPE[productType as ProductType] ?? [];
  return keys.flatMap((key) => findExposureDefault(key) ?? []);
}

/** Item 6 as worked out from the exposure input. */
export interface ProductExposure {
  /** A, mg/kg bw/day. */
  exposureMgPerKgDay: number;
  /** True when a preset was taken as shipped (its published A is used). */
  defaulted: boolean;
  /** The preset's label when taken as shipped, else null. */
  presetLabel: string | null;
  source: string;
}

const same = (a: number, b: number) => Math.abs(a - b) < 1e-9;

/** A from first principles: daily amount (g) × retention factor × 1000 (mg/g) / body weight (kg). */
export function exposureFromAmount(
  dailyAmountGrams: number,
  retentionFactor: number,
  bodyWeightKg: number,
): number {
  return (dailyAmountGrams * retentionFactor * 1000) / bodyWeightKg;
}

/**
 * A for the packet. A preset whose amount and retention factor are unchanged (and body weight left
 * at 60 kg) gives its published A: the table divides each person's use by their own body weight, so
 * it differs a little from amount × RF / 60 (2.79 against 3.11 for shower gel). Anything changed
 * gives A = amount × RF × 1000 / body weight, with the assessor's source.
 */
export function productExposure(input: ExposureInput): ProductExposure {
  const preset = input.presetKey === null ? undefined : findExposureDefault(input.presetKey);
  const unchanged =
    preset !== undefined &&
    same(input.dailyAmountGrams, preset.dailyAmountGrams) &&
    same(input.retentionFactor, preset.retentionFactor) &&
    same(input.bodyWeightKg, DEFAULT_BODY_WEIGHT_KG);
  if (preset && unchanged)
    return {
      exposureMgPerKgDay: preset.exposureMgPerKgDay,
      defaulted: true,
      presetLabel: preset.label,
      source: preset.source,
    };
  const own = input.source.trim();
  return {
    exposureMgPerKgDay: exposureFromAmount(
      input.dailyAmountGrams,
      input.retentionFactor,
      input.bodyWeightKg,
    ),
    defaulted: false,
    presetLabel: null,
    source:
      own ||
      (preset
        ? `${preset.source}, values changed by the assessor`
        : 'Assessor’s own values (no source given)'),
  };
}
