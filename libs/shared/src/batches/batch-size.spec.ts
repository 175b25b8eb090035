import { describe, expect, it } from 'vitest';
import { roundTo, scaleStepGrams, weighSheet } from './batch-size';

// A released version of 100 g: 45 % citric acid, 30 % bicarbonate, 25 % starch.
const version = [
  { materialId: 'citric', materialName: 'Citric acid', grams: 45 },
  { materialId: 'bicarb', materialName: 'Sodium bicarbonate', grams: 30 },
  { materialId: 'starch', materialName: 'Corn starch', grams: 25 },
];

describe('weighSheet', () => {
  it('sizes by units × unit mass plus the loss: 24 × 180 g + 3 % = 4,449.6 g', () => {
    const sheet = weighSheet(version, { units: 24, unitMassGrams: 180, lossPercent: 3 });
    // 24 × 180 = 4,320 g; × 1.03 = 4,449.6 g
    expect(sheet.size).toEqual({
      units: 24,
      unitMassGrams: 180,
      targetGrams: 4320,
      lossPercent: 3,
      batchGrams: 4449.6,
    });
  });

  it('scales each line from the version and rounds it for the scale', () => {
    const sheet = weighSheet(version, { units: 24, unitMassGrams: 180, lossPercent: 3 });
    // 45 % of 4,449.6 = 2,002.32 g → 2,002 g; 30 % = 1,334.88 → 1,335 g; 25 % = 1,112.4 → 1,112 g
    expect(
      sheet.lines.map((l) => [l.materialName, l.percent, l.grams, l.weighGrams, l.stepGrams]),
    ).toEqual([
      ['Citric acid', 45, 2002.32, 2002, 1],
      ['Sodium bicarbonate', 30, 1334.88, 1335, 1],
      ['Corn starch', 25, 1112.4, 1112, 1],
    ]);
  });

  it('checks the rounded sum against the batch and says the difference', () => {
    const { sum, notes } = weighSheet(version, { units: 24, unitMassGrams: 180, lossPercent: 3 });
    // 2,002 + 1,335 + 1,112 = 4,449 g: 0.6 g under 4,449.6 g, inside 3 × 0.5 g of rounding
    expect(sum).toEqual({
      batchGrams: 4449.6,
      roundedGrams: 4449,
      differenceGrams: -0.6,
      withinRounding: true,
    });
    expect(notes).toEqual([
      'The rounded lines add up to 4,449.00 g, 0.60 g under the batch of 4,449.60 g (rounding to the scale)',
    ]);
  });

  it('sizes by total grams with the loss on top, as the scale panel does', () => {
    // 2,000 g + 5 % = 2,100 g; 45 % = 945 g (0.1 g step), 30 % = 630 g, 25 % = 525 g
    const sheet = weighSheet(version, { totalGrams: 2000, lossPercent: 5 });
    expect(sheet.size).toMatchObject({
      units: null,
      unitMassGrams: null,
      targetGrams: 2000,
      batchGrams: 2100,
    });
    expect(sheet.lines.map((l) => [l.weighGrams, l.stepGrams])).toEqual([
      [945, 0.1],
      [630, 0.1],
      [525, 0.1],
    ]);
    expect(sheet.sum.differenceGrams).toBe(0);
    expect(sheet.notes).toEqual([]);
  });

  it('weighs a small addition to 0.01 g and says when a line is too small for any scale', () => {
    const lines = [
      { materialId: 'base', grams: 99.4 },
      { materialId: 'fragrance', grams: 0.59 },
      { materialId: 'trace', grams: 0.01 },
    ];
    // 500 g: 497 g (0.1 step), 2.95 g (0.01 step), 0.05 g → 0.05 (0.01 step)
    const sheet = weighSheet(lines, { totalGrams: 500 });
    expect(sheet.lines.map((l) => [l.grams, l.weighGrams, l.stepGrams])).toEqual([
      [497, 497, 0.1],
      [2.95, 2.95, 0.01],
      [0.05, 0.05, 0.01],
    ]);
    // 10 g: the 0.01 % line is 0.001 g, which rounds to nothing
    const tiny = weighSheet(lines, { totalGrams: 10 });
    expect(tiny.lines[2]).toMatchObject({ grams: 0.001, weighGrams: 0 });
    expect(tiny.notes[0]).toBe(
      'A line of 0.001 g is below what a 0.01 g scale reads: weigh a premix or make a larger batch',
    );
  });

  it('refuses a loss allowance over 50 % and a version that weighs nothing', () => {
    expect(() => weighSheet(version, { totalGrams: 100, lossPercent: 50.5 })).toThrow(
      'The loss allowance must be 0 to 50 %',
    );
    expect(() => weighSheet([{ grams: 0 }], { totalGrams: 100 })).toThrow(RangeError);
  });
});

describe('scaleStepGrams and roundTo', () => {
  it('steps at 10 g and 1 kg', () => {
    expect([9.99, 10, 999.99, 1000].map(scaleStepGrams)).toEqual([0.01, 0.1, 0.1, 1]);
  });

  it('rounds half up on the decimal text, without binary noise', () => {
    // 1.005 is stored as 1.00499999…; rounding the text gives 1.01
    expect(roundTo(1.005, 2)).toBe(1.01);
    expect(roundTo(0.1 + 0.2, 6)).toBe(0.3);
    expect(roundTo(1e-7, 6)).toBe(0);
  });
});
