import * as z from 'zod';

/**
 * Kinds of product a formula makes, in the order they are offered. The engine reads the type for
 * listings that name the products a colour may be used in (21 CFR 74.2052(c)), for the exposure a type
 * implies (lip and eye-area products) and for soap sold as soap (21 CFR 701.20).
 */
export const PRODUCT_TYPES = [
  'fizzer',
  'foaming-fizzer',
  'bubble-bar',
  'bath-salts',
  'shower-steamer',
  'soap',
  'body-wash',
  'body-oil',
  'body-butter',
  'lotion',
  'scrub',
  'lip-balm',
  'lipstick',
  'deodorant',
  'hair-care',
  'face-care',
  'eye-area-product',
  'nail-product',
  'other',
] as const;
export const productTypeSchema = z.enum(PRODUCT_TYPES, {
  error: `Choose a product type: ${PRODUCT_TYPES.join(', ')}`,
});
export type ProductType = z.infer<typeof productTypeSchema>;

/** Types used in the bath water (bath bombs, salts, bubble bars). Common practice, no published source. */
export const BATH_PRODUCT_TYPES: readonly ProductType[] = [
  'fizzer',
  'foaming-fizzer',
  'bubble-bar',
  'bath-salts',
];

/** Contact a product type implies whatever the profile says: a lip balm touches the lips. */
export function impliedContact(type: ProductType): { lips: boolean; eyeArea: boolean } {
  return {
    lips: type === 'lip-balm' || type === 'lipstick',
    eyeArea: type === 'eye-area-product',
  };
}

/** Each product type in a few plain words, for messages. */
export const PRODUCT_TYPE_NAMES: Record<ProductType, string> = {
  fizzer: 'bath fizzer',
  'foaming-fizzer': 'foaming bath fizzer',
  'bubble-bar': 'bubble bar',
  'bath-salts': 'bath salts',
  'shower-steamer': 'shower steamer',
  soap: 'soap',
  'body-wash': 'body wash',
  'body-oil': 'body oil',
  'body-butter': 'body butter',
  lotion: 'lotion',
  scrub: 'scrub',
  'lip-balm': 'lip balm',
  lipstick: 'lipstick',
  deodorant: 'deodorant',
  'hair-care': 'hair-care product',
  'face-care': 'face-care or make-up product',
  'eye-area-product': 'eye-area product',
  'nail-product': 'nail product',
  other: 'product of this type',
};

/**
 * Which product types a listing's product words may describe. `certain` types are exactly that product;
 * the others may or may not be (an eye-area product may be a mascara or an eye cream), so the engine
 * asks rather than passes. Common practice, no published source: the mapping is ours.
 */
const LISTING_WORDS: Partial<Record<ProductType, { words: readonly string[]; certain: boolean }>> =
  {
    lipstick: { words: ['lipstick'], certain: true },
    'eye-area-product': {
      words: ['eyeliner', 'brush-on-brow', 'eye shadow', 'mascara'],
      certain: false,
    },
    'nail-product': { words: ['nail enamel'], certain: false },
    'face-care': { words: ['makeup', 'foundation', 'blusher', 'rouge'], certain: false },
  };

/**
 * Whether a product type is one of the products a listing names (21 CFR 74.2052(c) names eight):
 * `yes`, `maybe` (the type is broader than the listing's words, or "other") or `no`.
 */
export function productTypeFitsListing(
  type: ProductType,
  listedProducts: readonly string[],
): 'yes' | 'maybe' | 'no' {
  if (type === 'other') return 'maybe';
  const entry = LISTING_WORDS[type];
  if (!entry) return 'no';
  const listed = listedProducts.map((p) => p.toLowerCase());
  const hit = entry.words.some((w) => listed.some((p) => p.includes(w)));
  if (!hit) return 'no';
  return entry.certain ? 'yes' : 'maybe';
}
