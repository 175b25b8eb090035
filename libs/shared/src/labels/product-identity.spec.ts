import { describe, expect, it } from 'vitest';
import {
  gtinProblem,
  missingForMarket,
  periodAfterOpeningText,
  productIdentitySchema,
  PRODUCT_IDENTITY_SOURCES,
  type ProductIdentity,
  type ProductIdentityInput,
} from './product-identity';

const minimal: ProductIdentityInput = {
  productName: 'Lavender Foaming Fizzer',
  productCode: 'FIZ-LAV-01',
  shelfLifeMonths: 18,
};

function parse(input: ProductIdentityInput): ProductIdentity {
  return productIdentitySchema.parse(input);
}

function fieldMessages(input: unknown): Record<string, string[]> {
  const result = productIdentitySchema.safeParse(input);
  if (result.success) return {};
  const byField: Record<string, string[]> = {};
  for (const issue of result.error.issues)
    (byField[issue.path.join('.')] ??= []).push(issue.message);
  return byField;
}

const complete: ProductIdentityInput = {
  ...minimal,
  gtin: '4006381333931',
  periodAfterOpeningMonths: 12,
  directions: 'Drop into a warm bath.',
  usAdverseEventContact: { phone: '1-800-555-0100' },
  euResponsiblePerson: {
    name: 'Example RP GmbH',
    address: 'Musterstraße 1, 10115 Berlin, Germany',
  },
  ukResponsiblePerson: { name: 'Example RP Ltd', address: '1 High Street, Leeds LS1 1AA' },
  canadianFrench: {
    productName: 'Pétillant moussant à la lavande',
    warnings: 'Garder hors de la portée des enfants.',
    directions: 'Déposer dans un bain chaud.',
  },
};

describe('GTIN (GS1 General Specifications §7.9.1 check digit)', () => {
  it.each([
    // The GS1 General Specifications worked examples used in gs1-element-string.spec.ts
    ['4006381333931', 'GTIN-13, §7.9.1 worked example 2'],
    ['6291041500213', 'GTIN-13, §7.9.1 worked example 3'],
    ['09521234543213', 'GTIN-14 [CALC] §7.9 mod-10 calculation'],
    ['9521234543213', 'the same number as a GTIN-13 (leading zero dropped) [CALC]'],
    // [CALC] hand-checked with weights 3,1,3… from the right: 036000291452 sums 58 → 2; 96385074 sums 86 → 4
    ['036000291452', 'GTIN-12 [CALC]'],
    ['96385074', 'GTIN-8 [CALC]'],
  ])('accepts %s (%s)', (gtin) => {
    expect(gtinProblem(gtin)).toBeNull();
    expect(parse({ ...minimal, gtin }).gtin).toBe(gtin);
  });

  it('refuses a wrong check digit and names the expected one', () => {
    // GS1 General Specifications §7.9.1, worked example 2 with its last digit mistyped
    expect(fieldMessages({ ...minimal, gtin: '4006381333932' })).toEqual({
      gtin: ["The GTIN's check digit should be 1, not 2: check the number"],
    });
    expect(fieldMessages({ ...minimal, gtin: '09521234543214' })).toEqual({
      gtin: ["The GTIN's check digit should be 3, not 4: check the number"],
    });
  });

  it('accepts only 8, 12, 13 or 14 digits', () => {
    const lengthMessage =
      'A GTIN has 8, 12, 13 or 14 digits (digits only), including the check digit';
    for (const gtin of [
      '1234567',
      '4006381333',
      '400638133393100',
      '400638133393A',
      '4006 3813 3393 1',
    ])
      expect(fieldMessages({ ...minimal, gtin })).toEqual({ gtin: [lengthMessage] });
  });

  it('treats an empty or missing GTIN as none, and trims one that is given', () => {
    expect(parse({ ...minimal, gtin: '' }).gtin).toBeNull();
    expect(parse({ ...minimal, gtin: null }).gtin).toBeNull();
    expect(parse(minimal).gtin).toBeNull();
    expect(parse({ ...minimal, gtin: ' 4006381333931 ' }).gtin).toBe('4006381333931');
  });
});

describe('durability: shelf life and period after opening', () => {
  it('accepts shelf life 1 to 120 whole months and refuses beyond', () => {
    expect(parse({ ...minimal, shelfLifeMonths: 1 }).shelfLifeMonths).toBe(1);
    expect(parse({ ...minimal, shelfLifeMonths: 120 }).shelfLifeMonths).toBe(120);
    expect(fieldMessages({ ...minimal, shelfLifeMonths: 0 })).toEqual({
      shelfLifeMonths: ['The shelf life must be 1 to 120 months'],
    });
    expect(fieldMessages({ ...minimal, shelfLifeMonths: 121 })).toEqual({
      shelfLifeMonths: ['The shelf life must be 1 to 120 months'],
    });
    expect(fieldMessages({ ...minimal, shelfLifeMonths: 6.5 })).toEqual({
      shelfLifeMonths: ['Enter the shelf life as a whole number of months'],
    });
  });

  it('accepts a period after opening of 1 to 60 whole months and refuses beyond', () => {
    const pao = (months: unknown) => ({
      ...minimal,
      shelfLifeMonths: null,
      periodAfterOpeningMonths: months,
    });
    expect(parse(pao(1) as ProductIdentityInput).periodAfterOpeningMonths).toBe(1);
    expect(parse(pao(60) as ProductIdentityInput).periodAfterOpeningMonths).toBe(60);
    expect(fieldMessages(pao(0))).toEqual({
      periodAfterOpeningMonths: ['The period after opening must be 1 to 60 months'],
    });
    expect(fieldMessages(pao(61))).toEqual({
      periodAfterOpeningMonths: ['The period after opening must be 1 to 60 months'],
    });
    expect(fieldMessages(pao('12M'))).toEqual({
      periodAfterOpeningMonths: ['Enter the period after opening as a whole number of months'],
    });
  });

  it('accepts both, and asks for one when neither is given', () => {
    const both = parse({ ...minimal, shelfLifeMonths: 24, periodAfterOpeningMonths: 12 });
    expect([both.shelfLifeMonths, both.periodAfterOpeningMonths]).toEqual([24, 12]);
    expect(fieldMessages({ ...minimal, shelfLifeMonths: null })).toEqual({
      shelfLifeMonths: ['Enter a shelf life, a period after opening, or both'],
    });
  });

  it('writes the PAO symbol text as months followed by M', () => {
    // Regulation (EC) No 1223/2009, Annex VII point 2: the open-jar symbol with the period, e.g. 12M
    expect(periodAfterOpeningText(12)).toBe('12M');
  });
});

describe('field messages by path', () => {
  it('asks for the product name and product code', () => {
    expect(fieldMessages({ shelfLifeMonths: 12 })).toEqual({
      productName: ['Product name is required'],
      productCode: ['Product code is required'],
    });
    expect(fieldMessages({ ...minimal, productName: '   ' })).toEqual({
      productName: ['Product name is required'],
    });
  });

  it('keeps the product code to letters, digits and dashes, at most 20', () => {
    expect(fieldMessages({ ...minimal, productCode: 'FIZ LAV/01' })).toEqual({
      productCode: ["Product code can only hold letters, digits and '-', not a space, '/'"],
    });
    expect(fieldMessages({ ...minimal, productCode: 'A'.repeat(21) })).toEqual({
      productCode: ['Product code is too long (20 characters at most)'],
    });
    expect(parse({ ...minimal, productCode: 'A'.repeat(20) }).productCode).toHaveLength(20);
  });

  it('refuses NUL and lone surrogates through the shared text rule', () => {
    expect(fieldMessages({ ...minimal, productName: 'Fizz\u0000' })).toEqual({
      productName: [
        'Product name contains a character that cannot be stored (a NUL or a broken Unicode character)',
      ],
    });
    expect(
      fieldMessages({ ...minimal, canadianFrench: { productName: 'P\uD800tillant' } }),
    ).toEqual({
      'canadianFrench.productName': [
        'Product name in French contains a character that cannot be stored (a NUL or a broken Unicode character)',
      ],
    });
  });

  it('checks the shape of the US adverse-event contact loosely', () => {
    expect(
      fieldMessages({
        ...minimal,
        usAdverseEventContact: {
          address: '12 Main Street, Springfield',
          phone: '+44 20 7946 0000',
          website: 'call us',
        },
      }),
    ).toEqual({
      'usAdverseEventContact.address': ['Enter a full US mailing address, with its ZIP code'],
      'usAdverseEventContact.phone': [
        'Enter a US phone number with its area code, such as 1-800-555-0100',
      ],
      'usAdverseEventContact.website': ['Enter a web address such as example.com/safety'],
    });
    const fine = parse({
      ...minimal,
      usAdverseEventContact: {
        address: '12 Main Street, Springfield, IL 62701-1234',
        phone: '(217) 555-0100',
        website: 'https://example.com/safety',
      },
    }).usAdverseEventContact;
    expect(fine.phone).toBe('(217) 555-0100');
    for (const phone of ['+1 217 555 0100', '217.555.0100', '2175550100'])
      expect(fieldMessages({ ...minimal, usAdverseEventContact: { phone } })).toEqual({});
    for (const site of ['example.com', 'www.example.co.uk/contact?x=1'])
      expect(fieldMessages({ ...minimal, usAdverseEventContact: { website: site } })).toEqual({});
  });

  it('reads empty optional text as none and fills absent groups with nulls', () => {
    const identity = parse({ ...minimal, directions: '  ', euResponsiblePerson: { name: '' } });
    expect(identity.directions).toBeNull();
    expect(identity.euResponsiblePerson).toEqual({ name: null, address: null });
    expect(identity.usAdverseEventContact).toEqual({ address: null, phone: null, website: null });
    expect(identity.canadianFrench).toEqual({
      productName: null,
      warnings: null,
      directions: null,
    });
  });
});

describe('missingForMarket', () => {
  const bare = parse(minimal);

  it('finds nothing missing in a complete identity for any market', () => {
    const identity = parse(complete);
    for (const market of ['US', 'EU', 'UK', 'CA'] as const)
      expect(
        missingForMarket(identity, market, { englishWarnings: ['Keep out of reach'] }),
      ).toEqual([]);
  });

  it('US: asks for the adverse-event contact', () => {
    // FD&C Act §609(a), 21 U.S.C. 364e(a) (MoCRA): the label bears a domestic address, domestic
    // phone number or electronic contact information (which may include a website) through which
    // the responsible person can receive adverse event reports [wording confirmed by search]
    expect(missingForMarket(bare, 'US')).toEqual([
      {
        field: 'usAdverseEventContact',
        item: 'A US address, US phone number or web address for adverse-event reports',
        source: PRODUCT_IDENTITY_SOURCES.usAdverseEventContact,
      },
    ]);
    expect(PRODUCT_IDENTITY_SOURCES.usAdverseEventContact).toMatch(/§609\(a\), 21 U\.S\.C\. 364e/);
    // Any one of the three is enough
    for (const contact of [
      { address: '12 Main Street, Springfield, IL 62701' },
      { phone: '1-800-555-0100' },
      { website: 'example.com/safety' },
    ])
      expect(missingForMarket(parse({ ...minimal, usAdverseEventContact: contact }), 'US')).toEqual(
        [],
      );
  });

  it("EU: asks for the responsible person's name and address", () => {
    // Regulation (EC) No 1223/2009, Art. 4 (responsible person) and Art. 19(1)(a) (name and address on the label)
    expect(missingForMarket(bare, 'EU')).toEqual([
      {
        field: 'euResponsiblePerson.name',
        item: "The EU responsible person's name",
        source: 'Regulation (EC) No 1223/2009, Art. 4 and Art. 19(1)(a)',
      },
      {
        field: 'euResponsiblePerson.address',
        item: "The EU responsible person's postal address",
        source: 'Regulation (EC) No 1223/2009, Art. 4 and Art. 19(1)(a)',
      },
    ]);
    // Regulation (EC) No 1223/2009, Art. 19(1)(a): the address alone is still missing after the name
    expect(
      missingForMarket(
        parse({ ...minimal, euResponsiblePerson: { name: 'Example RP GmbH' } }),
        'EU',
      ).map((m) => m.field),
    ).toEqual(['euResponsiblePerson.address']);
  });

  it('UK: asks for the UK responsible person, not the EU one', () => {
    // UK Cosmetics Regulation (retained Regulation (EC) No 1223/2009), Art. 4 and Art. 19(1)(a)
    const euOnly = parse({ ...minimal, euResponsiblePerson: complete.euResponsiblePerson });
    expect(missingForMarket(euOnly, 'UK')).toEqual([
      {
        field: 'ukResponsiblePerson.name',
        item: "The UK responsible person's name",
        source: PRODUCT_IDENTITY_SOURCES.ukResponsiblePerson,
      },
      {
        field: 'ukResponsiblePerson.address',
        item: "The UK responsible person's postal address",
        source: PRODUCT_IDENTITY_SOURCES.ukResponsiblePerson,
      },
    ]);
    expect(PRODUCT_IDENTITY_SOURCES.ukResponsiblePerson).toMatch(
      /UK Cosmetics Regulation.*Art\. 19\(1\)\(a\)/,
    );
  });

  it('EU/UK: asks for a period after opening when the shelf life is over 30 months', () => {
    // Regulation (EC) No 1223/2009, Art. 19(1)(c): a date of minimum durability up to 30 months;
    // beyond that, the period after opening (Annex VII symbol)
    const people = {
      euResponsiblePerson: complete.euResponsiblePerson,
      ukResponsiblePerson: complete.ukResponsiblePerson,
    };
    const long = parse({ ...minimal, ...people, shelfLifeMonths: 36 });
    expect(missingForMarket(long, 'EU')).toEqual([
      {
        field: 'periodAfterOpeningMonths',
        item: 'A period after opening (PAO symbol): the shelf life is more than 30 months',
        source: 'Regulation (EC) No 1223/2009, Art. 19(1)(c) and Annex VII',
      },
    ]);
    expect(missingForMarket(long, 'UK').map((m) => m.source)).toEqual([
      PRODUCT_IDENTITY_SOURCES.ukPeriodAfterOpening,
    ]);
    expect(missingForMarket(parse({ ...minimal, ...people, shelfLifeMonths: 30 }), 'EU')).toEqual(
      [],
    );
    expect(
      missingForMarket(
        parse({ ...minimal, ...people, shelfLifeMonths: 36, periodAfterOpeningMonths: 12 }),
        'EU',
      ),
    ).toEqual([]);
    // Not a US or Canadian requirement
    expect(missingForMarket(long, 'US').map((m) => m.field)).not.toContain(
      'periodAfterOpeningMonths',
    );
  });

  it('CA: asks for the French product name, and French directions and warnings when English ones are given', () => {
    // Consumer Packaging and Labelling Regulations, s. 6(2): product identity in both official languages (from memory)
    expect(missingForMarket(bare, 'CA')).toEqual([
      {
        field: 'canadianFrench.productName',
        item: 'The product name in French',
        source: 'Consumer Packaging and Labelling Regulations (C.R.C., c. 417), s. 6(2)',
      },
    ]);
    // Cosmetic Regulations (C.R.C., c. 869): directions and warnings for safe use in English and French
    // (Health Canada, Industry Guide for the labelling of cosmetics)
    const english = parse({
      ...minimal,
      directions: 'Drop into a warm bath.',
      canadianFrench: { productName: 'Pétillant moussant' },
    });
    expect(
      missingForMarket(english, 'CA', { englishWarnings: ['Keep out of reach of children.'] }),
    ).toEqual([
      {
        field: 'canadianFrench.directions',
        item: 'The directions for use in French',
        source: PRODUCT_IDENTITY_SOURCES.caDirectionsAndWarnings,
      },
      {
        field: 'canadianFrench.warnings',
        item: 'The warnings in French',
        source: PRODUCT_IDENTITY_SOURCES.caDirectionsAndWarnings,
      },
    ]);
    // No English warnings on the label: no French ones asked for
    expect(missingForMarket(english, 'CA').map((m) => m.field)).toEqual([
      'canadianFrench.directions',
    ]);
  });
});
