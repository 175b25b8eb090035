import type { BatchRecordFields } from './batch-schema';

/**
 * A released batch's record stays as released; its amendments are kept beside it. The effective
 * record (what the batch now says) is the released record with the amendments applied in order.
 */

type RecordLine = BatchRecordFields['lines'][number];
type RecordGroup = 'conditions' | 'mould' | 'timing' | 'checks';

/** An amendment as it is applied: the field it corrects and its new value (already checked). */
export interface AppliedAmendment {
  readonly field: string;
  readonly value: unknown;
}

const LINE_PATH = /^lines\.(\d+)\.(usedMaterialId|lotPicks|actualGrams)$/;
const GROUPS: readonly RecordGroup[] = ['conditions', 'mould', 'timing', 'checks'];

/** A line nothing was recorded for: its own material, no lots, not weighed. */
export const unrecordedLine = (lineNumber: number): RecordLine => ({
  lineNumber,
  usedMaterialId: null,
  lotPicks: [],
  actualGrams: null,
});

/** The recorded line with this number, or an unrecorded one. */
export function recordLine(record: BatchRecordFields, lineNumber: number): RecordLine {
  return record.lines.find((l) => l.lineNumber === lineNumber) ?? unrecordedLine(lineNumber);
}

type FieldPath =
  | { kind: 'line'; lineNumber: number; key: 'usedMaterialId' | 'lotPicks' | 'actualGrams' }
  | { kind: 'notes' }
  | { kind: 'group'; group: RecordGroup; key: string };

function fieldPath(field: string): FieldPath {
  const line = LINE_PATH.exec(field);
  if (line)
    return {
      kind: 'line',
      lineNumber: Number(line[1]),
      key: line[2] as 'usedMaterialId' | 'lotPicks' | 'actualGrams',
    };
  if (field === 'notes') return { kind: 'notes' };
  const [group, key, rest] = field.split('.');
  if (rest === undefined && key && GROUPS.includes(group as RecordGroup))
    return { kind: 'group', group: group as RecordGroup, key };
  throw new Error(`${field} is not a field of a batch record`);
}

/** The value of one amendable field (`mould.unitsMade`, `lines.3.lotPicks`, `notes` …) in a record. */
export function recordFieldValue(record: BatchRecordFields, field: string): unknown {
  const path = fieldPath(field);
  if (path.kind === 'line') return recordLine(record, path.lineNumber)[path.key];
  if (path.kind === 'notes') return record.notes;
  return (record[path.group] as Record<string, unknown>)[path.key] ?? null;
}

function withField(record: BatchRecordFields, { field, value }: AppliedAmendment) {
  const path = fieldPath(field);
  if (path.kind === 'notes') return { ...record, notes: value as string | null };
  if (path.kind === 'group')
    return { ...record, [path.group]: { ...record[path.group], [path.key]: value } };
  const line = { ...recordLine(record, path.lineNumber), [path.key]: value };
  const lines = [...record.lines.filter((l) => l.lineNumber !== path.lineNumber), line].sort(
    (a, b) => a.lineNumber - b.lineNumber,
  );
  return { ...record, lines };
}

/**
 * The record with the amendments applied in the order given (oldest first): a later amendment
 * of the same field wins. The record passed in is not changed.
 */
export function effectiveRecord(
  record: BatchRecordFields,
  amendments: readonly AppliedAmendment[],
): BatchRecordFields {
  return amendments.reduce<BatchRecordFields>(withField, record);
}
