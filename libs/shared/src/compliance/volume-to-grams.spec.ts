import { all, create } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { US_UNITS } from './us-customary-units';
import { DROP_MILLILITRES, volumeToGrams } from './volume-to-grams';

const math = create(all);
// mathjs's tablespoon/teaspoon are metric (15/5 mL), so define the US spoons (stack recipe caveat).
math.createUnit({ ustbsp: '0.5 floz', ustsp: '4.92892159375 mL' });
const mL = (expression: string) => math.unit(expression).toNumber('mL');

describe('US customary constants', () => {
  it('match mathjs for the ounce, pound, cup and fluid ounce', () => {
    // NIST Handbook 44/133: 1 oz = 28.349523125 g; 1 lb = 453.59237 g; 1 fl oz = 29.5735295625 mL; 1 cup = 8 fl oz
    expect(US_UNITS.ounceGrams).toBeCloseTo(math.unit('1 ounce').toNumber('g'), 9);
    expect(US_UNITS.poundGrams).toBeCloseTo(math.unit('16 ounce').toNumber('g'), 9);
    expect(US_UNITS.fluidOunceMillilitres).toBeCloseTo(mL('1 fluidounce'), 9);
    expect(US_UNITS.cupMillilitres).toBeCloseTo(mL('1 cup'), 9);
    expect(US_UNITS.gallonMillilitres).toBeCloseTo(mL('231 in^3'), 6);
  });

  it("match the US spoons (½ and ⅙ fl oz), not mathjs's metric spoons", () => {
    // NIST Handbook 133 [CALC]: tablespoon = 14.78676478125 mL, teaspoon = 4.92892159375 mL
    expect(US_UNITS.tablespoonMillilitres).toBeCloseTo(mL('1 ustbsp'), 9);
    expect(US_UNITS.teaspoonMillilitres).toBeCloseTo(mL('1 ustsp'), 9);
    expect(US_UNITS.tablespoonMillilitres).toBeCloseTo(3 * US_UNITS.teaspoonMillilitres, 12);
    expect(mL('1 tablespoon')).toBeCloseTo(15, 9); // mathjs's metric spoon, the trap the stack recipe warns about
  });
});

describe('volumeToGrams', () => {
  it('converts cups through a measured weight per cup', () => {
    // common practice, no published source: weigh one cup once, then convert
    const result = volumeToGrams({
      amount: 2,
      unit: 'cup',
      weightPerVolume: { grams: 240, amount: 1, unit: 'cup' },
    });
    expect(result.grams).toBeCloseTo(480, 9);
    expect(result.approximate).toBe(true);
  });

  it('converts tablespoons through a density in g/mL', () => {
    // NIST Handbook 133: 1 US tablespoon = 14.78676478125 mL
    const result = volumeToGrams({
      amount: 1,
      unit: 'tablespoon',
      weightPerVolume: { grams: 0.92, amount: 1, unit: 'millilitre' },
    });
    expect(result.grams).toBeCloseTo(14.78676478125 * 0.92, 9);
  });

  it('takes a drop as 0.05 mL and says it is only common practice', () => {
    // common practice, no published source: 1 drop = 0.05 mL
    expect(DROP_MILLILITRES).toBe(0.05);
    const result = volumeToGrams({
      amount: 20,
      unit: 'drop',
      weightPerVolume: { grams: 0.9, amount: 1, unit: 'millilitre' },
    });
    expect(result.grams).toBeCloseTo(0.9, 9);
    expect(result.notes.join(' ')).toMatch(/common practice/);
  });

  it('converts fluid ounces and teaspoons consistently (6 tsp = 1 fl oz)', () => {
    const density = { grams: 1, amount: 1, unit: 'millilitre' } as const;
    expect(
      volumeToGrams({ amount: 6, unit: 'teaspoon', weightPerVolume: density }).grams,
    ).toBeCloseTo(
      volumeToGrams({ amount: 1, unit: 'fluid-ounce', weightPerVolume: density }).grams,
      9,
    );
  });

  it('rejects a zero amount with a field path', () => {
    expect(() =>
      volumeToGrams({
        amount: 0,
        unit: 'cup',
        weightPerVolume: { grams: 1, amount: 1, unit: 'cup' },
      }),
    ).toThrow(/amount more than 0/);
  });
});
