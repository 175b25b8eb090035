import type { FormControl, FormGroup, NonNullableFormBuilder } from '@angular/forms';
import {
  isScentCategory,
  kitchenMeasureSchema,
  type KitchenMeasure,
  type Material,
  type MaterialCategory,
  type MaterialCreate,
} from '@batchproof/shared';
import type { PathMap } from '../../forms/form-errors';

/** The measures a material's weight per volume is given in, in the shared order. */
export const MEASURES = kitchenMeasureSchema.options;

/** What each measure is called on screen. */
export const MEASURE_LABELS: Readonly<Record<KitchenMeasure, string>> = {
  cup: 'Cup',
  tablespoon: 'Tablespoon',
  teaspoon: 'Teaspoon',
  'fluid-ounce': 'Fluid ounce',
  millilitre: 'Millilitre',
  drop: 'Drop',
};

type Component = Material['components'][number];
type Allergen = NonNullable<Material['allergenDeclaration']>['allergens'][number];
type Calibration = Material['calibrations'][number];

/** Builds the material form and its row groups. Numbers are `null` while a field is empty. */
export class MaterialFormModel {
  constructor(private readonly fb: NonNullableFormBuilder) {}

  form(m: Material | null) {
    const fb = this.fb;
    const wpv = m?.weightPerVolume ?? {};
    return fb.group({
      tradeName: m?.tradeName ?? '',
      inci: m?.inci ?? '',
      usName: m?.usName ?? '',
      cas: m?.cas ?? '',
      ec: m?.ec ?? '',
      functions: fb.control<string[]>(m?.functions ?? []),
      category: fb.control<MaterialCategory | ''>(m?.category ?? ''),
      supplierId: m?.supplierId ?? '',
      notes: m?.notes ?? '',
      colourIndex: m?.colourIndex ?? '',
      nano: m?.nano ?? false,
      components: fb.array((m?.components ?? []).map((c) => this.component(c))),
      ifraCertificate: fb.group({
        limits: fb.array(
          Object.entries(m?.ifraCertificate?.maxPercentByIfraCategory ?? {}).map(([k, v]) =>
            this.ifraLimit(k, v),
          ),
        ),
        issuedOn: m?.ifraCertificate?.issuedOn ?? '',
        amendment: fb.control<number | null>(m?.ifraCertificate?.amendment ?? null),
      }),
      allergenDeclaration: fb.group({
        documentDate: m?.allergenDeclaration?.documentDate ?? '',
        allergens: fb.array((m?.allergenDeclaration?.allergens ?? []).map((a) => this.allergen(a))),
      }),
      weightPerVolume: fb.group(
        Object.fromEntries(MEASURES.map((u) => [u, fb.control<number | null>(wpv[u] ?? null)])) as {
          [U in KitchenMeasure]: FormControl<number | null>;
        },
      ),
      calibrations: fb.array((m?.calibrations ?? []).map((c) => this.calibration(c))),
    });
  }

  component(c?: Component) {
    return this.fb.group({
      inci: c?.inci ?? '',
      usName: c?.usName ?? '',
      colourIndex: c?.colourIndex ?? '',
      percent: this.fb.control<number | null>(c?.percent ?? null),
      nano: c?.nano ?? false,
      // Kept as they came so a save does not drop them; the editor does not show them yet.
      cas: c?.cas ?? '',
      functions: this.fb.control<string[]>(c?.functions ?? []),
      incidental: c?.incidental ?? false,
    });
  }

  ifraLimit(category = '', maxPercent: number | null = null) {
    return this.fb.group({ category, maxPercent: this.fb.control<number | null>(maxPercent) });
  }

  allergen(a?: Allergen) {
    return this.fb.group({
      inci: a?.inci ?? '',
      cas: a?.cas ?? '',
      percent: this.fb.control<number | null>(a?.percent ?? null),
    });
  }

  calibration(c?: Calibration) {
    return this.fb.group({
      unit: this.fb.control<KitchenMeasure>(c?.unit ?? 'cup'),
      amount: this.fb.control<number | null>(c?.amount ?? 1),
      grams: this.fb.control<number | null>(c?.grams ?? null),
      measuredOn: c?.measuredOn ?? '',
    });
  }
}

export type MaterialFormGroup = ReturnType<MaterialFormModel['form']>;
export type MaterialFormValue = ReturnType<MaterialFormGroup['getRawValue']>;
export type ComponentRow = ReturnType<MaterialFormModel['component']>;
export type IfraGroup = MaterialFormGroup['controls']['ifraCertificate'];
export type AllergenGroup = MaterialFormGroup['controls']['allergenDeclaration'];
export type WeightPerVolumeGroup = MaterialFormGroup['controls']['weightPerVolume'];
export type CalibrationRow = ReturnType<MaterialFormModel['calibration']>;
export type RowOf<A> = A extends { controls: (infer R extends FormGroup)[] } ? R : never;

const given = (s: string) => (s.trim() === '' ? undefined : s);
const num = (n: number | null) => n ?? undefined;

/**
 * The form's value as the API takes it. Empty numbers become `undefined` so the shared schema
 * says "Enter …" for them; a fragrance's certificate and declaration are sent only for scent
 * categories and only once something of them is filled in.
 */
export function toMaterialInput(raw: MaterialFormValue): MaterialCreate {
  const scent = raw.category !== '' && isScentCategory(raw.category);
  const ifra = raw.ifraCertificate;
  const hasIfra = ifra.limits.length > 0 || !!ifra.issuedOn || ifra.amendment !== null;
  const decl = raw.allergenDeclaration;
  const hasDecl = decl.allergens.length > 0 || !!decl.documentDate;
  return {
    tradeName: raw.tradeName,
    inci: raw.inci,
    usName: raw.usName,
    cas: raw.cas,
    ec: raw.ec,
    functions: raw.functions,
    category: (raw.category || undefined) as MaterialCategory,
    supplierId: raw.supplierId || null,
    notes: raw.notes,
    colourIndex: raw.colourIndex,
    nano: raw.nano,
    components: raw.components.map((c) => ({
      inci: c.inci,
      usName: given(c.usName),
      colourIndex: given(c.colourIndex),
      cas: given(c.cas),
      percent: num(c.percent) as number,
      ...(c.nano ? { nano: true } : {}),
      ...(c.functions.length ? { functions: c.functions } : {}),
      ...(c.incidental ? { incidental: true } : {}),
    })),
    ifraCertificate:
      scent && hasIfra
        ? {
            maxPercentByIfraCategory: Object.fromEntries(
              ifra.limits.map((l) => [l.category.trim(), num(l.maxPercent) as number]),
            ),
            issuedOn: ifra.issuedOn,
            amendment: num(ifra.amendment) as number,
          }
        : null,
    allergenDeclaration:
      scent && hasDecl
        ? {
            documentDate: decl.documentDate,
            allergens: decl.allergens.map((a) => ({
              inci: a.inci,
              cas: given(a.cas),
              percent: num(a.percent) as number,
            })),
          }
        : null,
    weightPerVolume: Object.fromEntries(
      Object.entries(raw.weightPerVolume).filter(([, v]) => v !== null),
    ),
    calibrations: raw.calibrations.map((c) => ({
      unit: c.unit,
      amount: num(c.amount) as number,
      grams: num(c.grams) as number,
      measuredOn: c.measuredOn || null,
    })),
  };
}

/** Checks the schema cannot make on the form's rows: IFRA categories named once each. */
export function rowErrors(raw: MaterialFormValue): Record<string, string[]> {
  const errors: Record<string, string[]> = {};
  const seen = new Set<string>();
  raw.ifraCertificate.limits.forEach((l, i) => {
    const key = l.category.trim();
    const path = `ifraCertificate.limits.${i}.category`;
    if (!key) errors[path] = ['Name the IFRA category, e.g. 9 or 5A'];
    else if (seen.has(key)) errors[path] = ['This category is listed twice'];
    seen.add(key);
  });
  return errors;
}

/**
 * Where the API's paths live in the form: a maximum keyed by IFRA category goes to that
 * category's row, and a message about one function goes to the functions field.
 */
export function materialFormPath(raw: MaterialFormValue): PathMap {
  const ifraPrefix = 'ifraCertificate.maxPercentByIfraCategory';
  return (path) => {
    if (path === ifraPrefix) return 'ifraCertificate.limits';
    if (path.startsWith(`${ifraPrefix}.`)) {
      const key = path.slice(ifraPrefix.length + 1);
      const row = raw.ifraCertificate.limits.findIndex((l) => l.category.trim() === key);
      const field = key === '' ? 'category' : 'maxPercent';
      return row >= 0 ? `ifraCertificate.limits.${row}.${field}` : 'ifraCertificate.limits';
    }
    return path.startsWith('functions.') ? 'functions' : path;
  };
}
