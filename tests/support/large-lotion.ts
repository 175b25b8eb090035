// A large body lotion for the safety-packet bench: 40 lines (oils, butters, emulsifiers,
// actives, a preservative blend, a mica blend with ultramarines, a fragrance declaring six
// allergens), each material inserted with a safety data sheet on file. Invented example data:
// the INCI names are real ingredient names, the trade names and amounts are made up.
import { createHash } from 'node:crypto';
import type { FormulaCreate, MaterialCreate, ProductIdentityInput } from '@batchproof/shared';
import type { Database } from '../../apps/api/src/db/database';
import { insertDocument } from '../../apps/api/src/documents/documents-repository';
import { pdfBytes } from '../../fixtures/builders/document-files';
import { aBathProfile, aFormula } from '../../fixtures/builders/formula-builder';
import { aProductIdentity } from '../../fixtures/builders/label-run-builder';
import {
  aFragrance,
  aMaterial,
  anUltramarineBlend,
} from '../../fixtures/builders/material-builder';
import { buildMaterial } from './row-builders';

/** A plain material of the lotion: INCI, category, function and grams in a 1 kg batch. */
type Plain = [inci: string, category: MaterialCreate['category'], fn: string, grams: number];
const PLAIN: Plain[] = [
  ['Aqua', 'other', 'solvent', 560],
  ['Aloe Barbadensis Leaf Juice', 'additive', 'skin conditioning', 40],
  ['Rosa Damascena Flower Water', 'additive', 'skin conditioning', 30],
  ['Glycerin', 'additive', 'humectant', 30],
  ['Propanediol', 'additive', 'humectant', 15],
  ['Sodium Lactate', 'additive', 'humectant', 5],
  ['Panthenol', 'additive', 'skin conditioning', 10],
  ['Allantoin', 'additive', 'skin protecting', 2],
  ['Niacinamide', 'additive', 'skin conditioning', 20],
  ['Sodium Hyaluronate', 'additive', 'humectant', 1],
  ['Xanthan Gum', 'binder', 'viscosity controlling', 2],
  ['Cetearyl Alcohol', 'emulsifier', 'emulsion stabilising', 25],
  ['Glyceryl Stearate', 'emulsifier', 'emulsifying', 20],
  ['Cetearyl Olivate', 'emulsifier', 'emulsifying', 15],
  ['Sorbitan Olivate', 'emulsifier', 'emulsifying', 10],
  ['Cetyl Alcohol', 'emulsifier', 'emulsion stabilising', 10],
  ['Stearic Acid', 'hardener', 'emulsion stabilising', 15],
  ['Butyrospermum Parkii Butter', 'butter', 'skin conditioning', 30],
  ['Theobroma Cacao Seed Butter', 'butter', 'skin conditioning', 10],
  ['Mangifera Indica Seed Butter', 'butter', 'skin conditioning', 10],
  ['Prunus Amygdalus Dulcis Oil', 'oil', 'emollient', 30],
  ['Simmondsia Chinensis Seed Oil', 'oil', 'emollient', 20],
  ['Helianthus Annuus Seed Oil', 'oil', 'emollient', 15],
  ['Caprylic/Capric Triglyceride', 'oil', 'emollient', 20],
  ['Squalane', 'oil', 'emollient', 10],
  ['Rosa Canina Fruit Oil', 'oil', 'emollient', 5],
  ['Oenothera Biennis Oil', 'oil', 'emollient', 5],
  ['Argania Spinosa Kernel Oil', 'oil', 'emollient', 5],
  ['Persea Gratissima Oil', 'oil', 'emollient', 5],
  ['Vitis Vinifera Seed Oil', 'oil', 'emollient', 5],
  ['Isoamyl Laurate', 'oil', 'emollient', 10],
  ['Dimethicone', 'additive', 'skin protecting', 5],
  ['Tocopherol', 'additive', 'antioxidant', 2],
  ['Bisabolol', 'additive', 'soothing', 2],
  ['Avena Sativa Kernel Flour', 'additive', 'soothing', 5],
  ['Sodium Phytate', 'additive', 'chelating', 1],
  ['Citric Acid', 'acid', 'pH adjuster', 1],
];

/** Every material of the lotion with its grams: the plain ones, then the two blends and the scent. */
const lotionMaterials = (): [MaterialCreate, number][] => [
  ...PLAIN.map(([inci, category, fn, grams]): [MaterialCreate, number] => [
    aMaterial({ tradeName: `Lotion ${inci}`, inci, category, functions: [fn] }),
    grams,
  ]),
  [
    aMaterial({
      tradeName: 'Lotion preservative blend',
      inci: 'Phenoxyethanol (and) Ethylhexylglycerin',
      category: 'preservative',
      functions: ['preservative'],
      components: [
        { inci: 'Phenoxyethanol', percent: 90, functions: ['preservative'] },
        { inci: 'Ethylhexylglycerin', percent: 10, functions: ['skin conditioning'] },
      ],
    }),
    10,
  ],
  [anUltramarineBlend({ tradeName: 'Lotion shimmer mica blend' }), 2],
  [
    aFragrance({
      tradeName: 'Lotion rose and vanilla fragrance',
      allergenDeclaration: {
        documentDate: '2025-03-01',
        allergens: [
          { inci: 'Linalool', cas: '78-70-6', percent: 12 },
          { inci: 'Citronellol', cas: '106-22-9', percent: 9 },
          { inci: 'Limonene', cas: '5989-27-5', percent: 8 },
          { inci: 'Geraniol', cas: '106-24-1', percent: 6 },
          { inci: 'Benzyl Salicylate', cas: '118-58-1', percent: 4 },
          { inci: 'Coumarin', cas: '91-64-5', percent: 2 },
        ],
      },
    }),
    10,
  ],
];

/**
 * Inserts the lotion's 40 materials, each with a safety data sheet on file, into a workshop and
 * answers its lines, the body that creates the formula (leave-on, IFRA category 5A, four
 * markets) and a product identity for it.
 */
export async function buildLargeLotion(
  db: Database,
  workshopId: string,
): Promise<{
  lines: { materialId: string; grams: number }[];
  formula: FormulaCreate;
  identity: ProductIdentityInput;
}> {
  const lines: { materialId: string; grams: number }[] = [];
  for (const [body, grams] of lotionMaterials()) {
    const material = await buildMaterial(db, workshopId, body);
    lines.push({ materialId: material.id, grams });
    const content = pdfBytes();
    await insertDocument(db, {
      workshopId,
      materialId: material.id,
      kind: 'sds',
      title: `SDS ${material.tradeName}`,
      issuedOn: '2025-06-01',
      filename: 'sds.pdf',
      mimeType: 'application/pdf',
      sizeBytes: content.length,
      sha256: createHash('sha256').update(content).digest('hex'),
      content,
    });
  }
  const profile = aBathProfile({
    use: 'leave-on',
    contact: { mucousMembranes: false, eyeArea: false, lips: false },
    inBath: false,
    ifraCategory: '5A',
    unitMassGrams: 200,
    netQuantity: { amount: 200, unit: 'mL' },
  });
  return {
    lines,
    formula: aFormula(lines, {
      name: 'Rich Body Lotion',
      productType: 'lotion',
      draft: { lines, profile, notes: null },
    }),
    identity: aProductIdentity({ productName: 'Rich Body Lotion', productCode: 'RBL-01' }),
  };
}
