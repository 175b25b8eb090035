// Label content for the PDF tests and bench, built as the label runs build it: the foaming
// fizzer's engine result (evaluateFormula) and product identity through the shared
// buildLabelContent. Invented example data only.
import {
  BUILT_IN_LABEL_STOCKS,
  buildLabelContent,
  evaluateFormula,
  evaluationInputSchema,
  gs1ElementString,
  labelAreas,
  productIdentitySchema,
  type ComplianceMarket,
  type EvaluationResult,
  type LabelContent,
  type LabelContentInput,
  type LabelLayout,
  type LabelStock,
} from '@batchproof/shared';
import { aProductIdentity } from '../../fixtures/builders/label-run-builder';

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

/** The fizzer's product identity: complete for every market, GTIN with a valid check digit. */
export const fizzerIdentity = productIdentitySchema.parse(
  aProductIdentity({ productName: 'Lavender Foaming Fizzer', shelfLifeMonths: 18 }),
);

export const LOT = 'RF-0412';
export const EXPIRY = '2027-01-31';

/** The element string the fizzer's lot barcode carries. */
export const fizzerElementString = gs1ElementString({
  gtin: '09521234543213',
  expiry: EXPIRY,
  lot: LOT,
});

/**
 * The fizzer's label content for one market as the label runs build it (the shared
 * `buildLabelContent`), with the minimum letter heights for the stock and layout it prints on.
 */
export function fizzerContent(
  market: ComplianceMarket,
  stock: LabelStock,
  layout: LabelLayout,
  overrides: Partial<LabelContentInput> = {},
): LabelContent {
  return buildLabelContent({
    market,
    evaluation: fizzerEvaluation,
    identity: fizzerIdentity,
    workshop: { name: 'Hollowmere Bathworks', address: '12 Mill Lane, Hollowmere, VT 05001' },
    netQuantity: { amount: 113, unit: 'g' },
    lotCode: LOT,
    expiresOn: EXPIRY,
    madeOn: '2026-12-02',
    areas: labelAreas(stock, layout),
    ...overrides,
  });
}

/** A built-in stock by key. */
export function builtInStock(key: string): LabelStock {
  const found = BUILT_IN_LABEL_STOCKS.find((s) => s.key === key);
  if (!found) throw new Error(`No built-in stock ${key}`);
  const { key: _key, ...stock } = found;
  return stock as LabelStock;
}
