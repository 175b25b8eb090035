import * as z from 'zod';
import { gs1CheckDigit } from '../compliance/gs1-element-string';
import type { ComplianceMarket } from '../reference-data/reference-row';
import { optionalText, requiredText, textField } from '../records/record-fields';

/**
 * Product identity: what a maker enters once per formula so its labels can carry what each market
 * asks for beyond the engine's declarations, warnings and net quantity. The workshop's own name and
 * address live on the workshop, not here.
 *
 * Only the product name, product code and durability are required everywhere; the rest is asked for
 * by the markets a label is printed for, through {@link missingForMarket}.
 */

/** Longest product name as printed. */
export const PRODUCT_NAME_MAX = 120;
/** Longest product code: short enough to print beside the lot code. */
export const PRODUCT_CODE_MAX = 20;
/** Longest directions, warnings or postal address. */
export const LABEL_TEXT_MAX = 1000;
/** Longest postal address. */
export const POSTAL_ADDRESS_MAX = 300;
/** Shelf life bounds in whole months. */
export const SHELF_LIFE_MONTHS = { min: 1, max: 120 } as const;
/** Period-after-opening bounds in whole months (the PAO symbol, e.g. 12M). */
export const PAO_MONTHS = { min: 1, max: 60 } as const;
/**
 * Above this minimum durability an EU/UK label carries the period after opening instead of a date
 * of minimum durability (Regulation (EC) No 1223/2009, Art. 19(1)(c)).
 */
export const EU_DATE_OF_MINIMUM_DURABILITY_MAX_MONTHS = 30;

/** Where each requirement comes from, as shown beside a missing item. */
export const PRODUCT_IDENTITY_SOURCES = {
  /**
   * MoCRA added FD&C Act §609 (Labeling, 21 U.S.C. 364e); §609(a) asks for a domestic address,
   * domestic phone number or electronic contact information (which may include a website) through
   * which the responsible person can receive adverse event reports. §604 (21 U.S.C. 364) only
   * defines "adverse event" and "responsible person".
   */
  usAdverseEventContact:
    'FD&C Act §609(a), 21 U.S.C. 364e(a) (Modernization of Cosmetics Regulation Act of 2022)',
  euResponsiblePerson: 'Regulation (EC) No 1223/2009, Art. 4 and Art. 19(1)(a)',
  ukResponsiblePerson:
    'UK Cosmetics Regulation (retained Regulation (EC) No 1223/2009), Art. 4 and Art. 19(1)(a)',
  euPeriodAfterOpening: 'Regulation (EC) No 1223/2009, Art. 19(1)(c) and Annex VII',
  ukPeriodAfterOpening:
    'UK Cosmetics Regulation (retained Regulation (EC) No 1223/2009), Art. 19(1)(c) and Annex VII',
  caProductName: 'Consumer Packaging and Labelling Regulations (C.R.C., c. 417), s. 6(2)',
  caDirectionsAndWarnings:
    'Cosmetic Regulations (C.R.C., c. 869): directions and warnings for safe use in English and French',
} as const;

/** Why a GTIN cannot be used, or null when its length and GS1 check digit are right. */
export function gtinProblem(gtin: string): string | null {
  if (!/^(\d{8}|\d{12}|\d{13}|\d{14})$/.test(gtin))
    return 'A GTIN has 8, 12, 13 or 14 digits (digits only), including the check digit';
  const expected = gs1CheckDigit(gtin.slice(0, -1));
  const given = gtin.slice(-1);
  return Number(given) === expected
    ? null
    : `The GTIN's check digit should be ${expected}, not ${given}: check the number`;
}

/** The PAO symbol's text: 12 months is "12M". */
export function periodAfterOpeningText(months: number): string {
  return `${months}M`;
}

/** An optional number of whole months in a range; missing or null means not given. */
function optionalMonths(what: string, bounds: { min: number; max: number }) {
  const range = `${bounds.min} to ${bounds.max} months`;
  return z
    .number({ error: `Enter the ${what} as a whole number of months` })
    .int({ error: `Enter the ${what} as a whole number of months` })
    .min(bounds.min, { error: `The ${what} must be ${range}` })
    .max(bounds.max, { error: `The ${what} must be ${range}` })
    .nullish()
    .transform((v) => v ?? null);
}

const productCode = requiredText('Product code', PRODUCT_CODE_MAX).superRefine((code, ctx) => {
  const bad = [...new Set([...code].filter((c) => !/[A-Za-z0-9-]/.test(c)))];
  if (bad.length > 0)
    ctx.addIssue({
      code: 'custom',
      message: `Product code can only hold letters, digits and '-', not ${bad
        .map((c) => (c === ' ' ? 'a space' : `'${c}'`))
        .join(', ')}`,
    });
});

const gtin = textField('GTIN')
  .trim()
  .nullish()
  .transform((v) => (v ? v : null))
  .superRefine((value, ctx) => {
    const problem = value === null ? null : gtinProblem(value);
    if (problem) ctx.addIssue({ code: 'custom', message: problem });
  });

/** A US ZIP code (or ZIP+4) somewhere in the address: the loose sign of a full US mailing address. */
const US_ZIP = /\b\d{5}(?:-\d{4})?\b/;

const usAddress = optionalText('US address for adverse-event reports', POSTAL_ADDRESS_MAX).refine(
  (v) => v === null || US_ZIP.test(v),
  { error: 'Enter a full US mailing address, with its ZIP code' },
);

/**
 * A US phone number: 10 digits with an area code that starts 2 to 9 (North American Numbering
 * Plan), optionally after a leading 1 or +1, written with spaces, dots, dashes or brackets.
 */
function isUsPhone(value: string): boolean {
  if (!/^\+?[\d\s().-]+$/.test(value)) return false;
  const digits = value.replace(/\D/g, '');
  const national = digits.length === 11 && digits.startsWith('1') ? digits.slice(1) : digits;
  if (value.startsWith('+') && digits.length !== 11) return false;
  return /^[2-9]\d{9}$/.test(national);
}

const usPhone = optionalText('US phone number for adverse-event reports', 30).refine(
  (v) => v === null || isUsPhone(v),
  { error: 'Enter a US phone number with its area code, such as 1-800-555-0100' },
);

/** A web address with or without http(s)://: a host name with a dot, no spaces. */
const WEB_ADDRESS =
  /^(?:https?:\/\/)?(?:[a-z0-9](?:[a-z0-9-]*[a-z0-9])?\.)+[a-z]{2,}(?::\d{1,5})?(?:[/?#]\S*)?$/i;

const website = optionalText('Web address for adverse-event reports', 200).refine(
  (v) => v === null || WEB_ADDRESS.test(v),
  { error: 'Enter a web address such as example.com/safety' },
);

/** The US adverse-event contact (MoCRA): any one of the three is enough. */
export const usAdverseEventContactSchema = z
  .object({
    address: usAddress,
    phone: usPhone,
    website,
  })
  .prefault({});

function responsiblePersonSchema(region: 'EU' | 'UK') {
  return z
    .object({
      name: optionalText(`${region} responsible person's name`, 200),
      address: optionalText(`${region} responsible person's postal address`, POSTAL_ADDRESS_MAX),
    })
    .prefault({});
}

/** The French text a maker enters for Canadian labels; English-only labels leave it empty. */
export const canadianFrenchSchema = z
  .object({
    productName: optionalText('Product name in French', PRODUCT_NAME_MAX),
    warnings: optionalText('Warnings in French', LABEL_TEXT_MAX),
    directions: optionalText('Directions for use in French', LABEL_TEXT_MAX),
  })
  .prefault({});

/** A formula's product identity, as entered by the maker. */
export const productIdentitySchema = z
  .object({
    /** The product name exactly as printed on the principal display panel. */
    productName: requiredText('Product name', PRODUCT_NAME_MAX),
    /** The maker's own short code: letters, digits and '-', up to 20 characters. */
    productCode,
    /** GTIN-8, -12, -13 or -14 with a correct GS1 check digit, or null. */
    gtin,
    /** Minimum durability from manufacture, in whole months (1 to 120). */
    shelfLifeMonths: optionalMonths('shelf life', SHELF_LIFE_MONTHS),
    /** Period after opening for the PAO symbol, in whole months (1 to 60). */
    periodAfterOpeningMonths: optionalMonths('period after opening', PAO_MONTHS),
    /** Directions for use in English, or null. */
    directions: optionalText('Directions for use', LABEL_TEXT_MAX),
    /** Where the US responsible person receives adverse-event reports (MoCRA). */
    usAdverseEventContact: usAdverseEventContactSchema,
    /** The EU responsible person, established in the EU (Art. 4). */
    euResponsiblePerson: responsiblePersonSchema('EU'),
    /** The UK responsible person, established in the UK (UK Cosmetics Regulation, Art. 4). */
    ukResponsiblePerson: responsiblePersonSchema('UK'),
    /** Canadian French text entered by the maker. */
    canadianFrench: canadianFrenchSchema,
  })
  .superRefine((identity, ctx) => {
    if (identity.shelfLifeMonths === null && identity.periodAfterOpeningMonths === null)
      ctx.addIssue({
        code: 'custom',
        path: ['shelfLifeMonths'],
        message: 'Enter a shelf life, a period after opening, or both',
      });
  });

/** Product identity as sent by a form. */
export type ProductIdentityInput = z.input<typeof productIdentitySchema>;
/** Product identity after parsing: text trimmed, empty fields null. */
export type ProductIdentity = z.output<typeof productIdentitySchema>;

/** One element a label for a market still lacks. */
export interface MissingLabelElement {
  /** Path of the field to fill in, e.g. `euResponsiblePerson.address`. */
  field: string;
  /** What is missing, in plain words. */
  item: string;
  /** The rule that asks for it. */
  source: string;
}

/** What the rest of the label carries, when it bears on what the identity must supply. */
export interface LabelContext {
  /** The English warnings the engine puts on the label (Canada then needs them in French). */
  englishWarnings?: readonly string[];
}

function responsiblePersonGaps(
  person: ProductIdentity['euResponsiblePerson'],
  region: 'EU' | 'UK',
  source: string,
): MissingLabelElement[] {
  const key = region === 'EU' ? 'euResponsiblePerson' : 'ukResponsiblePerson';
  const missing: MissingLabelElement[] = [];
  if (!person.name)
    missing.push({ field: `${key}.name`, item: `The ${region} responsible person's name`, source });
  if (!person.address)
    missing.push({
      field: `${key}.address`,
      item: `The ${region} responsible person's postal address`,
      source,
    });
  return missing;
}

function periodAfterOpeningGap(identity: ProductIdentity, source: string): MissingLabelElement[] {
  const { shelfLifeMonths, periodAfterOpeningMonths } = identity;
  if (
    periodAfterOpeningMonths !== null ||
    shelfLifeMonths === null ||
    shelfLifeMonths <= EU_DATE_OF_MINIMUM_DURABILITY_MAX_MONTHS
  )
    return [];
  return [
    {
      field: 'periodAfterOpeningMonths',
      item: `A period after opening (PAO symbol): the shelf life is more than ${EU_DATE_OF_MINIMUM_DURABILITY_MAX_MONTHS} months`,
      source,
    },
  ];
}

/**
 * What a label for `market` still lacks from the product identity, each with its source; empty
 * when nothing is missing. Declarations, warnings and net quantity come from the engine and are not
 * checked here.
 */
export function missingForMarket(
  identity: ProductIdentity,
  market: ComplianceMarket,
  label: LabelContext = {},
): MissingLabelElement[] {
  const sources = PRODUCT_IDENTITY_SOURCES;
  switch (market) {
    case 'US': {
      const { address, phone, website: web } = identity.usAdverseEventContact;
      return address || phone || web
        ? []
        : [
            {
              field: 'usAdverseEventContact',
              item: 'A US address, US phone number or web address for adverse-event reports',
              source: sources.usAdverseEventContact,
            },
          ];
    }
    case 'EU':
      return [
        ...responsiblePersonGaps(identity.euResponsiblePerson, 'EU', sources.euResponsiblePerson),
        ...periodAfterOpeningGap(identity, sources.euPeriodAfterOpening),
      ];
    case 'UK':
      return [
        ...responsiblePersonGaps(identity.ukResponsiblePerson, 'UK', sources.ukResponsiblePerson),
        ...periodAfterOpeningGap(identity, sources.ukPeriodAfterOpening),
      ];
    case 'CA': {
      const french = identity.canadianFrench;
      const missing: MissingLabelElement[] = [];
      if (!french.productName)
        missing.push({
          field: 'canadianFrench.productName',
          item: 'The product name in French',
          source: sources.caProductName,
        });
      if (identity.directions && !french.directions)
        missing.push({
          field: 'canadianFrench.directions',
          item: 'The directions for use in French',
          source: sources.caDirectionsAndWarnings,
        });
      if ((label.englishWarnings ?? []).length > 0 && !french.warnings)
        missing.push({
          field: 'canadianFrench.warnings',
          item: 'The warnings in French',
          source: sources.caDirectionsAndWarnings,
        });
      return missing;
    }
  }
}
