import { describe, expect, it } from 'vitest';
import { evaluateFormula } from './evaluate-formula';
import { aBathBomb, aFormula, aLine } from './formula-builders';

const labelFinding = (product: Parameters<typeof aBathBomb>[0]) =>
  evaluateFormula(aFormula([aLine(100, 'Sodium Bicarbonate')], aBathBomb(product))).findings.find(
    (f) => f.code === 'LABEL_DETAILS_MISSING',
  );

describe('what a label will need', () => {
  it('asks for the net quantity and unit mass when both are missing, naming them', () => {
    // 21 CFR 701.13 and Regulation (EC) No 1223/2009, Art. 19(1)(b): the net quantity is required
    const finding = labelFinding({});
    expect(finding?.severity).toBe('warn');
    expect(finding?.message).toMatch(/net quantity and unit mass/);
  });

  it('names only what is missing', () => {
    expect(labelFinding({ unitMassGrams: 180 })?.message).toMatch(/Enter the net quantity in/);
    expect(labelFinding({ netQuantity: { amount: 180, unit: 'g' } })?.message).toMatch(
      /Enter the unit mass in/,
    );
  });

  it('says nothing when both are there', () => {
    expect(
      labelFinding({ unitMassGrams: 180, netQuantity: { amount: 180, unit: 'g' } }),
    ).toBeUndefined();
  });
});
