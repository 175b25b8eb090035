import { unit } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { PRODUCT_TYPES } from '../compliance/product-types';
import { exposureInputSchema, type ExposureInput } from './assessment-api';
import {
  DEFAULT_BODY_WEIGHT_KG,
  EXPOSURE_DEFAULTS,
  exposureDefaultsFor,
  exposureFromAmount,
  findExposureDefault,
  PRESETS_BY_PRODUCT_TYPE,
  productExposure,
} from './exposure-defaults';

const input = (over: Partial<ExposureInput>): ExposureInput =>
  exposureInputSchema.parse({
    presetKey: null,
    dailyAmountGrams: 1,
    retentionFactor: 1,
    bodyWeightKg: DEFAULT_BODY_WEIGHT_KG,
    source: '',
    ...over,
  });

describe('EXPOSURE_DEFAULTS (SCCS Notes of Guidance, SCCS/1647/22)', () => {
  it('carries the Table 3A rows as read (daily amount, retention factor, published A)', () => {
    // SCCS/1647/22 Table 3A [C2], docs/reference-sources/safety-assessment.md S1
    const row = (key: string) => findExposureDefault(key)!;
    expect([row('shower-gel').dailyAmountGrams, row('shower-gel').retentionFactor]).toEqual([
      18.67, 0.01,
    ]);
    expect(row('shower-gel').exposureMgPerKgDay).toBe(2.79);
    expect(row('body-lotion').exposureMgPerKgDay).toBe(123.2);
    expect(row('hand-cream').exposureMgPerKgDay).toBe(32.7);
    expect(row('face-cream').exposureMgPerKgDay).toBe(24.14);
    // hand wash soap is from memory until read in the table
    expect(row('hand-wash-soap').status).toBe('M');
  });

  it('uses only the retention factors of the table (1 leave-on, 0.1 hair styling, 0.01 rinse-off) and names a source for every row', () => {
    // SCCS/1647/22 Table 3A f_ret column [C2]
    for (const row of EXPOSURE_DEFAULTS) {
      expect([0.01, 0.1, 1]).toContain(row.retentionFactor);
      expect(row.source.length).toBeGreaterThan(10);
    }
  });

  it('keeps every row with unique keys and every product type mapping to existing rows', () => {
    const keys = EXPOSURE_DEFAULTS.map((r) => r.key);
    expect(new Set(keys).size).toBe(keys.length);
    for (const type of PRODUCT_TYPES)
      for (const key of PRESETS_BY_PRODUCT_TYPE[type]) expect(keys).toContain(key);
  });

  it('marks the bath-product row as common practice the assessor must confirm', () => {
    // Common practice, no published source: SCCS/1647/22 has no bath-product row
    const bath = findExposureDefault('bath-product-assumed')!;
    expect(bath.status).toBe('practice');
    expect(bath.source).toMatch(/no published source/);
    expect(bath.note).toMatch(/assessor must confirm/);
    expect(bath.productTypes).toEqual(
      expect.arrayContaining(['fizzer', 'bubble-bar', 'bath-salts', 'shower-steamer']),
    );
  });
});

describe('exposureDefaultsFor', () => {
  it('offers bath bombs the marked bath assumption first, then shower gel', () => {
    expect(exposureDefaultsFor('fizzer').map((r) => r.key)).toEqual([
      'bath-product-assumed',
      'shower-gel',
    ]);
  });

  it('offers soap the hand wash soap row first and lotion the body lotion row first', () => {
    expect(exposureDefaultsFor('soap')[0]?.key).toBe('hand-wash-soap');
    expect(exposureDefaultsFor('lotion').map((r) => r.key)).toEqual([
      'body-lotion',
      'hand-cream',
      'face-cream',
    ]);
  });

  it('offers nothing for a type without a fitting row or an unknown type', () => {
    expect(exposureDefaultsFor('nail-product')).toEqual([]);
    expect(exposureDefaultsFor('not-a-type')).toEqual([]);
  });
});

describe('productExposure', () => {
  it('uses the published A 123.20 for body lotion taken as shipped (SCCS/1647/22 Table 3A)', () => {
    const result = productExposure(
      input({ presetKey: 'body-lotion', dailyAmountGrams: 7.82, retentionFactor: 1 }),
    );
    expect(result).toEqual({
      exposureMgPerKgDay: 123.2,
      defaulted: true,
      presetLabel: 'Body lotion (leave-on)',
      source: 'SCCS/1647/22 (12th revision), Table 3A',
    });
  });

  it('works out 3.111 mg/kg bw/d for 18.67 g/d × 0.01 at 60 kg (regulatory-sources.md E3)', () => {
    // E3: 18.67 × 0.01 × 1000 / 60 = 3.111 (the table's 2.79 uses individual body weights)
    const result = productExposure(
      input({
        presetKey: null,
        dailyAmountGrams: 18.67,
        retentionFactor: 0.01,
        source: 'Own survey',
      }),
    );
    expect(result.exposureMgPerKgDay).toBeCloseTo(3.1117, 4);
    expect(result.defaulted).toBe(false);
    expect(result.presetLabel).toBeNull();
    expect(result.source).toBe('Own survey');
  });

  it('agrees with mathjs unit conversion (g → mg) for the first-principles A', () => {
    // reference library: mathjs converts 0.1867 g to 186.7 mg; / 60 kg = 3.111 mg/kg bw/d
    const mg = unit(18.67 * 0.01, 'g').toNumber('mg');
    expect(exposureFromAmount(18.67, 0.01, 60)).toBeCloseTo(mg / 60, 10);
  });

  it('computes from first principles when the assessor changes a preset value, keeping its source', () => {
    // hand-worked: body lotion at 10 g/d × 1.0 × 1000 / 60 = 166.67 mg/kg bw/d
    const result = productExposure(
      input({ presetKey: 'body-lotion', dailyAmountGrams: 10, retentionFactor: 1 }),
    );
    expect(result.exposureMgPerKgDay).toBeCloseTo(166.667, 3);
    expect(result.defaulted).toBe(false);
    expect(result.source).toMatch(/Table 3A, values changed by the assessor/);
  });

  it('computes from first principles when only the body weight changes (child of 15 kg, hand-worked)', () => {
    // 2.16 g/d × 1.0 × 1000 / 15 kg = 144 mg/kg bw/d
    const result = productExposure(
      input({
        presetKey: 'hand-cream',
        dailyAmountGrams: 2.16,
        retentionFactor: 1,
        bodyWeightKg: 15,
      }),
    );
    expect(result.exposureMgPerKgDay).toBeCloseTo(144, 9);
    expect(result.defaulted).toBe(false);
  });

  it('treats an unknown preset key as the assessor’s own values', () => {
    const result = productExposure(
      input({ presetKey: 'gone', dailyAmountGrams: 6, retentionFactor: 0.5, source: '' }),
    );
    // 6 × 0.5 × 1000 / 60 = 50
    expect(result.exposureMgPerKgDay).toBeCloseTo(50, 9);
    expect(result.presetLabel).toBeNull();
  });
});
