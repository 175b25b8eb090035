import type { FormArray, FormControl, FormGroup, NonNullableFormBuilder } from '@angular/forms';
import {
  type ComplianceMarket,
  type Formula,
  formulaUpdateSchema,
  type FormulaVersion,
  type FormulaVersionInput,
  formulaVersionInputSchema,
  type ProductType,
  type StoredSubstitute,
} from '@batchproof/shared';
import { contractErrors, type FieldErrors } from '../../forms/form-errors';

/** How the maker enters amounts: grams per line, or percent per line with a batch total. */
export type EntryMode = 'grams' | 'percent';

/**
 * One editable line: the material picker holds `materialId`; `materialName` is what it shows;
 * `substitutes` the approved alternatives, in order.
 */
export type LineGroup = FormGroup<{
  materialId: FormControl<string>;
  materialName: FormControl<string>;
  grams: FormControl<number | null>;
  percent: FormControl<number | null>;
  substitutes: FormControl<StoredSubstitute[]>;
}>;

/** What a new or loaded line starts with. */
export interface LineSeed {
  materialId: string;
  materialName: string;
  grams: number | null;
  percent: number | null;
  substitutes?: readonly StoredSubstitute[];
}

const round = (n: number, places: number) => Math.round(n * 10 ** places) / 10 ** places;

/** A line's controls; amounts have no validators of their own (the shared schema judges them). */
export function lineGroup(fb: NonNullableFormBuilder, seed: LineSeed): LineGroup {
  return fb.group({
    materialId: seed.materialId,
    materialName: seed.materialName,
    grams: fb.control<number | null>(seed.grams),
    percent: fb.control<number | null>(seed.percent),
    substitutes: fb.control<StoredSubstitute[]>([...(seed.substitutes ?? [])]),
  });
}

/**
 * The editor's typed form for a formula and one of its versions: the formula's name and type,
 * the lines with their entry mode, the product profile and the version's notes.
 */
export function createFormulaForm(
  fb: NonNullableFormBuilder,
  formula: Formula,
  version: FormulaVersion,
) {
  const p = version.profile;
  return fb.group({
    name: formula.name,
    productType: formula.productType as ProductType,
    entry: 'grams' as EntryMode,
    batchGrams: fb.control<number | null>(round(version.totalGrams, 3) || null),
    lines: fb.array<LineGroup>(
      version.lines.map((l) =>
        lineGroup(fb, { ...l, grams: round(l.grams, 3), percent: round(l.percent, 4) }),
      ),
    ),
    profile: fb.group({
      use: p.use as 'rinse-off' | 'leave-on',
      contact: fb.group({ ...p.contact }),
      inBath: p.inBath,
      adultsOnly: p.adultsOnly,
      soldAsSoap: p.soldAsSoap,
      ifraCategory: p.ifraCategory,
      markets: fb.control<ComplianceMarket[]>([...p.markets]),
      unitMassGrams: fb.control<number | null>(p.unitMassGrams),
      netQuantity: fb.group({
        amount: fb.control<number | null>(p.netQuantity?.amount ?? null),
        unit: (p.netQuantity?.unit ?? 'g') as 'g' | 'mL',
      }),
    }),
    notes: version.notes ?? '',
  });
}
/** The editor's form. */
export type FormulaForm = ReturnType<typeof createFormulaForm>;
/** Everything typed in the editor, disabled controls included. */
export type FormulaFormValue = ReturnType<FormulaForm['getRawValue']>;
/** The lines array of the editor's form. */
export type LinesArray = FormArray<LineGroup>;

/** Grams of each line, whichever way they were entered (a blank amount counts as 0 g). */
export function lineGrams(v: Pick<FormulaFormValue, 'entry' | 'batchGrams' | 'lines'>): number[] {
  if (v.entry === 'grams') return v.lines.map((l) => l.grams ?? 0);
  const batch = v.batchGrams ?? 0;
  return v.lines.map((l) => ((l.percent ?? 0) / 100) * batch);
}

/**
 * The product profile as it is saved and checked live. "Sold as soap" only means something for a
 * soap, so it is sent as false for any other type even if it was ticked before the type changed.
 */
export function profileOf(v: Pick<FormulaFormValue, 'productType' | 'profile'>) {
  const n = v.profile.netQuantity;
  return {
    ...v.profile,
    soldAsSoap: v.productType === 'soap' && v.profile.soldAsSoap,
    netQuantity: n.amount === null ? null : { amount: n.amount, unit: n.unit },
  };
}

/** A line's substitutes for the body; left out when it has none (a PUT then stores none). */
const substituteIds = (l: FormulaFormValue['lines'][number]) =>
  l.substitutes.length > 0 ? { substitutes: l.substitutes.map((s) => s.materialId) } : {};

/** The version body for `PUT /api/formulas/:id/versions/:n`, before the shared schema checks it. */
export function toVersionInput(v: FormulaFormValue): FormulaVersionInput {
  const profile = profileOf(v);
  // Blank amounts go as null so the schema names them ("Enter a weight in grams").
  const blank = null as unknown as number;
  if (v.entry === 'grams') {
    return {
      lines: v.lines.map((l) => ({
        materialId: l.materialId,
        grams: l.grams ?? blank,
        ...substituteIds(l),
      })),
      profile,
      notes: v.notes,
    };
  }
  return {
    byPercent: {
      batchGrams: v.batchGrams ?? blank,
      lines: v.lines.map((l) => ({
        materialId: l.materialId,
        percent: l.percent ?? blank,
        ...substituteIds(l),
      })),
    },
    profile,
    notes: v.notes,
  };
}

/**
 * The contract's messages for everything typed: the formula's name and type (renamed on save) and
 * the version body, keyed by contract path (`editorPath` places them). Save and the check while
 * typing both judge the draft with it.
 */
export function draftErrors(v: FormulaFormValue): FieldErrors {
  return {
    ...contractErrors(formulaUpdateSchema, { name: v.name, productType: v.productType }),
    ...contractErrors(formulaVersionInputSchema, toVersionInput(v)),
  };
}

/**
 * Where a contract path shows in the editor: percent lines and the batch total sit at the top
 * level (a line's `materialId` is its picker's own control); a message on one substitute shows on
 * the line's substitutes.
 */
export function editorPath(path: string): string {
  return path.replace(/^byPercent\./, '').replace(/^(lines\.\d+\.substitutes)\.\d+$/, '$1');
}

/**
 * Switches between grams and percent entry, converting the amounts so the formula stays the same:
 * percent = grams / total; grams = percent × batch total.
 */
export function switchEntry(form: FormulaForm, mode: EntryMode): void {
  const v = form.getRawValue();
  if (v.entry === mode) return;
  const lines = form.controls.lines.controls;
  if (mode === 'percent') {
    const total = v.lines.reduce((s, l) => s + (l.grams ?? 0), 0);
    if (total > 0) form.controls.batchGrams.setValue(round(total, 3));
    lines.forEach((line, i) => {
      const grams = v.lines[i]!.grams;
      line.controls.percent.setValue(
        total > 0 && grams !== null ? round((grams / total) * 100, 4) : null,
      );
    });
  } else {
    const batch = v.batchGrams ?? 0;
    lines.forEach((line, i) => {
      const percent = v.lines[i]!.percent;
      line.controls.grams.setValue(percent !== null ? round((percent / 100) * batch, 3) : null);
    });
  }
  form.controls.entry.setValue(mode);
}
