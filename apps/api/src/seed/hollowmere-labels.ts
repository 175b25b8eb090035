import type { ProductIdentityInput } from '@batchproof/shared';

/**
 * What Hollowmere Bathworks' labels carry beyond the engine's output. Every name, address and
 * number here is invented; the US phone numbers are in the 555-01xx range kept for fiction, and
 * the GTINs use the GS1 prefix 952, which GS1 keeps for demonstrations and examples (from memory).
 */
export const demoWorkshopAddress = '14 Tannery Lane, Wrenfield, VT 05099, USA';

const contacts = {
  usAdverseEventContact: {
    address: null,
    phone: '1-800-555-0147',
    website: 'hollowmere.example/safety',
  },
  euResponsiblePerson: {
    name: 'Lindqvist Cosmetic Responsibility B.V.',
    address: 'Havenkade 8, 1234 AB Demodam, Netherlands',
  },
  ukResponsiblePerson: {
    name: 'Hartwell Product Safety Ltd',
    address: '4 Mill Yard, Wrenfield WF1 2AB, United Kingdom',
  },
} satisfies Partial<ProductIdentityInput>;

const bathDirections = 'Drop into a warm bath and let it fizz. Rinse the bath afterwards.';
const bathDirectionsFr =
  'Déposer dans un bain chaud et laisser pétiller. Rincer la baignoire ensuite.';
const warningsFr = 'Éviter le contact avec les yeux. Cesser l’utilisation en cas d’irritation.';

/** Product identities by demo formula name. */
export const demoIdentities: Record<string, ProductIdentityInput> = {
  'Orchard Fog Fizzer': {
    productName: 'Orchard Fog Bath Fizzer',
    productCode: 'HB-OFF',
    gtin: '9524001000018',
    shelfLifeMonths: 12,
    periodAfterOpeningMonths: null,
    directions: bathDirections,
    ...contacts,
    canadianFrench: {
      productName: 'Bombe de bain Brume du verger',
      warnings: warningsFr,
      directions: bathDirectionsFr,
    },
  },
  'Rainfall Foaming Fizzer': {
    productName: 'Rainfall Foaming Bath Fizzer',
    productCode: 'HB-RFF',
    gtin: '9524001000025',
    shelfLifeMonths: 12,
    periodAfterOpeningMonths: null,
    directions: 'Drop into running bath water for foam. Rinse the bath afterwards.',
    ...contacts,
    canadianFrench: {
      productName: 'Bombe de bain moussante Averse',
      warnings: warningsFr,
      directions: 'Déposer sous l’eau du bain qui coule. Rincer la baignoire ensuite.',
    },
  },
  'Midnight Bubble Bar': {
    productName: 'Midnight Bubble Bar',
    productCode: 'HB-MBB',
    gtin: '9524001000032',
    shelfLifeMonths: 12,
    periodAfterOpeningMonths: null,
    directions: 'Crumble under running bath water.',
    ...contacts,
    canadianFrench: {
      productName: 'Barre moussante Minuit',
      warnings: warningsFr,
      directions: 'Émietter sous l’eau du bain qui coule.',
    },
  },
  'Lavender Oat Bath Salts': {
    productName: 'Lavender Oat Bath Salts',
    productCode: 'HB-LOS',
    gtin: '9524001000049',
    shelfLifeMonths: 24,
    periodAfterOpeningMonths: 12,
    directions: 'Dissolve two spoonfuls in a warm bath.',
    ...contacts,
    canadianFrench: {
      productName: 'Sels de bain lavande et avoine',
      warnings: warningsFr,
      directions: 'Dissoudre deux cuillerées dans un bain chaud.',
    },
  },
  'Everyday Body Lotion': {
    productName: 'Everyday Body Lotion',
    productCode: 'HB-EBL',
    gtin: '9524001000056',
    shelfLifeMonths: 18,
    periodAfterOpeningMonths: 6,
    directions: 'Smooth onto clean skin as often as you like.',
    ...contacts,
    canadianFrench: {
      productName: 'Lotion corporelle de tous les jours',
      warnings: warningsFr,
      directions: 'Appliquer sur une peau propre aussi souvent que désiré.',
    },
  },
};
