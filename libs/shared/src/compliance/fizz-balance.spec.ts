import { MF } from 'mf-parser';
import { describe, expect, it } from 'vitest';
import { fizzBalance } from './fizz-balance';
import { molarMass } from './molar-mass';

describe('molar masses from atomic weights', () => {
  it.each([
    ['NaHCO3', 84.006],
    ['C6H8O7', 192.123],
    ['C6H8O7(H2O)', 210.138],
    ['KC4H5O6', 188.176],
    ['Na3C6H5O7', 258.068],
    ['CO2', 44.009],
    ['H2O', 18.015],
  ])('%s is %d g/mol and agrees with mf-parser', (formula, expected) => {
    // CIAAW standard atomic weights [CALC]
    expect(molarMass(formula)).toBeCloseTo(expected, 3);
    // mf-parser uses slightly different atomic weights: agree within 0.01 %
    const reference = new MF(formula).getInfo().mass;
    expect(Math.abs(molarMass(formula) - reference) / reference).toBeLessThan(1e-4);
  });

  it('balances 3 NaHCO3 + C6H8O7 → Na3C6H5O7 + 3 H2O + 3 CO2 by mass', () => {
    // Conservation of mass over 3 NaHCO3 + C6H8O7 → Na3C6H5O7 + 3 H2O + 3 CO2 (CIAAW atomic weights): 444.140 = 444.140 [CALC]
    const left = 3 * molarMass('NaHCO3') + molarMass('C6H8O7');
    const right = molarMass('Na3C6H5O7') + 3 * molarMass('H2O') + 3 * molarMass('CO2');
    expect(left).toBeCloseTo(444.14, 2);
    expect(right).toBeCloseTo(left, 9);
  });

  it('refuses an element it has no weight for', () => {
    expect(() => molarMass('MgSO4')).toThrow(/No atomic weight for Mg/);
  });
});

describe('fizzBalance', () => {
  it('finds the stoichiometric ratio 1.3117 : 1 baking soda to anhydrous citric acid balanced', () => {
    // Stoichiometry with CIAAW atomic weights [CALC]: 252.017 / 192.123 = 1.3117
    const result = fizzBalance([
      { inci: 'Sodium Bicarbonate', grams: 131.17 },
      { inci: 'Citric Acid', grams: 100 },
    ]);
    expect(result.excessGrams).toBeLessThan(0.01);
    expect(result.acidGramsForBase / 131.17).toBeCloseTo(1 / 1.3117, 4);
  });

  it('needs 76.23 g anhydrous or 83.38 g monohydrate citric acid per 100 g baking soda, releasing 52.39 g CO2', () => {
    // Stoichiometry with CIAAW atomic weights [CALC]
    const anhydrous = fizzBalance([
      { inci: 'Sodium Bicarbonate', grams: 100 },
      { inci: 'Citric Acid', grams: 1000 },
    ]);
    expect(anhydrous.limiting).toBe('base');
    expect(anhydrous.acidGramsForBase).toBeCloseTo(76.23, 2);
    expect(anhydrous.co2Grams).toBeCloseTo(52.39, 2);
    const monohydrate = fizzBalance([
      { inci: 'Sodium Bicarbonate', grams: 100 },
      { inci: 'Citric Acid', grams: 1000, reactant: 'citric-acid-monohydrate' },
    ]);
    expect(monohydrate.acidGramsForBase).toBeCloseTo(83.38, 2);
  });

  it('shows the common 2 : 1 recipe is acid-limited and leaves baking soda over', () => {
    // common practice, no published source: 2 : 1 by weight; excess from the [CALC] ratio
    const result = fizzBalance([
      { inci: 'Sodium Bicarbonate', grams: 200 },
      { inci: 'Citric Acid', grams: 100 },
    ]);
    expect(result.limiting).toBe('acid');
    expect(result.excessGrams).toBeCloseTo(200 - 131.17, 0);
    expect(result.co2Grams).toBeCloseTo(131.17 * 0.5239, 0);
  });

  it('counts cream of tartar as a one-proton acid and says that is from memory', () => {
    // from memory: KHC4H4O6 + NaHCO3 → KNaC4H4O6 + H2O + CO2
    const result = fizzBalance([
      { inci: 'Sodium Bicarbonate', grams: molarMass('NaHCO3') },
      { inci: 'Potassium Bitartrate', grams: molarMass('KC4H5O6') },
    ]);
    expect(result.limiting).toBe('balanced');
    expect(result.notes.join(' ')).toMatch(/from memory/);
  });

  it('reports no reaction without an acid', () => {
    expect(
      fizzBalance([
        { inci: 'Sodium Bicarbonate', grams: 100 },
        { inci: 'Zea Mays Starch', grams: 30 },
      ]).limiting,
    ).toBe('none');
  });
});
