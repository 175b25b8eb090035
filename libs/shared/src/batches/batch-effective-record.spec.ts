import { describe, expect, it } from 'vitest';
import { batchRecordInputSchema } from './batch-schema';
import { effectiveRecord, recordFieldValue } from './batch-effective-record';

const LOT_A = '1c6e7d2f-4a54-4b5f-8b9f-7a2d3e4c5b61';
const LOT_B = '2d7f8e3a-5b65-4c6a-9cab-8b3e4f5d6c72';

const released = () =>
  batchRecordInputSchema.parse({
    lines: [
      { lineNumber: 1, lotPicks: [{ lotId: LOT_A, grams: 200 }], actualGrams: 200 },
      { lineNumber: 3, lotPicks: [{ lotId: LOT_B, grams: 50 }], actualGrams: 50 },
    ],
    mould: { name: 'Sphere 6 cm', unitsMade: 24 },
    timing: { hoursInMould: 24, curingDays: 14 },
    checks: { appearance: { result: 'pass' } },
    notes: 'First run',
  });

describe('effectiveRecord', () => {
  it('applies amendments in order, the later one of a field winning, and leaves the record as it was', () => {
    const record = released();
    const before = structuredClone(record);
    const effective = effectiveRecord(record, [
      { field: 'mould.unitsMade', value: 22 },
      { field: 'timing.curingDays', value: 21 },
      { field: 'mould.unitsMade', value: 23 },
      { field: 'notes', value: 'Two units cracked' },
    ]);
    expect(effective.mould).toEqual({ name: 'Sphere 6 cm', unitsMade: 23 });
    expect(effective.timing).toEqual({ hoursInMould: 24, curingDays: 21 });
    expect(effective.notes).toBe('Two units cracked');
    expect(effective.checks.appearance).toEqual({ result: 'pass', note: null });
    expect(record).toEqual(before);
  });

  it("replaces one line's field and keeps its other fields and the other lines", () => {
    const effective = effectiveRecord(released(), [
      {
        field: 'lines.1.lotPicks',
        value: [
          { lotId: LOT_A, grams: 150 },
          { lotId: LOT_B, grams: 50 },
        ],
      },
    ]);
    expect(effective.lines).toEqual([
      {
        lineNumber: 1,
        usedMaterialId: null,
        lotPicks: [
          { lotId: LOT_A, grams: 150 },
          { lotId: LOT_B, grams: 50 },
        ],
        actualGrams: 200,
      },
      released().lines[1],
    ]);
  });

  it('adds a line that was not recorded, in line order', () => {
    const effective = effectiveRecord(released(), [{ field: 'lines.2.actualGrams', value: 12.5 }]);
    expect(effective.lines.map((l) => l.lineNumber)).toEqual([1, 2, 3]);
    expect(effective.lines[1]).toEqual({
      lineNumber: 2,
      usedMaterialId: null,
      lotPicks: [],
      actualGrams: 12.5,
    });
  });

  it('with no amendments is the record itself', () => {
    const record = released();
    expect(effectiveRecord(record, [])).toBe(record);
  });

  it('refuses a field that is not part of a record', () => {
    expect(() => effectiveRecord(released(), [{ field: 'batchCode', value: 'X' }])).toThrow(
      'batchCode is not a field of a batch record',
    );
  });
});

describe('recordFieldValue', () => {
  it('reads a group field, the notes and a line field; an unrecorded line reads as not weighed', () => {
    const record = released();
    expect(recordFieldValue(record, 'mould.unitsMade')).toBe(24);
    expect(recordFieldValue(record, 'checks.appearance')).toEqual({ result: 'pass', note: null });
    expect(recordFieldValue(record, 'notes')).toBe('First run');
    expect(recordFieldValue(record, 'lines.3.lotPicks')).toEqual([{ lotId: LOT_B, grams: 50 }]);
    expect(recordFieldValue(record, 'lines.2.actualGrams')).toBeNull();
    expect(recordFieldValue(record, 'lines.2.lotPicks')).toEqual([]);
  });
});
