import type { FormArray, FormGroup, FormControl, NonNullableFormBuilder } from '@angular/forms';
import type { Batch, BatchLine, BatchRecordInput } from '@batchproof/shared';

/** How a check went: pass, fail or not checked. */
export type CheckResult = Batch['checks']['appearance']['result'];

/**
 * The batch record's form: shaped like `batchRecordInputSchema`, so the contract's field paths
 * (`lines.0.actualGrams`, `checks.ph`) name its controls. Two differences, both mapped by
 * {@link recordPath}: a line's number is not a control (the line's place in the list gives it),
 * and the unit weights are typed as one list of numbers (`150.2, 149.8`).
 */

type NumberControl = FormControl<number | null>;

export type LotPickForm = FormGroup<{ lotId: FormControl<string>; grams: NumberControl }>;
export type LineForm = FormGroup<{
  usedMaterialId: FormControl<string>;
  lotPicks: FormArray<LotPickForm>;
  actualGrams: NumberControl;
}>;
type CheckForm = FormGroup<{ result: FormControl<CheckResult>; note: FormControl<string> }>;

export type BatchForm = FormGroup<{
  lines: FormArray<LineForm>;
  conditions: FormGroup<{ roomTemperatureC: NumberControl; humidityPercent: NumberControl }>;
  mould: FormGroup<{ name: FormControl<string>; unitsMade: NumberControl }>;
  timing: FormGroup<{ hoursInMould: NumberControl; curingDays: NumberControl }>;
  checks: FormGroup<{
    appearance: CheckForm;
    hardness: CheckForm;
    fizzOrLather: CheckForm;
    unitWeightsGrams: FormControl<string>;
    ph: NumberControl;
  }>;
  notes: FormControl<string>;
}>;

/** A lot pick's controls. */
export function lotPickForm(
  fb: NonNullableFormBuilder,
  pick: { lotId: string; grams: number | null },
): LotPickForm {
  return fb.group({ lotId: pick.lotId, grams: fb.control<number | null>(pick.grams) });
}

function lineForm(fb: NonNullableFormBuilder, line: BatchLine): LineForm {
  return fb.group({
    usedMaterialId: line.usedMaterialId,
    lotPicks: fb.array(line.lotPicks.map((p) => lotPickForm(fb, p))),
    actualGrams: fb.control<number | null>(line.actualGrams),
  });
}

function checkForm(
  fb: NonNullableFormBuilder,
  check: { result: CheckResult; note: string | null },
): CheckForm {
  return fb.group({ result: fb.control<CheckResult>(check.result), note: check.note ?? '' });
}

/** The form of a batch, filled with what is recorded. */
export function batchForm(fb: NonNullableFormBuilder, batch: Batch): BatchForm {
  const n = (v: number | null) => fb.control<number | null>(v);
  return fb.group({
    lines: fb.array(batch.lines.map((l) => lineForm(fb, l))),
    conditions: fb.group({
      roomTemperatureC: n(batch.conditions.roomTemperatureC),
      humidityPercent: n(batch.conditions.humidityPercent),
    }),
    mould: fb.group({ name: batch.mould.name ?? '', unitsMade: n(batch.mould.unitsMade) }),
    timing: fb.group({
      hoursInMould: n(batch.timing.hoursInMould),
      curingDays: n(batch.timing.curingDays),
    }),
    checks: fb.group({
      appearance: checkForm(fb, batch.checks.appearance),
      hardness: checkForm(fb, batch.checks.hardness),
      fizzOrLather: checkForm(fb, batch.checks.fizzOrLather),
      unitWeightsGrams: unitWeightsText(batch.checks.unitWeightsGrams),
      ph: n(batch.checks.ph),
    }),
    notes: batch.notes ?? '',
  });
}

/** Unit weights as the maker types them: `150.2, 149.8`. */
export function unitWeightsText(weights: readonly number[]): string {
  return weights.join(', ');
}

/**
 * The weights typed, as numbers; a word that is not a number stays as NaN, so the contract
 * refuses it with its own message rather than it being dropped silently.
 */
export function readUnitWeights(text: string): number[] {
  return text
    .split(/[\s,;]+/)
    .filter((w) => w.length > 0)
    .map((w) => Number(w));
}

/** The `PUT` body the form stands for; the line's own material is sent as null. */
export function recordBody(form: BatchForm, batch: Batch): BatchRecordInput {
  const v = form.getRawValue();
  return {
    lines: v.lines.map((line, i) => {
      const sheet = batch.lines[i]!;
      return {
        lineNumber: sheet.lineNumber,
        usedMaterialId: line.usedMaterialId === sheet.materialId ? null : line.usedMaterialId,
        lotPicks: line.lotPicks.map((p) => ({ lotId: p.lotId, grams: p.grams as number })),
        actualGrams: line.actualGrams,
      };
    }),
    conditions: v.conditions,
    mould: { name: v.mould.name, unitsMade: v.mould.unitsMade },
    timing: v.timing,
    checks: { ...v.checks, unitWeightsGrams: readUnitWeights(v.checks.unitWeightsGrams) },
    notes: v.notes,
  };
}

/**
 * Where a path of the record contract lives in the form (`checks.unitWeightsGrams.2` → the list).
 * Release refusals (`batch_not_ready`, `stock_short`) name lines by their place too
 * (`lines.0.lotPicks` is the first line), so the same map places them.
 */
export function recordPath(path: string): string {
  return path.startsWith('checks.unitWeightsGrams') ? 'checks.unitWeightsGrams' : path;
}
