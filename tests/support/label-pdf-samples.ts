// Label content for the PDF tests, built from real engine results: the foaming fizzer's
// declaration and warnings from evaluateFormula, its net quantity from netQuantityStatement and its
// lot barcode from gs1ElementString. Invented example data only.
import {
  BUILT_IN_LABEL_STOCKS,
  evaluateFormula,
  evaluationInputSchema,
  gs1ElementString,
  netQuantityStatement,
  type ComplianceMarket,
  type EvaluationResult,
  type LabelContent,
  type LabelField,
  type LabelFieldKey,
  type LabelPanel,
  type LabelStock,
  type LetterHeightMinimum,
} from '@batchproof/shared';

/** A foaming bath fizzer with a fragrance: the US needs the 740.17 caution, the EU names Linalool. */
export const fizzerEvaluation: EvaluationResult = evaluateFormula(
  evaluationInputSchema.parse({
    asOf: '2026-09-01',
    markets: ['US', 'EU', 'UK', 'CA'],
    product: {
      name: 'Lavender Foaming Fizzer',
      use: 'rinse-off',
      contact: { mucousMembranes: false, eyeArea: false, lips: false },
      inBath: true,
      adultsOnly: false,
      ifraCategory: '9',
    },
    lines: [
      { grams: 60, material: { name: 'Baking soda', inci: 'Sodium Bicarbonate', functions: [] } },
      { grams: 26, material: { name: 'Citric acid', inci: 'Citric Acid', functions: [] } },
      {
        grams: 12,
        material: {
          name: 'SLSa',
          inci: 'Sodium Lauryl Sulfoacetate',
          functions: ['surfactant - cleansing', 'foaming'],
        },
      },
      {
        grams: 2,
        material: {
          name: 'Lavender Oil',
          inci: 'Parfum',
          functions: ['fragrance'],
          fragrance: {
            maxPercentByIfraCategory: { '9': 10 },
            allergens: [{ inci: 'Linalool', percent: 30 }],
          },
        },
      },
    ],
  }),
);

const inch = (inches: number, label: string, source: string): LetterHeightMinimum => ({
  mm: inches * 25.4,
  inches,
  label: `${label} in (${(inches * 25.4).toFixed(2)} mm)`,
  source,
});
/** 21 CFR 740.2(a): warnings at least 1/16 inch. */
export const WARNING_MINIMUM = inch(1 / 16, '1/16', '21 CFR 740.2(a)');
/** 21 CFR 701.3(b): the declaration at 1/32 inch on packages under 12 sq in of label surface. */
export const SMALL_PACKAGE_DECLARATION_MINIMUM = inch(1 / 32, '1/32', '21 CFR 701.3(b)');
/** No numeric EU minimum (Regulation (EC) No 1223/2009 Art. 19(1)): a house minimum of 1.2 mm. */
const HOUSE_MINIMUM: LetterHeightMinimum = {
  mm: 1.2,
  inches: 1.2 / 25.4,
  label: '1.2 mm',
  source: 'common practice, no published source',
};

const GTIN = '09521234543213';
export const LOT = 'RF-0412';
export const EXPIRY = '2027-01-31';

/** The element string the fizzer's lot barcode carries. */
export const fizzerElementString = gs1ElementString({ gtin: GTIN, expiry: EXPIRY, lot: LOT });

function field(
  key: LabelFieldKey,
  name: string,
  text: string,
  minimum: LetterHeightMinimum,
  more: Partial<LabelField> = {},
): LabelField {
  const frontOnly = key === 'productName' || key === 'netQuantity';
  return {
    key,
    name,
    text,
    bold: false,
    allowedPanels: frontOnly ? ['front'] : ['front', 'back'],
    defaultPanel: (frontOnly ? 'front' : 'back') as LabelPanel,
    bottomThirtyPercent: key === 'netQuantity',
    minimum,
    onSmallLabel: ['productName', 'netQuantity', 'lot', 'business'].includes(key),
    ...more,
  };
}

/**
 * The fizzer's label content for one market, as a renderer receives it. `pdpAreaSqIn` picks the
 * net quantity's minimum type height (21 CFR 701.13); `smallPackage` the 1/32 in declaration.
 */
export function fizzerContent(
  market: ComplianceMarket,
  opts: { pdpAreaSqIn?: number; smallPackage?: boolean; withBarcode?: boolean } = {},
): LabelContent {
  const us = market === 'US';
  const declaration = fizzerEvaluation.declarations[market]!.text;
  const warnings = fizzerEvaluation.warnings[market] ?? [];
  const net = netQuantityStatement({
    amount: 113,
    unit: 'g',
    pdpAreaSqIn: opts.pdpAreaSqIn ?? 2.6,
  });
  const netMinimum = net.minimumTypeHeight
    ? inch(net.minimumTypeHeight.inches, net.minimumTypeHeight.label, '21 CFR 701.13')
    : HOUSE_MINIMUM;
  const declarationMinimum = us
    ? opts.smallPackage === false
      ? inch(1 / 16, '1/16', '21 CFR 701.3(b)')
      : SMALL_PACKAGE_DECLARATION_MINIMUM
    : HOUSE_MINIMUM;
  const fields: LabelField[] = [
    field('productName', 'Product name', 'Lavender Foaming Fizzer', HOUSE_MINIMUM),
    field('netQuantity', 'Net quantity', net.byMarket[market], us ? netMinimum : HOUSE_MINIMUM),
    field('ingredients', 'Ingredients', declaration, declarationMinimum),
  ];
  if (warnings.length > 0) {
    fields.push(
      field('warnings', 'Warnings', warnings.join(' '), us ? WARNING_MINIMUM : HOUSE_MINIMUM, {
        bold: true,
      }),
    );
  }
  fields.push(
    field(
      'business',
      'Business',
      'Hollowmere Bathworks, 12 Mill Lane, Hollowmere, VT 05001',
      HOUSE_MINIMUM,
    ),
    field('lot', 'Lot', `Lot ${LOT} · Exp. 01/2027`, HOUSE_MINIMUM),
  );
  return {
    market,
    fields,
    barcode:
      opts.withBarcode === false
        ? null
        : { hri: fizzerElementString.hri, warnings: fizzerElementString.warnings },
  };
}

/** A built-in stock by key. */
export function builtInStock(key: string): LabelStock {
  const found = BUILT_IN_LABEL_STOCKS.find((s) => s.key === key);
  if (!found) throw new Error(`No built-in stock ${key}`);
  const { key: _key, ...stock } = found;
  return stock as LabelStock;
}
