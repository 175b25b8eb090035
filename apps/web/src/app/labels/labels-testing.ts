import {
  BUILT_IN_LABEL_STOCKS,
  type LabelRunRecord,
  type LabelStock,
  type LabelStockRecord,
} from '@batchproof/shared';
import { FORMULA_ID } from '../formulas/formulas-testing';

/* Test data for the labels specs (imported by specs only). */

/** A built-in stock's record as `GET /api/label-stocks` answers it. */
export function aBuiltInStock(index: number): LabelStockRecord {
  const { key, ...stock } = BUILT_IN_LABEL_STOCKS[index]!;
  return {
    id: key,
    builtIn: true,
    key,
    stock: stock as LabelStock as LabelStockRecord['stock'],
    archivedAt: null,
    createdAt: null,
    updatedAt: null,
  };
}

/** US Letter 2⅝ × 1 in, 30 per sheet (3 across, 10 down). */
export const LETTER_30 = aBuiltInStock(0);
/** A roll of 2 × 1 in labels. */
export const ROLL_2X1 = aBuiltInStock(
  BUILT_IN_LABEL_STOCKS.findIndex((s) => s.key === 'roll-2x1in'),
);

export const RUN_ID = '5a1c2e3f-4b5d-4e6f-8a7b-9c0d1e2f3a4b';

/** A print run as the API answers it. */
export function aRun(fields: Partial<LabelRunRecord> = {}): LabelRunRecord {
  return {
    id: RUN_ID,
    formulaId: FORMULA_ID,
    formulaName: 'Lagoon fizzer',
    version: 1,
    markets: ['US', 'EU'],
    stock: { id: LETTER_30.id, name: LETTER_30.stock.name },
    layout: 'single',
    barcode: 'gs1-datamatrix',
    startPosition: 7,
    copies: 12,
    labelCount: 24,
    pageCount: 1,
    lotCode: 'LF-0412',
    expiresOn: null,
    batchId: null,
    status: 'ready',
    progress: { done: 24, total: 24 },
    overrideReason: null,
    overriddenMissing: [],
    outOfDate: false,
    publicPage: null,
    createdAt: '2026-11-20T09:30:00.000Z',
    createdBy: { id: '0c7f3a9e-1d2b-4c5e-8f6a-7b8c9d0e1f2a', name: 'Ada Marsh' },
    ...fields,
  };
}
