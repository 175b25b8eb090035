import { PRODUCT_IDENTITY_SOURCES } from '@batchproof/shared';

/** One field of the product identity form; `path` is the contract's dotted path and the input's id. */
export interface IdentityField {
  path: string;
  label: string;
  hint?: string;
  /** A text area for longer text. */
  multiline?: boolean;
  /** A whole number of months. */
  months?: boolean;
  autocomplete?: string;
}

/** A group of fields under one heading, with the rule that asks for them. */
export interface IdentitySection {
  id: string;
  heading: string;
  /** Which labels need it and why, in plain words. */
  intro: string;
  source?: string;
  fields: IdentityField[];
}

const S = PRODUCT_IDENTITY_SOURCES;

/** The product identity form, section by section, in the order a maker fills it in. */
export const IDENTITY_SECTIONS: readonly IdentitySection[] = [
  {
    id: 'product',
    heading: 'Product',
    intro: 'The name exactly as the front of the label prints it, and your own product code.',
    fields: [
      { path: 'productName', label: 'Product name' },
      {
        path: 'productCode',
        label: 'Product code',
        hint: "Letters, digits and '-', up to 20 characters.",
      },
      {
        path: 'gtin',
        label: 'GTIN (optional)',
        hint: 'The 8, 12, 13 or 14 digits under your barcode, check digit included.',
      },
    ],
  },
  {
    id: 'durability',
    heading: 'Shelf life and period after opening',
    intro:
      'A shelf life gives a best-before date from the day of printing; the period after opening prints as the open-jar symbol (12M).',
    source: S.euPeriodAfterOpening,
    fields: [
      { path: 'shelfLifeMonths', label: 'Shelf life (months)', months: true },
      { path: 'periodAfterOpeningMonths', label: 'Period after opening (months)', months: true },
    ],
  },
  {
    id: 'directions',
    heading: 'Directions for use',
    intro: 'How to use the product safely, in English.',
    fields: [{ path: 'directions', label: 'Directions for use', multiline: true }],
  },
  {
    id: 'us',
    heading: 'US adverse-event contact',
    intro:
      'Labels for the US carry a US address, a US phone number or a web address where people can report a reaction. One is enough.',
    source: S.usAdverseEventContact,
    fields: [
      { path: 'usAdverseEventContact.address', label: 'US mailing address', multiline: true },
      { path: 'usAdverseEventContact.phone', label: 'US phone number', autocomplete: 'tel' },
      { path: 'usAdverseEventContact.website', label: 'Web address', autocomplete: 'url' },
    ],
  },
  {
    id: 'eu',
    heading: 'EU responsible person',
    intro: 'Labels for the EU name the responsible person established in the EU, with an address.',
    source: S.euResponsiblePerson,
    fields: [
      { path: 'euResponsiblePerson.name', label: "EU responsible person's name" },
      { path: 'euResponsiblePerson.address', label: 'Postal address', multiline: true },
    ],
  },
  {
    id: 'uk',
    heading: 'UK responsible person',
    intro: 'Labels for the UK name the responsible person established in the UK, with an address.',
    source: S.ukResponsiblePerson,
    fields: [
      { path: 'ukResponsiblePerson.name', label: "UK responsible person's name" },
      { path: 'ukResponsiblePerson.address', label: 'Postal address', multiline: true },
    ],
  },
  {
    id: 'ca',
    heading: 'Canadian French text',
    intro:
      'Labels for Canada carry the product name, and the directions and warnings, in French too. Batchproof does not translate: enter the French you will print.',
    source: `${S.caProductName}; ${S.caDirectionsAndWarnings}`,
    fields: [
      { path: 'canadianFrench.productName', label: 'Product name in French' },
      { path: 'canadianFrench.directions', label: 'Directions for use in French', multiline: true },
      { path: 'canadianFrench.warnings', label: 'Warnings in French', multiline: true },
    ],
  },
];
