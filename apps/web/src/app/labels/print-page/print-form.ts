import type { NonNullableFormBuilder } from '@angular/forms';
import type {
  ComplianceMarket,
  LabelFieldKey,
  LabelLayout,
  LabelPanel,
  LabelRunCreate,
  LotBarcode,
} from '@batchproof/shared';

/**
 * The fields a maker may move between the front and back labels; the product name and the net
 * quantity stay on the principal display panel (21 CFR 701.13 puts the net quantity there).
 */
export const MOVABLE_FIELDS: readonly { key: LabelFieldKey; name: string }[] = [
  { key: 'ingredients', name: 'Ingredients' },
  { key: 'warnings', name: 'Warnings' },
  { key: 'directions', name: 'Directions for use' },
  { key: 'business', name: 'Business name and address' },
  { key: 'adverseEventContact', name: 'US adverse-event contact' },
  { key: 'responsiblePerson', name: 'Responsible person' },
  { key: 'lot', name: 'Lot code and barcode' },
  { key: 'durability', name: 'Best before or PAO' },
  { key: 'productCode', name: 'Product code' },
];

/** What a batch fixes on its labels: its batch code as the lot code, and its expiry. */
export interface BatchLot {
  batchCode: string;
  expiresOn: string | null;
}

/**
 * The print form, for a version sold in `markets`, on `stockId` to start with. For a batch the
 * lot code and expiry are the batch's and cannot be changed.
 */
export function createPrintForm(
  fb: NonNullableFormBuilder,
  markets: readonly ComplianceMarket[],
  stockId: string,
  batch?: BatchLot,
) {
  const form = fb.group({
    markets: fb.control<ComplianceMarket[]>([...markets]),
    stockId,
    layout: fb.control<LabelLayout>('single'),
    outerPackConfirmed: false,
    placement: fb.group(
      Object.fromEntries(MOVABLE_FIELDS.map((f) => [f.key, fb.control<LabelPanel | ''>('')])),
    ),
    startPosition: fb.control<number>(1),
    copies: fb.control<number | null>(1),
    lotCode: batch?.batchCode ?? '',
    expiresOn: batch?.expiresOn ?? '',
    barcode: fb.control<LotBarcode>('gs1-datamatrix'),
  });
  if (batch) {
    form.controls.lotCode.disable();
    form.controls.expiresOn.disable();
  }
  return form;
}
export type PrintForm = ReturnType<typeof createPrintForm>;

/** The request body for `POST /api/label-runs` the form stands for. */
export function printBody(
  form: PrintForm,
  run: { formulaId: string; version: number; overrideReason?: string; batchId?: string },
): LabelRunCreate {
  const v = form.getRawValue();
  const placement = Object.fromEntries(
    Object.entries(v.placement).filter(([, panel]) => panel !== ''),
  ) as Partial<Record<LabelFieldKey, LabelPanel>>;
  return {
    formulaId: run.formulaId,
    version: run.version,
    markets: v.markets,
    stockId: v.stockId,
    startPosition: v.startPosition,
    copies: v.copies as number,
    ...(v.lotCode.trim() ? { lotCode: v.lotCode } : {}),
    ...(v.expiresOn ? { expiresOn: v.expiresOn } : {}),
    layout: v.layout,
    placement: v.layout === 'panels' ? placement : {},
    barcode: v.barcode,
    outerPackConfirmed: v.layout === 'small' && v.outerPackConfirmed,
    ...(run.overrideReason ? { overrideReason: run.overrideReason } : {}),
    ...(run.batchId ? { batchId: run.batchId } : {}),
  };
}
