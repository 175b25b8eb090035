import { describe, expect, it } from 'vitest';
import { evaluateFormula } from './evaluate-formula';
import { aBathBomb, aBodyLotion, aFormula, aFragranceLine, aLine } from './formula-builders';

type Draft = Parameters<typeof aFormula>;

function scentFindings(lines: Draft[0], product: Draft[1] = aBathBomb(), extra: Draft[2] = {}) {
  return evaluateFormula(aFormula(lines, product, extra)).findings.filter((f) =>
    f.code.startsWith('FRAGRANCE'),
  );
}

const lavender = (grams: number, extra = {}) =>
  aLine(grams, 'Lavandula Angustifolia Oil', { name: 'Lavender essential oil', ...extra });

describe('fragrant materials without supplier data', () => {
  it('blocks the EU, UK and Canada for an essential oil with no allergen breakdown, and says what to ask for', () => {
    const findings = scentFindings([aLine(98, 'Sodium Bicarbonate'), lavender(2)]);
    // Regulation (EC) No 1223/2009, Art. 19(1)(g) and Annex III: allergens above 0.01 % (rinse-off)
    // must be named, which needs the oil's composition
    const missing = findings.filter((f) => f.code === 'FRAGRANCE_ALLERGEN_DATA_MISSING');
    expect(missing.map((f) => f.market).sort()).toEqual(['CA', 'EU', 'UK']);
    for (const f of missing) expect(f.severity).toBe('block');
    expect(missing[0]!.message).toMatch(/Ask the supplier for its allergen declaration/);
    // the hint names the typical allergens, and says it is only a hint
    expect(missing[0]!.message).toMatch(
      /As a hint only: Lavender oil typically carries .*Linalool/,
    );
    // and the missing IFRA maximum is a Check for every market
    const ifra = findings.find((f) => f.code === 'FRAGRANCE_DATA_MISSING');
    expect(ifra?.severity).toBe('warn');
    expect(ifra?.market).toBeNull();
  });

  it('says nothing of allergens for the US, which has no allergen labelling rule yet', () => {
    // FD&C Act 609(b) (MoCRA): the allergen rule is not yet made
    const findings = scentFindings([aLine(98, 'Sodium Bicarbonate'), lavender(2)], aBathBomb(), {
      markets: ['US'],
    });
    expect(findings.map((f) => f.code)).toEqual(['FRAGRANCE_DATA_MISSING']);
  });

  it('recognises a fragrance by its function, its INCI name or its category', () => {
    // Regulation (EC) No 1223/2009, Annex III: any fragrance can carry labelled allergens
    for (const line of [
      aLine(2, 'Trade Secret Accord', { name: 'Accord A', functions: ['perfuming'] }),
      aLine(2, 'Parfum', { name: 'Accord B' }),
      aLine(2, 'Citrus Peel Distillate', { name: 'Accord C', category: 'essential-oil' }),
    ]) {
      const codes = scentFindings([aLine(98, 'Sodium Bicarbonate'), line], aBathBomb(), {
        markets: ['EU'],
      }).map((f) => f.code);
      expect(codes, line.material.name).toContain('FRAGRANCE_ALLERGEN_DATA_MISSING');
    }
  });

  it('finds an essential oil inside a blend', () => {
    // Regulation (EC) No 1223/2009, Annex III applies to the finished product, blends included
    const blend = aLine(5, 'Blend', {
      name: 'Calming oil blend',
      components: [
        { inci: 'Prunus Amygdalus Dulcis Oil', percent: 90 },
        { inci: 'Lavandula Angustifolia Oil', percent: 10 },
      ],
    });
    const codes = scentFindings([aLine(95, 'Sodium Bicarbonate'), blend], aBathBomb(), {
      markets: ['EU'],
    }).map((f) => f.code);
    expect(codes).toContain('FRAGRANCE_ALLERGEN_DATA_MISSING');
  });

  it('does not treat a carrier oil as fragrant', () => {
    // common practice, no published source: sweet almond oil is not a fragrance ingredient
    expect(
      scentFindings(
        [aLine(95, 'Sodium Bicarbonate'), aLine(5, 'Prunus Amygdalus Dulcis Oil')],
        aBathBomb(),
        { markets: ['EU'] },
      ),
    ).toEqual([]);
  });

  it('is satisfied by the supplier’s allergen declaration, even one that lists no allergens', () => {
    // Annex III: a declaration saying "none above threshold" is data; a missing declaration is not
    const findings = scentFindings(
      [aLine(98, 'Sodium Bicarbonate'), aFragranceLine(2, 'Clean Cotton', { '9': 4 }, [])],
      aBathBomb(),
      { markets: ['EU'] },
    );
    expect(findings).toEqual([]);
  });

  it('blocks when only the IFRA certificate is entered, because an empty allergen list then means unknown', () => {
    // Annex III: the certificate gives maxima, not composition
    const line = aLine(2, 'Parfum', {
      name: 'Sea Breeze',
      fragrance: { maxPercentByIfraCategory: { '9': 4 }, allergens: [], allergensDeclared: false },
    });
    const codes = scentFindings([aLine(98, 'Sodium Bicarbonate'), line], aBathBomb(), {
      markets: ['EU'],
    }).map((f) => f.code);
    expect(codes).toEqual(['FRAGRANCE_ALLERGEN_DATA_MISSING']);
  });

  it('only warns for Canada before its allergen labelling applies', () => {
    // Cosmetic Regulations as amended by SOR/2024-63: allergen labelling from 12 April 2026
    const before = scentFindings([aLine(98, 'Sodium Bicarbonate'), lavender(2)], aBodyLotion(), {
      markets: ['CA'],
      asOf: '2026-04-11',
    }).find((f) => f.code === 'FRAGRANCE_ALLERGEN_DATA_MISSING');
    expect(before?.severity).toBe('warn');
    const from = scentFindings([aLine(98, 'Sodium Bicarbonate'), lavender(2)], aBodyLotion(), {
      markets: ['CA'],
      asOf: '2026-04-12',
    }).find((f) => f.code === 'FRAGRANCE_ALLERGEN_DATA_MISSING');
    expect(from?.severity).toBe('block');
  });
});
