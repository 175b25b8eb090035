import { describe, expect, it } from 'vitest';
import { US_FOAMING_BATH_CAUTION } from '../reference-data/required-warnings';
import { evaluateFormula } from './evaluate-formula';
import { aBathBomb, aBodyLotion, aFormula, aLine } from './formula-builders';

const slsa = () =>
  aLine(12, 'Sodium Lauryl Sulfoacetate', { functions: ['surfactant - cleansing', 'foaming'] });

describe('21 CFR 740.17 caution for foaming detergent bath products', () => {
  it('adds the caution to the US label of a bath product with a foaming surfactant', () => {
    const result = evaluateFormula(
      aFormula([aLine(60, 'Sodium Bicarbonate'), aLine(28, 'Citric Acid'), slsa()], aBathBomb()),
    );
    // 21 CFR 740.17; text as in the FDA Q&A (1992, updated 1996)
    expect(result.warnings.US).toEqual([US_FOAMING_BATH_CAUTION]);
    expect(US_FOAMING_BATH_CAUTION).toMatch(
      /^Caution: Use only as directed\. Excessive use or prolonged exposure may cause irritation to skin and urinary tract\./,
    );
    expect(result.findings.find((f) => f.code === 'WARNING_FOAMING_BATH_CAUTION')?.source).toMatch(
      /21 CFR 740\.17/,
    );
    expect(result.warnings.EU).toEqual([]);
  });

  it('leaves the caution off when the product is labelled for adults only, and says what the label must say', () => {
    const result = evaluateFormula(
      aFormula([aLine(88, 'Sodium Bicarbonate'), slsa()], aBathBomb({ adultsOnly: true })),
    );
    // 21 CFR 740.17: not required if clearly labelled for use exclusively by adults
    expect(result.warnings.US).toEqual([]);
    expect(
      result.findings.find((f) => f.code === 'WARNING_FOAMING_BATH_ADULTS_ONLY')?.message,
    ).toMatch(/For adult use only/);
  });

  it('does not add it to a bath bomb without a surfactant', () => {
    // 21 CFR 740.17 definition needs a surface-active agent serving as detergent or foaming ingredient (interpretation)
    const result = evaluateFormula(
      aFormula([aLine(66, 'Sodium Bicarbonate'), aLine(34, 'Citric Acid')], aBathBomb()),
    );
    expect(result.warnings.US).toEqual([]);
  });

  it('does not add it to a product that is not used in the bath', () => {
    const result = evaluateFormula(
      aFormula([aLine(80, 'Aqua'), slsa()], aBodyLotion({ use: 'rinse-off' })),
    );
    expect(result.warnings.US).toEqual([]);
  });

  it('finds a foaming surfactant inside a blend', () => {
    const base = aLine(30, 'Bubble Base', {
      components: [
        { inci: 'Sodium Cocoyl Isethionate', functions: ['surfactant - cleansing'], percent: 60 },
        { inci: 'Cream of Tartar', usName: 'Potassium Bitartrate', percent: 40 },
      ],
    });
    expect(
      evaluateFormula(aFormula([aLine(70, 'Sodium Bicarbonate'), base], aBathBomb())).warnings.US,
    ).toHaveLength(1);
  });

  it('asks what a plain "surfactant" does rather than guessing', () => {
    const result = evaluateFormula(
      aFormula(
        [
          aLine(95, 'Sodium Bicarbonate'),
          aLine(5, 'Polysorbate 80', { functions: ['surfactant'] }),
        ],
        aBathBomb(),
      ),
    );
    expect(result.warnings.US).toEqual([]);
    expect(result.findings.find((f) => f.code === 'WARNING_SURFACTANT_ROLE_CHECK')?.severity).toBe(
      'warn',
    );
  });
});

describe('foaming surfactants recognised by INCI name', () => {
  it('adds the caution and a directions reminder for sodium lauryl sulfoacetate typed with no function', () => {
    // 21 CFR 740.17: "a surface-active agent serving as a detergent or foaming ingredient"
    const result = evaluateFormula(
      aFormula(
        [aLine(90, 'Sodium Bicarbonate'), aLine(10, 'Sodium Lauryl Sulfoacetate')],
        aBathBomb(),
        { markets: ['US'] },
      ),
    );
    expect(result.warnings.US).toEqual([US_FOAMING_BATH_CAUTION]);
    // from memory: 740.17 also asks for adequate directions for safe use
    const reminder = result.findings.find((f) => f.code === 'WARNING_FOAMING_BATH_DIRECTIONS');
    expect(reminder?.severity).toBe('info');
    expect(reminder?.message).toMatch(/directions for safe use/);
  });

  it('knows the common foaming surfactants by name', () => {
    // 21 CFR 740.17 definition, applied to names makers buy
    for (const inci of [
      'Sodium Coco-Sulfate',
      'Cocamidopropyl Betaine',
      'Decyl Glucoside',
      'Sodium Cocoyl Isethionate',
    ]) {
      const result = evaluateFormula(
        aFormula([aLine(90, 'Sodium Bicarbonate'), aLine(10, inci)], aBathBomb(), {
          markets: ['US'],
        }),
      );
      expect(result.warnings.US, inci).toEqual([US_FOAMING_BATH_CAUTION]);
    }
  });
});
