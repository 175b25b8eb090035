import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { scaleFormula } from './scale-formula';

describe('scaleFormula', () => {
  it('makes units × unit weight plus the loss allowance', () => {
    // common practice, no published source: scale by units × unit weight, plus a loss allowance
    const scaled = scaleFormula(
      [
        { name: 'Sodium Bicarbonate', grams: 50 },
        { name: 'Citric Acid', grams: 25 },
        { name: 'Zea Mays Starch', grams: 25 },
      ],
      {
        units: 12,
        unitGrams: 113,
        lossPercent: 5,
      },
    );
    expect(scaled.targetGrams).toBe(1356);
    expect(scaled.batchGrams).toBeCloseTo(1423.8, 9);
    expect(scaled.lines.map((l) => l.scaledGrams)).toEqual(
      [711.9, 355.95, 355.95].map((g) => expect.closeTo(g, 9)),
    );
    expect(scaled.lines[0]?.name).toBe('Sodium Bicarbonate');
  });

  it('leaves every percentage unchanged', () => {
    fc.assert(
      fc.property(
        fc
          .array(fc.double({ min: 0, max: 1000, noNaN: true }), { minLength: 1, maxLength: 40 })
          .filter((g) => g.some((x) => x > 0)),
        fc.integer({ min: 1, max: 500 }),
        fc.double({ min: 0.1, max: 1000, noNaN: true }),
        fc.double({ min: 0, max: 50, noNaN: true }),
        (grams, units, unitGrams, lossPercent) => {
          const lines = grams.map((g) => ({ grams: g }));
          const total = grams.reduce((a, b) => a + b, 0);
          const scaled = scaleFormula(lines, { units, unitGrams, lossPercent });
          scaled.lines.forEach((line, i) => {
            expect(line.percent).toBeCloseTo((grams[i]! / total) * 100, 9);
            expect((line.scaledGrams / scaled.batchGrams) * 100).toBeCloseTo(line.percent, 9);
          });
        },
      ),
    );
  });

  it('rejects a fractional unit count and a formula that weighs nothing', () => {
    expect(() => scaleFormula([{ grams: 1 }], { units: 2.5, unitGrams: 100 })).toThrow(
      /whole number/,
    );
    expect(() => scaleFormula([{ grams: 0 }], { units: 2, unitGrams: 100 })).toThrow(RangeError);
  });
});
