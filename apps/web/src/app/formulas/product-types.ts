import {
  BATH_PRODUCT_TYPES,
  type ComplianceMarket,
  type FormulaVersionInput,
  impliedContact,
  type ProductType,
} from '@batchproof/shared';

/** Product types in the maker's words. */
export const PRODUCT_TYPE_LABELS: Record<ProductType, string> = {
  fizzer: 'Fizzer (bath bomb)',
  'foaming-fizzer': 'Foaming fizzer',
  'bubble-bar': 'Bubble bar',
  'bath-salts': 'Bath salts',
  'shower-steamer': 'Shower steamer',
  soap: 'Soap',
  'body-wash': 'Body wash or shower gel',
  'body-oil': 'Body oil',
  'body-butter': 'Body butter',
  lotion: 'Lotion',
  scrub: 'Scrub',
  'lip-balm': 'Lip balm',
  lipstick: 'Lipstick or lip tint',
  deodorant: 'Deodorant',
  'hair-care': 'Hair care (shampoo bar, conditioner)',
  'face-care': 'Face care or make-up',
  'eye-area-product': 'Eye-area product (eyeliner, mascara, eye shadow)',
  'nail-product': 'Nail product',
  other: 'Other',
};

/** The markets the engine checks, in the order they are offered. */
export const MARKETS: readonly { code: ComplianceMarket; name: string }[] = [
  { code: 'US', name: 'United States' },
  { code: 'EU', name: 'European Union' },
  { code: 'UK', name: 'United Kingdom' },
  { code: 'CA', name: 'Canada' },
];

/** IFRA product categories (51st Amendment), as certificates name them. */
export const IFRA_CATEGORIES = [
  '1',
  '2',
  '3',
  '4',
  '5A',
  '5B',
  '5C',
  '5D',
  '6',
  '7A',
  '7B',
  '8',
  '9',
  '10A',
  '10B',
  '11A',
  '11B',
  '12',
] as const;

/**
 * Whether fizz balance applies: fizzers and steamers always; bath salts only when an acid is in
 * them (plain salts do not fizz).
 */
export function isEffervescent(type: ProductType, hasAcid: boolean): boolean {
  return (
    type === 'fizzer' ||
    type === 'foaming-fizzer' ||
    type === 'shower-steamer' ||
    (type === 'bath-salts' && hasAcid)
  );
}

type Profile = FormulaVersionInput['profile'];

/** How a type is usually used, and the IFRA category its fragrance certificate usually applies. */
interface TypeDefaults {
  use: Profile['use'];
  ifraCategory: string;
}

/**
 * Usual use and IFRA category per type. The categories follow the titles of the IFRA Standards'
 * product categories (49th/51st Amendment): 1 "products applied to the lips", 2 "products applied
 * to the axillae", 3 "products applied to the face/body using fingertips" (eye products),
 * 5A "body lotion products applied to the body using the hands (palms), primarily leave-on",
 * 5B "face moisturizer products …", 9 "products with body and hand exposure, primarily rinse off".
 * Hair and nail products have no category that plainly fits them all, so they keep the defaults
 * (rinse-off → 9, leave-on → 5A) and the maker picks the one their certificate names.
 */
const TYPE_DEFAULTS: Record<ProductType, TypeDefaults> = {
  fizzer: { use: 'rinse-off', ifraCategory: '9' },
  'foaming-fizzer': { use: 'rinse-off', ifraCategory: '9' },
  'bubble-bar': { use: 'rinse-off', ifraCategory: '9' },
  'bath-salts': { use: 'rinse-off', ifraCategory: '9' },
  'shower-steamer': { use: 'rinse-off', ifraCategory: '9' },
  soap: { use: 'rinse-off', ifraCategory: '9' },
  'body-wash': { use: 'rinse-off', ifraCategory: '9' },
  scrub: { use: 'rinse-off', ifraCategory: '9' },
  'body-oil': { use: 'leave-on', ifraCategory: '5A' },
  'body-butter': { use: 'leave-on', ifraCategory: '5A' },
  lotion: { use: 'leave-on', ifraCategory: '5A' },
  'lip-balm': { use: 'leave-on', ifraCategory: '1' },
  lipstick: { use: 'leave-on', ifraCategory: '1' },
  deodorant: { use: 'leave-on', ifraCategory: '2' },
  'eye-area-product': { use: 'leave-on', ifraCategory: '3' },
  // A face cream is 5B; facial make-up is often placed in 3. The maker confirms.
  'face-care': { use: 'leave-on', ifraCategory: '5B' },
  'hair-care': { use: 'rinse-off', ifraCategory: '9' },
  'nail-product': { use: 'leave-on', ifraCategory: '5A' },
  other: { use: 'rinse-off', ifraCategory: '9' },
};

/**
 * A starting profile for a new formula of `type`: bath products are marked "used in the bath" but
 * not "touches mucous membranes" — the engine reads bath use as mucous-membrane contact and labels
 * the findings that rest on it as its interpretation, which a pre-ticked box would hide; lip
 * products touch the lips and eye-area products the eye area (as the engine also assumes, see
 * `impliedContact`); use and IFRA category come from the type's usual defaults above. Common
 * practice, no published source: the maker confirms each field.
 */
export function startingProfile(type: ProductType, markets: ComplianceMarket[]): Profile {
  const inBath = BATH_PRODUCT_TYPES.includes(type);
  const { lips, eyeArea } = impliedContact(type);
  const { use, ifraCategory } = TYPE_DEFAULTS[type];
  return {
    use,
    contact: { mucousMembranes: false, eyeArea, lips },
    inBath,
    adultsOnly: false,
    soldAsSoap: false,
    ifraCategory,
    markets,
    unitMassGrams: null,
    netQuantity: null,
  };
}
