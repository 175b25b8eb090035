import type { NonNullableFormBuilder } from '@angular/forms';
import {
  A4_MM,
  inchesToMm,
  type LabelShape,
  type LabelStock,
  type LabelStockCreate,
  MM_PER_INCH,
  US_LETTER_MM,
} from '@batchproof/shared';

/** The unit the maker types lengths in; the contract is always in millimetres. */
export type LengthUnit = 'mm' | 'in';

/** The lengths a stock has, in the contract's names. */
export const SHEET_LENGTHS = [
  'pageWidthMm',
  'pageHeightMm',
  'topMarginMm',
  'leftMarginMm',
  'labelWidthMm',
  'labelHeightMm',
  'horizontalPitchMm',
  'verticalPitchMm',
] as const;
export const ROLL_LENGTHS = ['labelWidthMm', 'labelHeightMm', 'gapMm'] as const;
type Length = (typeof SHEET_LENGTHS)[number] | (typeof ROLL_LENGTHS)[number] | 'cornerRadiusMm';
const ALL_LENGTHS: readonly Length[] = [...SHEET_LENGTHS, 'gapMm', 'cornerRadiusMm'];

/** Field labels without their unit, which the form adds. */
export const LENGTH_LABELS: Record<Length, string> = {
  pageWidthMm: 'Page width',
  pageHeightMm: 'Page height',
  topMarginMm: 'Top margin',
  leftMarginMm: 'Left margin',
  labelWidthMm: 'Label width',
  labelHeightMm: 'Label height',
  horizontalPitchMm: 'Horizontal pitch',
  verticalPitchMm: 'Vertical pitch',
  gapMm: 'Gap between labels',
  cornerRadiusMm: 'Corner radius',
};

/** What each length means, where the name alone is not enough. */
export const LENGTH_HINTS: Partial<Record<Length, string>> = {
  horizontalPitchMm: "From one label's left edge to the next label's left edge.",
  verticalPitchMm: "From one label's top edge to the next label's top edge.",
  topMarginMm: "From the page's top edge to the first row's top edge.",
  leftMarginMm: "From the page's left edge to the first column's left edge.",
};

export const PAGE_PRESETS = [
  { label: 'US Letter', ...US_LETTER_MM },
  { label: 'A4', ...A4_MM },
] as const;

const toUnit = (mm: number | null, unit: LengthUnit) =>
  mm === null ? null : unit === 'mm' ? mm : Math.round((mm / MM_PER_INCH) * 1e4) / 1e4;
const toMm = (value: number | null, unit: LengthUnit) =>
  value === null ? null : unit === 'mm' ? value : inchesToMm(value);

/** The stock form: every field a sheet or a roll may have, lengths in `unit`. */
export function createStockForm(fb: NonNullableFormBuilder, stock: LabelStock | null) {
  const length = (mm: number | undefined) => fb.control<number | null>(mm ?? null);
  const s = stock as Partial<Record<Length, number>> | null;
  const shape: LabelShape = stock?.shape ?? { kind: 'rectangle' };
  return fb.group({
    kind: fb.control<'sheet' | 'roll'>(stock?.kind ?? 'sheet'),
    name: stock?.name ?? '',
    unit: fb.control<LengthUnit>('mm'),
    shapeKind: fb.control<LabelShape['kind']>(shape.kind),
    cornerRadiusMm: length(shape.kind === 'rounded-rectangle' ? shape.cornerRadiusMm : undefined),
    pageWidthMm: length(s?.pageWidthMm),
    pageHeightMm: length(s?.pageHeightMm),
    topMarginMm: length(s?.topMarginMm),
    leftMarginMm: length(s?.leftMarginMm),
    labelWidthMm: length(s?.labelWidthMm),
    labelHeightMm: length(s?.labelHeightMm),
    horizontalPitchMm: length(s?.horizontalPitchMm),
    verticalPitchMm: length(s?.verticalPitchMm),
    gapMm: length(s?.gapMm),
    across: fb.control<number | null>(stock?.kind === 'sheet' ? stock.across : null),
    down: fb.control<number | null>(stock?.kind === 'sheet' ? stock.down : null),
  });
}
export type StockForm = ReturnType<typeof createStockForm>;
export type StockValue = ReturnType<StockForm['getRawValue']>;

/** Rewrites every length in the form from one unit to the other, so nothing typed is lost. */
export function convertLengths(form: StockForm, from: LengthUnit, to: LengthUnit): void {
  if (from === to) return;
  for (const key of ALL_LENGTHS) {
    const control = form.controls[key];
    control.setValue(toUnit(toMm(control.value, from), to));
  }
}

/** The request body the form stands for, in millimetres, for the shared schema to judge. */
export function stockBody(v: StockValue): LabelStockCreate {
  const mm = (value: number | null) => toMm(value, v.unit) as number;
  const shape =
    v.shapeKind === 'rounded-rectangle'
      ? { kind: v.shapeKind, cornerRadiusMm: mm(v.cornerRadiusMm) }
      : { kind: v.shapeKind };
  const common = {
    name: v.name,
    labelWidthMm: mm(v.labelWidthMm),
    labelHeightMm: mm(v.labelHeightMm),
    shape,
  };
  if (v.kind === 'roll') return { kind: 'roll', ...common, gapMm: mm(v.gapMm) };
  return {
    kind: 'sheet',
    ...common,
    pageWidthMm: mm(v.pageWidthMm),
    pageHeightMm: mm(v.pageHeightMm),
    topMarginMm: mm(v.topMarginMm),
    leftMarginMm: mm(v.leftMarginMm),
    horizontalPitchMm: mm(v.horizontalPitchMm),
    verticalPitchMm: mm(v.verticalPitchMm),
    across: v.across as number,
    down: v.down as number,
  };
}

/** Where a contract path lives in the form (the shape's fields are flattened). */
export function stockFormPath(path: string): string {
  if (path === 'shape.cornerRadiusMm') return 'cornerRadiusMm';
  if (path === 'shape' || path.startsWith('shape.')) return 'shapeKind';
  return path;
}

/** Sets the page size to a preset, in the form's unit. */
export function setPage(form: StockForm, page: { widthMm: number; heightMm: number }): void {
  const unit = form.controls.unit.value;
  form.controls.pageWidthMm.setValue(toUnit(page.widthMm, unit));
  form.controls.pageHeightMm.setValue(toUnit(page.heightMm, unit));
  form.markAsDirty();
}
