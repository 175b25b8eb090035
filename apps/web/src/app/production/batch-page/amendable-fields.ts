import type { AMENDABLE_BATCH_FIELDS, Batch } from '@batchproof/shared';
import { CHECK_WORDS } from '../batch-words';

/** How an amendable field's value is entered and shown. */
export type FieldKind = 'number' | 'text' | 'check' | 'weights' | 'material';

/** An amendable field of a released batch, with its label and how its value is entered. */
export interface AmendableField {
  readonly field: string;
  readonly label: string;
  readonly kind: FieldKind;
  readonly unit?: string;
}

/** The batch-wide fields an amendment may correct, in the order the record shows them. */
export const BATCH_FIELDS: readonly (AmendableField & {
  field: keyof typeof AMENDABLE_BATCH_FIELDS;
})[] = [
  { field: 'conditions.roomTemperatureC', label: 'Room temperature', kind: 'number', unit: '°C' },
  { field: 'conditions.humidityPercent', label: 'Humidity', kind: 'number', unit: '%' },
  { field: 'mould.name', label: 'Mould', kind: 'text' },
  { field: 'mould.unitsMade', label: 'Units made', kind: 'number' },
  { field: 'timing.hoursInMould', label: 'Time in the mould', kind: 'number', unit: 'hours' },
  { field: 'timing.curingDays', label: 'Curing or drying', kind: 'number', unit: 'days' },
  { field: 'checks.appearance', label: 'Appearance', kind: 'check' },
  { field: 'checks.hardness', label: 'Hardness', kind: 'check' },
  { field: 'checks.fizzOrLather', label: 'Fizz or lather', kind: 'check' },
  { field: 'checks.unitWeightsGrams', label: 'Unit weights', kind: 'weights', unit: 'g' },
  { field: 'checks.ph', label: 'pH', kind: 'number' },
  { field: 'notes', label: 'Notes', kind: 'text' },
];

/** Every field of this batch an amendment may correct: the batch-wide ones, then each line's. */
export function amendableFields(batch: Batch): AmendableField[] {
  const lines = batch.lines.flatMap((line): AmendableField[] => {
    const at = `Line ${line.lineNumber} (${line.materialName})`;
    const fields: AmendableField[] = [
      {
        field: `lines.${line.lineNumber}.actualGrams`,
        label: `${at}: weighed`,
        kind: 'number',
        unit: 'g',
      },
    ];
    if (line.substitutes.length > 0)
      fields.push({
        field: `lines.${line.lineNumber}.usedMaterialId`,
        label: `${at}: material used`,
        kind: 'material',
      });
    return fields;
  });
  return [...BATCH_FIELDS, ...lines];
}

/** A field's label, for any field an amendment names. */
export function fieldLabel(batch: Batch, field: string): string {
  const known = amendableFields(batch).find((f) => f.field === field);
  if (known) return known.label;
  const line = /^lines\.(\d+)\.lotPicks$/.exec(field);
  return line ? `Line ${line[1]}: lots weighed from` : field;
}

/** The value as released: the record's own, before any amendment. */
export function releasedValue(batch: Batch, field: string): unknown {
  const line = /^lines\.(\d+)\.(\w+)$/.exec(field);
  if (line) {
    const l = batch.lines.find((x) => x.lineNumber === Number(line[1]));
    if (!l) return null;
    return (l as unknown as Record<string, unknown>)[line[2]!] ?? null;
  }
  if (field === 'notes') return batch.notes;
  const [group, key] = field.split('.') as [string, string];
  const record = batch as unknown as Record<string, Record<string, unknown>>;
  return record[group]?.[key] ?? null;
}

/** A value in words, as the record shows it. */
export function valueText(batch: Batch, field: string, value: unknown): string {
  if (value === null || value === undefined || value === '') return 'not recorded';
  const kind = amendableFields(batch).find((f) => f.field === field);
  if (kind?.kind === 'material') {
    const line = batch.lines.find((l) => field.startsWith(`lines.${l.lineNumber}.`));
    const names = line
      ? [{ materialId: line.materialId, materialName: line.materialName }, ...line.substitutes]
      : [];
    return names.find((m) => m.materialId === value)?.materialName ?? String(value);
  }
  if (Array.isArray(value)) {
    if (value.length === 0) return 'none';
    return value
      .map((v) =>
        typeof v === 'object' && v !== null && 'grams' in v
          ? `${(v as { supplierLotNumber?: string }).supplierLotNumber ?? 'lot'}: ${(v as { grams: number }).grams} g`
          : String(v),
      )
      .join(', ');
  }
  if (typeof value === 'object' && 'result' in value) {
    const check = value as { result: keyof typeof CHECK_WORDS; note: string | null };
    return check.note ? `${CHECK_WORDS[check.result]}: ${check.note}` : CHECK_WORDS[check.result];
  }
  return kind?.unit ? `${String(value)} ${kind.unit}` : String(value);
}
