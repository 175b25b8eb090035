import { describe, expect, it } from 'vitest';
import { netQuantityStatement } from '../compliance/net-quantity-statement';
import { LABEL_FIELD_KEYS } from './label-content';
import {
  HOUSE_MINIMUM_INCHES,
  labelAreaSqIn,
  labelAreas,
  letterHeightMinimum,
} from './label-minimums';
import { BUILT_IN_LABEL_STOCKS, inchesToMm, type LabelStock } from './label-stock';

function stock(key: string): LabelStock {
  const found = BUILT_IN_LABEL_STOCKS.find((s) => s.key === key);
  if (!found) throw new Error(`no built-in stock ${key}`);
  return found;
}

const roll = (widthIn: number, heightIn: number, shape: LabelStock['shape']): LabelStock => ({
  kind: 'roll',
  name: 'Test roll',
  labelWidthMm: inchesToMm(widthIn),
  labelHeightMm: inchesToMm(heightIn),
  gapMm: 3,
  shape,
});

describe('label areas in square inches', () => {
  it.each([
    // Hand-worked: w × h
    ['a 2 5/8 × 1 in rectangle', roll(2.625, 1, { kind: 'rectangle' }), 2.625],
    ['a 2 × 1 in roll label', stock('roll-2x1in'), 2],
    ['a 4 × 6 in roll label', stock('roll-4x6in'), 24],
    // Hand-worked: π × 2² / 4 = π
    ['a 2 in circle', stock('letter-2in-circle-20'), Math.PI],
    // Hand-worked: π × 1.5 × 1 (semi-axes) = 4.712 389
    ['a 3 × 2 in oval', stock('letter-3x2in-oval-8'), 4.712389],
    // Hand-worked: 2.625 − (4 − π) × (1/16)² = 2.625 − 0.858 407 / 256 = 2.621 647
    ['the 30-up 2 5/8 × 1 in label, corners 1/16 in', stock('letter-2.625x1in-30'), 2.621647],
    // Hand-worked: (63.5 × 38.1 − 0.858 407 × 2.5²) / 25.4² = (2419.35 − 5.365 044) / 645.16 = 3.741684
    ['the A4 63.5 × 38.1 mm label, corners 2.5 mm', stock('a4-63.5x38.1mm-21'), 3.741684],
  ])('%s', (_what, labelStock, sqIn) => {
    expect(labelAreaSqIn(labelStock)).toBeCloseTo(sqIn, 5);
  });

  it('takes the front label as the principal display panel and counts both labels of a pair', () => {
    const twoUp = stock('letter-4x2in-10');
    // Hand-worked: 8 − (4 − π)/256 = 7.996 647; two labels 15.993 294
    expect(labelAreas(twoUp, 'single').pdpAreaSqIn).toBeCloseTo(7.996647, 5);
    expect(labelAreas(twoUp, 'single').labellingAreaSqIn).toBeCloseTo(7.996647, 5);
    expect(labelAreas(twoUp, 'small').labellingAreaSqIn).toBeCloseTo(7.996647, 5);
    expect(labelAreas(twoUp, 'panels')).toEqual({
      pdpAreaSqIn: expect.closeTo(7.996647, 5),
      labellingAreaSqIn: expect.closeTo(15.993294, 5),
    });
  });
});

describe('US minimum letter heights', () => {
  const areas = (pdpAreaSqIn: number, labellingAreaSqIn = pdpAreaSqIn) => ({
    pdpAreaSqIn,
    labellingAreaSqIn,
  });

  it.each([
    // 21 CFR 701.13: ≤ 5 sq in 1/16 in and ≤ 25 sq in 1/8 in (C2); larger rows from memory
    [2.62, 1 / 16, 'C2'],
    [5, 1 / 16, 'C2'],
    [5.01, 1 / 8, 'C2'],
    [24, 1 / 8, 'C2'],
    [26, 3 / 16, 'M'],
    [101, 1 / 4, 'M'],
    [401, 1 / 2, 'M'],
  ])('net quantity on a %s sq in panel: %s in (%s)', (pdp, inches, status) => {
    const minimum = letterHeightMinimum('US', 'netQuantity', areas(pdp));
    expect(minimum).toMatchObject({ inches, status, mm: inches * 25.4 });
    expect(minimum.source).toMatch(/^21 CFR 701\.13/);
    // The same row the engine's own statement reports
    expect(
      netQuantityStatement({ amount: 100, unit: 'g', pdpAreaSqIn: pdp }).minimumTypeHeight?.inches,
    ).toBe(inches);
  });

  it('ingredients: 1/16 in, or 1/32 in under 12 sq in of labelling surface', () => {
    // 21 CFR 701.3(b) (C2: FDA labelling guide text)
    expect(letterHeightMinimum('US', 'ingredients', areas(8, 16))).toEqual({
      mm: 1.5875,
      inches: 1 / 16,
      label: '1/16 in (1.59 mm)',
      source: '21 CFR 701.3(b)',
      status: 'C2',
    });
    expect(letterHeightMinimum('US', 'ingredients', areas(8, 11.99))).toEqual({
      mm: 0.79375,
      inches: 1 / 32,
      label: '1/32 in (0.79 mm)',
      source: '21 CFR 701.3(b), package under 12 sq in',
      status: 'C2',
    });
    expect(letterHeightMinimum('US', 'ingredients', areas(6, 12)).inches).toBe(1 / 16);
  });

  it('warnings: 1/16 in even on a small package', () => {
    // 21 CFR 740.2(a): no smaller-type exemption
    expect(letterHeightMinimum('US', 'warnings', areas(2, 2))).toMatchObject({
      inches: 1 / 16,
      source: '21 CFR 740.2(a)',
      status: 'C2',
    });
  });

  it.each([
    'productName',
    'business',
    'adverseEventContact',
    'lot',
    'durability',
    'directions',
  ] as const)('%s: the house minimum, marked as such', (field) => {
    const minimum = letterHeightMinimum('US', field, areas(8));
    expect(minimum).toMatchObject({ inches: HOUSE_MINIMUM_INCHES, status: 'house' });
    expect(minimum.source).toMatch(/common practice, no published source/);
  });
});

describe('EU, UK and Canadian minimum letter heights', () => {
  it.each(['EU', 'UK', 'CA'] as const)('%s: the house minimum for every field', (market) => {
    for (const field of LABEL_FIELD_KEYS) {
      const minimum = letterHeightMinimum(market, field, {
        pdpAreaSqIn: 30,
        labellingAreaSqIn: 60,
      });
      expect(minimum).toMatchObject({ inches: 1 / 32, mm: 0.79375, status: 'house' });
      expect(minimum.source).toMatch(/common practice, no published source/);
    }
  });

  it('names Art. 19(1) as the EU rule that has no number', () => {
    expect(
      letterHeightMinimum('EU', 'ingredients', { pdpAreaSqIn: 3, labellingAreaSqIn: 3 }).source,
    ).toMatch(/^Regulation \(EC\) No 1223\/2009, Art\. 19\(1\)/);
    expect(
      letterHeightMinimum('CA', 'netQuantity', { pdpAreaSqIn: 3, labellingAreaSqIn: 3 }).source,
    ).toMatch(/Consumer Packaging and Labelling Regulations.*not confirmed/);
  });

  it('refuses an area that is not a positive number', () => {
    expect(() =>
      letterHeightMinimum('US', 'lot', { pdpAreaSqIn: 0, labellingAreaSqIn: 1 }),
    ).toThrow(RangeError);
    expect(() =>
      letterHeightMinimum('EU', 'lot', { pdpAreaSqIn: 1, labellingAreaSqIn: Number.NaN }),
    ).toThrow(/labellingAreaSqIn/);
  });
});
