import { describe, expect, it } from 'vitest';
import { evaluateFormula } from '../compliance/evaluate-formula';
import {
  aBathBomb,
  aBodyLotion,
  aFormula,
  aFragranceLine,
  aLine,
} from '../compliance/formula-builders';
import { netQuantityStatement } from '../compliance/net-quantity-statement';
import type { ComplianceMarket } from '../reference-data/reference-row';
import { US_FOAMING_BATH_CAUTION } from '../reference-data/required-warnings';
import {
  buildLabelContent,
  LABEL_FIELD_KEYS,
  missingLabelElements,
  type LabelContent,
  type LabelContentInput,
  type LabelFieldKey,
} from './label-content';
import { bestBeforeMonth, PAO_NOTE } from './label-durability';
import {
  productIdentitySchema,
  PRODUCT_IDENTITY_SOURCES,
  type ProductIdentityInput,
} from './product-identity';

/** A foaming bath fizzer with a fragrance, so the US and EU declarations differ. */
const fizzer = evaluateFormula(
  aFormula(
    [
      aLine(60, 'Sodium Bicarbonate'),
      aLine(26, 'Citric Acid'),
      aLine(12, 'Sodium Lauryl Sulfoacetate', { functions: ['surfactant - cleansing', 'foaming'] }),
      aFragranceLine(2, 'Lavender Oil', { '9': 10 }, [{ inci: 'Linalool', percent: 30 }]),
    ],
    aBathBomb(),
  ),
);

const identityInput: ProductIdentityInput = {
  productName: 'Lavender Foaming Fizzer',
  productCode: 'FIZ-LAV-01',
  gtin: '4006381333931',
  shelfLifeMonths: 18,
  periodAfterOpeningMonths: 12,
  directions: 'Drop one fizzer into a warm bath.',
  usAdverseEventContact: { phone: '1-800-555-0100', website: 'example.com/safety' },
  euResponsiblePerson: { name: 'Example RP GmbH', address: 'Musterstraße 1, 10115 Berlin' },
  ukResponsiblePerson: { name: 'Example RP Ltd', address: '1 High Street, Leeds LS1 1AA' },
  canadianFrench: {
    productName: 'Pétillant moussant à la lavande',
    warnings: 'Mise en garde : utiliser seulement selon le mode d’emploi.',
    directions: 'Déposer un pétillant dans un bain chaud.',
  },
};

function input(
  market: ComplianceMarket,
  overrides: Partial<LabelContentInput> = {},
  identity: Partial<ProductIdentityInput> = {},
): LabelContentInput {
  return {
    market,
    evaluation: fizzer,
    identity: productIdentitySchema.parse({ ...identityInput, ...identity }),
    workshop: { name: 'Hollowmere Bathworks', address: '12 Mill Lane, Hollowmere, VT 05001' },
    netQuantity: { amount: 113, unit: 'g' },
    lotCode: 'RF-0412',
    expiresOn: null,
    madeOn: '2026-12-02',
    areas: { pdpAreaSqIn: 8, labellingAreaSqIn: 16 },
    ...overrides,
  };
}

function texts(content: LabelContent): Partial<Record<LabelFieldKey, string>> {
  return Object.fromEntries(content.fields.map((f) => [f.key, f.text]));
}

function field(content: LabelContent, key: LabelFieldKey) {
  const found = content.fields.find((f) => f.key === key);
  if (!found) throw new Error(`no ${key} field`);
  return found;
}

describe('buildLabelContent: texts from the engine and the identity, unchanged', () => {
  it.each(['US', 'EU', 'UK', 'CA'] as const)(
    'prints the engine’s %s declaration exactly',
    (market) => {
      const declaration = fizzer.declarations[market]!.text;
      expect(field(buildLabelContent(input(market)), 'ingredients').text).toBe(declaration);
    },
  );

  it('keeps the markets’ own declarations apart (US "Fragrance", EU "Parfum" and its allergen)', () => {
    expect(field(buildLabelContent(input('US')), 'ingredients').text).toMatch(/Fragrance/);
    expect(field(buildLabelContent(input('EU')), 'ingredients').text).toMatch(/Parfum.*Linalool/);
  });

  it('puts the 21 CFR 740.17 caution on the US label in bold, and no warnings on the EU label', () => {
    // 21 CFR 740.17 (text from the engine); 21 CFR 740.2(a): bold
    const warnings = field(buildLabelContent(input('US')), 'warnings');
    expect(warnings.text).toBe(US_FOAMING_BATH_CAUTION);
    expect(warnings.bold).toBe(true);
    expect(fizzer.warnings.EU).toEqual([]);
    expect(texts(buildLabelContent(input('EU'))).warnings).toBeUndefined();
  });

  it('joins several engine warnings in the engine’s order', () => {
    const evaluation = { ...fizzer, warnings: { ...fizzer.warnings, US: ['First.', 'Second.'] } };
    expect(field(buildLabelContent(input('US', { evaluation })), 'warnings').text).toBe(
      'First. Second.',
    );
  });

  it('prints the engine’s net quantity statement for each market', () => {
    const statement = netQuantityStatement({ amount: 113, unit: 'g', pdpAreaSqIn: 8 });
    for (const market of ['US', 'EU', 'UK', 'CA'] as const)
      expect(field(buildLabelContent(input(market)), 'netQuantity').text).toBe(
        statement.byMarket[market],
      );
    expect(field(buildLabelContent(input('US')), 'netQuantity').text).toBe(
      'Net Wt. 3.98 oz (113 g)',
    );
  });

  it('places the US net quantity in the bottom 30 % of the front panel only', () => {
    // 21 CFR 701.13
    const us = field(buildLabelContent(input('US')), 'netQuantity');
    expect(us).toMatchObject({
      bottomThirtyPercent: true,
      allowedPanels: ['front'],
      defaultPanel: 'front',
    });
    expect(field(buildLabelContent(input('EU')), 'netQuantity').bottomThirtyPercent).toBe(false);
  });

  it('prints identity texts as entered: name, directions, product code, lot', () => {
    expect(texts(buildLabelContent(input('US')))).toMatchObject({
      productName: 'Lavender Foaming Fizzer',
      directions: 'Drop one fizzer into a warm bath.',
      productCode: 'Ref. FIZ-LAV-01',
      lot: 'Lot RF-0412',
      business: 'Hollowmere Bathworks, 12 Mill Lane, Hollowmere, VT 05001',
    });
  });

  it('lists fields in the order a single label prints them', () => {
    const keys = buildLabelContent(input('CA')).fields.map((f) => f.key);
    expect(keys).toEqual(LABEL_FIELD_KEYS.filter((k) => keys.includes(k)));
    expect(keys[0]).toBe('productName');
  });
});

describe('buildLabelContent: fields per market', () => {
  it('gives the US label the adverse-event contact and no responsible person or French', () => {
    // FD&C Act §609(a) (MoCRA)
    const us = texts(buildLabelContent(input('US')));
    expect(us.adverseEventContact).toBe(
      'Report adverse events: 1-800-555-0100 · example.com/safety',
    );
    expect(us.responsiblePerson).toBeUndefined();
    expect(us.productNameFr).toBeUndefined();
  });

  it('gives EU and UK labels their own responsible person and no adverse-event contact', () => {
    // Regulation (EC) No 1223/2009, Art. 19(1)(a); UK equivalent
    const eu = texts(buildLabelContent(input('EU')));
    expect(eu.responsiblePerson).toBe(
      'Responsible person: Example RP GmbH, Musterstraße 1, 10115 Berlin',
    );
    expect(eu.adverseEventContact).toBeUndefined();
    expect(eu.business).toBe('Hollowmere Bathworks, 12 Mill Lane, Hollowmere, VT 05001');
    expect(texts(buildLabelContent(input('UK'))).responsiblePerson).toBe(
      'Responsible person: Example RP Ltd, 1 High Street, Leeds LS1 1AA',
    );
  });

  it('keeps the responsible person on a small EU label and the maker off it', () => {
    const eu = buildLabelContent(input('EU'));
    expect(field(eu, 'responsiblePerson').onSmallLabel).toBe(true);
    expect(field(eu, 'business').onSmallLabel).toBe(false);
    expect(field(buildLabelContent(input('US')), 'business').onSmallLabel).toBe(true);
  });

  it('adds the French fields on Canadian labels only, as the maker entered them', () => {
    // Consumer Packaging and Labelling Regulations, s. 6(2); Cosmetic Regulations (bilingual)
    const ca = buildLabelContent(input('CA'));
    expect(texts(ca)).toMatchObject({
      productNameFr: 'Pétillant moussant à la lavande',
      warningsFr: 'Mise en garde : utiliser seulement selon le mode d’emploi.',
      directionsFr: 'Déposer un pétillant dans un bain chaud.',
    });
    expect(field(ca, 'productNameFr').allowedPanels).toEqual(['front']);
    for (const market of ['US', 'EU', 'UK'] as const) {
      const keys = buildLabelContent(input(market)).fields.map((f) => f.key);
      expect(keys).not.toContain('productNameFr');
      expect(keys).not.toContain('warningsFr');
      expect(keys).not.toContain('directionsFr');
    }
  });

  it('gives each field its panels and small-label place', () => {
    const us = buildLabelContent(input('US', { expiresOn: '2028-03-15' }));
    for (const key of ['productName', 'netQuantity'] as const)
      expect(field(us, key)).toMatchObject({ allowedPanels: ['front'], defaultPanel: 'front' });
    for (const key of ['ingredients', 'warnings', 'directions', 'lot', 'durability'] as const)
      expect(field(us, key)).toMatchObject({
        allowedPanels: ['front', 'back'],
        defaultPanel: 'back',
      });
    const small = us.fields.filter((f) => f.onSmallLabel).map((f) => f.key);
    expect(small).toEqual([
      'productName',
      'netQuantity',
      'business',
      'adverseEventContact',
      'lot',
      'durability',
    ]);
  });

  it('gives each field its minimum letter height from label-minimums', () => {
    const us = buildLabelContent(
      input('US', { areas: { pdpAreaSqIn: 2.6, labellingAreaSqIn: 2.6 } }),
    );
    // 21 CFR 701.13: 5 sq in or less → 1/16 in
    expect(field(us, 'netQuantity').minimum).toMatchObject({
      inches: 1 / 16,
      source: '21 CFR 701.13',
    });
    // 21 CFR 701.3(b): under 12 sq in → 1/32 in
    expect(field(us, 'ingredients').minimum.inches).toBe(1 / 32);
    // 21 CFR 740.2(a): 1/16 in, no small-package exemption
    expect(field(us, 'warnings').minimum).toMatchObject({
      inches: 1 / 16,
      source: '21 CFR 740.2(a)',
    });
  });

  it('leaves off the lot and the barcode when there is no lot code', () => {
    const us = buildLabelContent(input('US', { lotCode: null }));
    expect(us.fields.map((f) => f.key)).not.toContain('lot');
    expect(us.barcode).toBeNull();
  });

  it('refuses to make up a declaration for a market the engine did not check', () => {
    const { CA: _ca, ...declarations } = fizzer.declarations;
    expect(() =>
      buildLabelContent(input('CA', { evaluation: { ...fizzer, declarations } })),
    ).toThrow(/no declaration for CA/);
  });
});

describe('durability (Regulation (EC) No 1223/2009, Art. 19(1)(c) and Annex VII)', () => {
  it('works out the best-before month from the day made and the shelf life', () => {
    // [CALC] December 2026 + 18 months = June 2028
    expect(bestBeforeMonth('2026-12-02', 18)).toBe('2028-06');
    expect(bestBeforeMonth('2026-01-31', 11)).toBe('2026-12');
    expect(bestBeforeMonth('2026-01-31', 12)).toBe('2027-01');
  });

  it('prints "best used before the end of" month and year on EU and UK labels for 30 months or less', () => {
    for (const market of ['EU', 'UK'] as const) {
      const durability = field(buildLabelContent(input(market)), 'durability');
      expect(durability).toMatchObject({
        text: 'Best used before the end of 06/2028',
        name: 'Best-before date',
      });
      expect(durability.note).toBeUndefined();
    }
  });

  it('prints the PAO symbol’s text instead above 30 months, with a note saying what it is', () => {
    const eu = field(buildLabelContent(input('EU', {}, { shelfLifeMonths: 36 })), 'durability');
    expect(eu).toMatchObject({ text: '12M', name: 'Period after opening', note: PAO_NOTE });
    const paoOnly = field(
      buildLabelContent(input('UK', {}, { shelfLifeMonths: null })),
      'durability',
    );
    expect(paoOnly.text).toBe('12M');
  });

  it('uses a given expiry date as the date of minimum durability (day, month, year)', () => {
    expect(
      field(buildLabelContent(input('EU', { expiresOn: '2028-03-15' })), 'durability').text,
    ).toBe('Best used before the end of 15/03/2028');
    // Above 30 months the PAO is required as well
    expect(
      field(
        buildLabelContent(input('EU', { expiresOn: '2029-03-15' }, { shelfLifeMonths: 36 })),
        'durability',
      ).text,
    ).toBe('Best used before the end of 15/03/2029 · 12M');
  });

  it('prints the expiry on US labels when given, and nothing without one', () => {
    expect(
      field(buildLabelContent(input('US', { expiresOn: '2028-03-15' })), 'durability'),
    ).toMatchObject({
      text: 'Exp. 2028-03-15',
      name: 'Expiry date',
    });
    expect(texts(buildLabelContent(input('US'))).durability).toBeUndefined();
  });
});

describe('lot barcode (GS1 element string from the engine)', () => {
  it('carries (01) GTIN, (17) expiry and (10) lot when an expiry is given', () => {
    const { barcode } = buildLabelContent(input('US', { expiresOn: '2028-03-15' }));
    // GS1 General Specifications: GTIN-13 padded to 14 digits; AI 17 YYMMDD
    expect(barcode).toEqual({ hri: '(01)04006381333931(17)280315(10)RF-0412', warnings: [] });
  });

  it('carries (15) best before from the shelf life otherwise, day 00 for the month’s end', () => {
    const { barcode } = buildLabelContent(input('EU'));
    expect(barcode?.hri).toBe('(01)04006381333931(15)280600(10)RF-0412');
    expect(barcode?.warnings).toEqual(['Day 00 means the last day of that month.']);
  });

  it('passes on the engine’s warning when there is no GTIN', () => {
    const { barcode } = buildLabelContent(input('US', {}, { gtin: null }));
    expect(barcode?.hri).toBe('(15)280600(10)RF-0412');
    expect(barcode?.warnings[0]).toMatch(/without one this is an internal code/);
  });
});

describe('missingLabelElements', () => {
  it('is empty for a complete label in every market', () => {
    for (const market of ['US', 'EU', 'UK', 'CA'] as const)
      expect(missingLabelElements(input(market))).toEqual([]);
  });

  it('lists identity gaps with their field paths under identity.', () => {
    const bare = { usAdverseEventContact: {}, euResponsiblePerson: {}, canadianFrench: {} };
    expect(missingLabelElements(input('US', {}, bare))).toEqual([
      {
        market: 'US',
        field: 'identity.usAdverseEventContact',
        item: 'A US address, US phone number or web address for adverse-event reports',
        source: PRODUCT_IDENTITY_SOURCES.usAdverseEventContact,
      },
    ]);
    expect(missingLabelElements(input('EU', {}, bare)).map((m) => m.field)).toEqual([
      'identity.euResponsiblePerson.name',
      'identity.euResponsiblePerson.address',
    ]);
    // The US warnings make Canada ask for French warnings only when Canada's label has warnings
    expect(missingLabelElements(input('CA', {}, bare)).map((m) => m.field)).toEqual([
      'identity.canadianFrench.productName',
      'identity.canadianFrench.directions',
    ]);
  });

  it('asks Canada for French warnings when its label carries English ones', () => {
    const evaluation = {
      ...fizzer,
      warnings: { ...fizzer.warnings, CA: [US_FOAMING_BATH_CAUTION] },
    };
    expect(
      missingLabelElements(
        input('CA', { evaluation }, { canadianFrench: { productName: 'Pétillant' } }),
      ).map((m) => m.field),
    ).toEqual(['identity.canadianFrench.directions', 'identity.canadianFrench.warnings']);
  });

  it('lists the business address for US and Canada, the net quantity everywhere, the lot for EU and UK', () => {
    const gaps = {
      workshop: { name: 'Hollowmere Bathworks', address: null },
      netQuantity: null,
      lotCode: null,
    };
    expect(missingLabelElements(input('US', gaps))).toEqual([
      {
        market: 'US',
        field: 'workshop.address',
        item: 'The business’s postal address (name and place of business)',
        source: '21 CFR 701.12',
      },
      {
        market: 'US',
        field: 'netQuantity',
        item: 'The net quantity of contents, in the product profile',
        source: '21 CFR 701.13 (Fair Packaging and Labeling Act)',
      },
    ]);
    expect(missingLabelElements(input('EU', gaps))).toEqual([
      expect.objectContaining({
        field: 'netQuantity',
        source: 'Regulation (EC) No 1223/2009, Art. 19(1)(b)',
      }),
      expect.objectContaining({
        field: 'lotCode',
        source: 'Regulation (EC) No 1223/2009, Art. 19(1)(e)',
      }),
    ]);
    expect(missingLabelElements(input('CA', gaps)).map((m) => m.field)).toEqual([
      'workshop.address',
      'netQuantity',
    ]);
  });

  it('asks for a PAO on an EU label when the shelf life is over 30 months', () => {
    // Regulation (EC) No 1223/2009, Art. 19(1)(c)
    expect(
      missingLabelElements(
        input('EU', {}, { shelfLifeMonths: 36, periodAfterOpeningMonths: null }),
      ),
    ).toEqual([
      expect.objectContaining({ field: 'identity.periodAfterOpeningMonths', market: 'EU' }),
    ]);
  });

  it('names the market when the engine did not check the version for it', () => {
    const evaluation = evaluateFormula(
      aFormula([aLine(90, 'Aqua'), aLine(10, 'Glycerin')], aBodyLotion(), { markets: ['US'] }),
    );
    expect(missingLabelElements(input('UK', { evaluation }))[0]).toMatchObject({
      market: 'UK',
      field: 'profile.markets',
    });
  });
});
