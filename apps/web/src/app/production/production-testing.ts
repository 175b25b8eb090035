import type { Batch, BatchLine, BatchListItem } from '@batchproof/shared';

/* Test-only builders for the production specs; app code never imports this file. */

export const CITRIC = '0b4c7a52-2c1e-4a55-9d5e-6f1f3b2a9c11';
export const CORN_STARCH = '0b4c7a52-2c1e-4a55-9d5e-6f1f3b2a9c12';
export const TAPIOCA = '0b4c7a52-2c1e-4a55-9d5e-6f1f3b2a9c13';

/** A weigh sheet line: 500 g of citric acid from one lot, not weighed yet. */
export function aBatchLine(overrides: Partial<BatchLine> = {}): BatchLine {
  return {
    lineNumber: 1,
    materialId: CITRIC,
    materialName: 'Citric acid, fine',
    percent: 25,
    grams: 500,
    weighGrams: 500,
    stepGrams: 0.1,
    substitutes: [],
    suggestedPicks: {
      status: 'single',
      picks: [
        {
          lotId: 'lot-ca-1',
          supplierLotNumber: 'CA-77',
          expiresOn: '2027-05-31',
          grams: 500,
          quantity: 0.5,
          unit: 'kg',
        },
      ],
      shortGrams: 0,
      split: null,
      notes: [],
    },
    usedMaterialId: CITRIC,
    usedMaterialName: 'Citric acid, fine',
    lotPicks: [],
    actualGrams: null,
    weighing: { status: 'not-weighed', deviationPercent: null, message: null },
    ...overrides,
  };
}

/** A draft batch of the fictional fizzer, 2,000 g, two lines, ±2 % tolerance. */
export function aBatch(overrides: Partial<Batch> = {}): Batch {
  const check = { result: 'not-checked' as const, note: null };
  return {
    id: 'b1',
    createdAt: '2026-12-02T09:00:00.000Z',
    updatedAt: '2026-12-02T09:00:00.000Z',
    formulaId: 'f1',
    formulaName: 'Sea-glass fizzer',
    version: 3,
    batchCode: '261202-SGF-001',
    state: 'draft',
    madeOn: '2026-12-02',
    size: { units: 10, unitMassGrams: 200, targetGrams: 2000, lossPercent: 0, batchGrams: 2000 },
    sum: { batchGrams: 2000, roundedGrams: 2000, differenceGrams: 0, withinRounding: true },
    weighSheetNotes: [],
    tolerancePercent: 2,
    lines: [
      aBatchLine(),
      aBatchLine({
        lineNumber: 2,
        materialId: CORN_STARCH,
        materialName: 'Corn starch',
        usedMaterialId: CORN_STARCH,
        usedMaterialName: 'Corn starch',
        percent: 75,
        grams: 1500,
        weighGrams: 1500,
        stepGrams: 1,
        substitutes: [{ materialId: TAPIOCA, materialName: 'Tapioca starch' }],
        suggestedPicks: { status: 'none', picks: [], shortGrams: 1500, split: null, notes: [] },
      }),
    ],
    conditions: { roomTemperatureC: null, humidityPercent: null },
    mould: { name: null, unitsMade: null },
    timing: { hoursInMould: null, curingDays: null, readyOn: null },
    checks: {
      appearance: check,
      hardness: check,
      fizzOrLather: check,
      unitWeightsGrams: [],
      unitWeight: null,
      ph: null,
    },
    notes: null,
    durability: {
      bestBeforeMonth: '2028-06',
      expiresOn: '2028-06-30',
      periodAfterOpeningMonths: null,
    },
    releasedAt: null,
    releasedBy: null,
    amendments: [],
    ...overrides,
  };
}

/** A row of the batches list. */
export function aBatchListItem(overrides: Partial<BatchListItem> = {}): BatchListItem {
  const b = aBatch();
  return {
    id: b.id,
    formulaId: b.formulaId,
    formulaName: b.formulaName,
    version: b.version,
    batchCode: b.batchCode,
    state: b.state,
    madeOn: b.madeOn,
    releasedAt: null,
    updatedAt: b.updatedAt,
    durability: b.durability,
    readyOn: null,
    unitsMade: null,
    outOfTolerance: 0,
    ...overrides,
  };
}
