import * as z from 'zod';
import { describe, expect, it } from 'vitest';
import { batchAmendmentSchema, stockAdjustmentSchema } from './batch-amendment-schema';
import {
  batchCreateSchema,
  batchLineInputSchema,
  batchReadyOn,
  batchRecordInputSchema,
  usedMaterialProblem,
} from './batch-schema';

const FORMULA = '0b5d6c1e-3f43-4f4e-9a8e-6f1c2d3b4a50';
const LOT_A = '1c6e7d2f-4a54-4b5f-8b9f-7a2d3e4c5b61';
const LOT_B = '2d7f8e3a-5b65-4c6a-9cab-8b3e4f5d6c72';

const fieldErrors = (result: { success: boolean; error?: z.ZodError }) =>
  z.flattenError(result.error!).fieldErrors as Record<string, string[]>;

describe('batchCreateSchema', () => {
  it('takes units × unit mass with a loss allowance', () => {
    expect(
      batchCreateSchema.parse({
        formulaId: FORMULA,
        version: 2,
        units: 24,
        unitMass: 180,
        lossPercent: 3,
      }),
    ).toEqual({ formulaId: FORMULA, version: 2, units: 24, unitMass: 180, lossPercent: 3 });
    // A total alone, the loss defaulting to 0
    expect(
      batchCreateSchema.parse({ formulaId: FORMULA, version: 1, totalGrams: 2000 }).lossPercent,
    ).toBe(0);
  });

  it('asks for exactly one way of sizing, on the field to change', () => {
    const neither = batchCreateSchema.safeParse({ formulaId: FORMULA, version: 1 });
    expect(fieldErrors(neither)).toEqual({
      units: ['Enter how many units to make, or a total in grams'],
    });
    const both = batchCreateSchema.safeParse({
      formulaId: FORMULA,
      version: 1,
      units: 2,
      totalGrams: 100,
    });
    expect(fieldErrors(both)).toEqual({
      totalGrams: ['Size the batch by units or by a total in grams, not both'],
    });
    const massWithTotal = batchCreateSchema.safeParse({
      formulaId: FORMULA,
      version: 1,
      totalGrams: 100,
      unitMass: 5,
    });
    expect(fieldErrors(massWithTotal)).toEqual({
      unitMass: ['A unit mass goes with a number of units, not with a total'],
    });
  });

  it('refuses a loss over 50 % and a batch over 1,000,000,000 g', () => {
    const loss = batchCreateSchema.safeParse({
      formulaId: FORMULA,
      version: 1,
      totalGrams: 100,
      lossPercent: 51,
    });
    expect(fieldErrors(loss)).toEqual({ lossPercent: ['The loss allowance is at most 50 %'] });
    // 1,000,000 units × 1,001 g = 1,001,000,000 g
    const huge = batchCreateSchema.safeParse({
      formulaId: FORMULA,
      version: 1,
      units: 1_000_000,
      unitMass: 1001,
    });
    expect(fieldErrors(huge).units).toEqual([
      'That batch would weigh more than 1,000,000,000 g: make fewer units',
    ]);
  });
});

describe('batchLineInputSchema and the record', () => {
  it('checks that the lots add up to the weight', () => {
    const ok = batchLineInputSchema.safeParse({
      lineNumber: 1,
      lotPicks: [
        { lotId: LOT_A, grams: 1200 },
        { lotId: LOT_B, grams: 802.32 },
      ],
      actualGrams: 2002.32,
    });
    expect(ok.success).toBe(true);
    const off = batchLineInputSchema.safeParse({
      lineNumber: 1,
      lotPicks: [{ lotId: LOT_A, grams: 1200 }],
      actualGrams: 2002.32,
    });
    expect(fieldErrors(off).lotPicks).toEqual([
      'The lots add up to 1200 g but the line weighed 2002.32 g: the grams from each lot must add up to the weight',
    ]);
    const twice = batchLineInputSchema.safeParse({
      lineNumber: 1,
      lotPicks: [
        { lotId: LOT_A, grams: 1 },
        { lotId: LOT_A, grams: 1 },
      ],
      actualGrams: 2,
    });
    expect(fieldErrors(twice).lotPicks).toEqual([
      'Each lot is listed once per line: add its grams together',
    ]);
  });

  it('fills an empty record and bounds pH, humidity and temperature', () => {
    const empty = batchRecordInputSchema.parse({});
    expect(empty).toMatchObject({
      lines: [],
      conditions: { roomTemperatureC: null, humidityPercent: null },
      checks: { appearance: { result: 'not-checked', note: null }, unitWeightsGrams: [], ph: null },
      notes: null,
    });
    const bad = batchRecordInputSchema.safeParse({
      conditions: { roomTemperatureC: 60, humidityPercent: 101 },
      checks: { ph: 14.5 },
    });
    expect(bad.error!.issues.map((i) => [i.path.join('.'), i.message])).toEqual([
      ['conditions.roomTemperatureC', 'The room temperature must be −10 to 50 °C'],
      ['conditions.humidityPercent', 'The humidity must be 0 to 100 %'],
      ['checks.ph', 'The pH must be 0 to 14'],
    ]);
  });

  it('accepts the line material or an approved substitute only', () => {
    const line = {
      materialId: 'corn',
      materialName: 'Corn starch',
      substitutes: [{ materialId: 'tapioca', materialName: 'Tapioca starch' }],
    };
    expect(usedMaterialProblem(line, null)).toBeNull();
    expect(usedMaterialProblem(line, 'tapioca')).toBeNull();
    expect(usedMaterialProblem(line, 'kaolin')).toBe(
      'That material is not an approved substitute for Corn starch: use Tapioca starch',
    );
    expect(usedMaterialProblem({ ...line, substitutes: [] }, 'kaolin')).toBe(
      'Corn starch has no approved substitutes: approve one on the formula first',
    );
  });

  it('works out the ready day from the mould time and the cure', () => {
    // 2026-12-02 + 2 days in the mould (48 h) + 28 days = 2027-01-01
    expect(batchReadyOn('2026-12-02', 48, 28)).toBe('2027-01-01');
    // 6 h in the mould counts as a whole day: + 1 + 2 = 2026-12-05
    expect(batchReadyOn('2026-12-02', 6, 2)).toBe('2026-12-05');
    expect(batchReadyOn('2026-12-02', 48, null)).toBeNull();
  });
});

describe('batchAmendmentSchema', () => {
  it('checks the value by the field it corrects', () => {
    expect(
      batchAmendmentSchema.parse({
        field: 'checks.ph',
        value: 6.5,
        reason: 'pH meter was not calibrated',
      }),
    ).toEqual({ field: 'checks.ph', value: 6.5, reason: 'pH meter was not calibrated' });
    const badPh = batchAmendmentSchema.safeParse({
      field: 'checks.ph',
      value: 15,
      reason: 'Typed the wrong value',
    });
    expect(fieldErrors(badPh)).toEqual({ value: ['The pH must be 0 to 14'] });
    const line = batchAmendmentSchema.parse({
      field: 'lines.3.actualGrams',
      value: 1112.4,
      reason: 'The scale was not zeroed',
    });
    expect(line.value).toBe(1112.4);
  });

  it('refuses fixed fields and a short reason', () => {
    const code = batchAmendmentSchema.safeParse({
      field: 'batchCode',
      value: 'X',
      reason: 'A long enough reason',
    });
    expect(fieldErrors(code).field![0]).toBe(
      'batchCode cannot be corrected: the batch code, size, formula and release are fixed once released',
    );
    const short = batchAmendmentSchema.safeParse({ field: 'notes', value: 'x', reason: 'oops' });
    expect(fieldErrors(short)).toEqual({
      reason: ['Explain the correction in at least 10 characters'],
    });
  });
});

describe('stockAdjustmentSchema', () => {
  it('takes a signed quantity with a reason', () => {
    expect(
      stockAdjustmentSchema.parse({ lotId: LOT_A, quantity: -12.5, reason: 'spillage' }),
    ).toEqual({
      lotId: LOT_A,
      quantity: -12.5,
      reason: 'spillage',
      note: null,
    });
  });

  it('refuses 0, five decimals, an unknown reason and "other" without a note', () => {
    const result = stockAdjustmentSchema.safeParse({ lotId: LOT_A, quantity: 0, reason: 'theft' });
    expect(fieldErrors(result)).toEqual({
      quantity: ['An adjustment of 0 changes nothing'],
      reason: ['Choose a reason: spillage, count correction, disposal or other'],
    });
    const tiny = stockAdjustmentSchema.safeParse({
      lotId: LOT_A,
      quantity: -0.00001,
      reason: 'spillage',
    });
    expect(fieldErrors(tiny).quantity).toEqual([
      'The adjustment is too small to record (0.0001 at least)',
    ]);
    const other = stockAdjustmentSchema.safeParse({
      lotId: LOT_A,
      quantity: 3,
      reason: 'other',
      note: ' ',
    });
    expect(fieldErrors(other)).toEqual({
      note: ['Say what happened: a note is needed when the reason is "other"'],
    });
  });
});
