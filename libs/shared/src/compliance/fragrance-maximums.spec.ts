import { describe, expect, it } from 'vitest';
import { evaluateFormula } from './evaluate-formula';
import { aBathBomb, aBodyLotion, aFormula, aFragranceLine, aLine } from './formula-builders';
import { normaliseIfraCategory } from './fragrance-maximums';

function fragranceFindings(...lines: Parameters<typeof aFormula>[0]) {
  return evaluateFormula(aFormula(lines, aBathBomb(), { markets: ['US'] })).findings.filter(
    (f) => f.code.startsWith('FRAGRANCE') || f.code === 'IFRA_CATEGORY_CHECK',
  );
}

describe("fragrance against the supplier's IFRA maximum for the product's category", () => {
  it('blocks a fragrance above the maximum entered for the category, saying by how much and who to ask', () => {
    const [finding] = fragranceFindings(
      aLine(96.5, 'Sodium Bicarbonate'),
      aFragranceLine(3.5, 'Orchard Breeze', { '9': 3 }),
    );
    // IFRA Standards, via the supplier's certificate: the maximum is the user's entry, 3 % for Category 9
    expect(finding?.code).toBe('FRAGRANCE_OVER_MAXIMUM');
    expect(finding?.severity).toBe('block');
    expect(finding?.market).toBeNull();
    expect(finding?.message).toMatch(/3\.5 % of the product.*at most 3 % for Category 9/);
    expect(finding?.message).toMatch(/safety assessor/);
  });

  it('accepts a fragrance exactly at its maximum', () => {
    // IFRA Standards, via the supplier's certificate: the maximum itself is allowed
    expect(
      fragranceFindings(
        aLine(97, 'Sodium Bicarbonate'),
        aFragranceLine(3, 'Orchard Breeze', { '9': 3 }),
      ),
    ).toEqual([]);
  });

  it('sums the same fragrance over several lines before comparing', () => {
    const findings = fragranceFindings(
      aLine(96, 'Sodium Bicarbonate'),
      aFragranceLine(2, 'Orchard Breeze', { '9': 3 }),
      aFragranceLine(2, 'Orchard Breeze', { '9': 3 }),
    );
    // IFRA Standards: the maximum applies to the fragrance's total in the finished product
    expect(findings.map((f) => f.code)).toEqual(['FRAGRANCE_OVER_MAXIMUM']);
  });

  it("warns when no maximum is entered for the product's category", () => {
    const [finding] = fragranceFindings(
      aLine(98, 'Sodium Bicarbonate'),
      aFragranceLine(2, 'Orchard Breeze', { '5A': 1.2 }),
    );
    // common practice, no published source: with no maximum for the category, ask, don't pass
    expect(finding?.code).toBe('FRAGRANCE_NO_MAXIMUM');
    expect(finding?.severity).toBe('warn');
  });

  it('reads "Category 9" and "9" as the same category', () => {
    expect(normaliseIfraCategory('Category 9')).toBe('9');
    expect(normaliseIfraCategory(' cat. 5a ')).toBe('5A');
    expect(
      fragranceFindings(
        aLine(98, 'Sodium Bicarbonate'),
        aFragranceLine(2, 'Orchard Breeze', { 'Category 9': 3 }),
      ),
    ).toEqual([]);
  });

  it('warns when a fragrance has no certificate data at all', () => {
    const [finding] = fragranceFindings(
      aLine(98, 'Sodium Bicarbonate'),
      aLine(2, 'Fragrance', { name: 'Mystery Scent' }),
    );
    expect(finding?.code).toBe('FRAGRANCE_DATA_MISSING');
  });

  it('asks to check the category when a bath product is not set to Category 9', () => {
    const result = evaluateFormula(
      aFormula(
        [aLine(98, 'Sodium Bicarbonate'), aFragranceLine(2, 'Orchard Breeze', { '5A': 3 })],
        aBathBomb({ ifraCategory: '5A' }),
        { markets: ['US'] },
      ),
    );
    // IFRA 51st Amendment guidance: bath bombs in Category 9 (C2)
    expect(result.findings.find((f) => f.code === 'IFRA_CATEGORY_CHECK')?.severity).toBe('warn');
    const lotion = evaluateFormula(
      aFormula(
        [aLine(98, 'Aqua'), aFragranceLine(2, 'Orchard Breeze', { '5A': 3 })],
        aBodyLotion(),
        { markets: ['US'] },
      ),
    );
    expect(lotion.findings.find((f) => f.code === 'IFRA_CATEGORY_CHECK')).toBeUndefined();
  });
});
