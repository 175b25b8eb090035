import type { ComplianceMarket, FormulaVersionInput, ProductType } from '@batchproof/shared';

/** Product types in the maker's words. */
export const PRODUCT_TYPE_LABELS: Record<ProductType, string> = {
  fizzer: 'Fizzer (bath bomb)',
  'foaming-fizzer': 'Foaming fizzer',
  'bubble-bar': 'Bubble bar',
  'bath-salts': 'Bath salts',
  'shower-steamer': 'Shower steamer',
  soap: 'Soap',
  lotion: 'Lotion',
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

/**
 * A starting profile for a new formula of `type`: bath products sit in the bath water (mucous
 * membrane contact) and most fragrance certificates place them in IFRA Category 9; a body lotion is
 * leave-on, Category 5A. Common practice, no published source: the maker confirms each field.
 */
export function startingProfile(type: ProductType, markets: ComplianceMarket[]): Profile {
  const inBath =
    type === 'fizzer' ||
    type === 'foaming-fizzer' ||
    type === 'bubble-bar' ||
    type === 'bath-salts';
  const leaveOn = type === 'lotion';
  return {
    use: leaveOn ? 'leave-on' : 'rinse-off',
    contact: { mucousMembranes: inBath, eyeArea: false, lips: false },
    inBath,
    adultsOnly: false,
    ifraCategory: leaveOn ? '5A' : '9',
    markets,
    unitMassGrams: null,
    netQuantity: null,
  };
}
