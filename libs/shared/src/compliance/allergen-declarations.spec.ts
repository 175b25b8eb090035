import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { exceedsThreshold } from './allergen-declarations';
import { evaluateFormula } from './evaluate-formula';
import type { EvaluationInputDraft } from './evaluation-input-schema';
import { aBathBomb, aBodyLotion, aFormula, aFragranceLine, aLine } from './formula-builders';

type Product = EvaluationInputDraft['product'];

/** 100 g of product with `fragrancePercent` % of a fragrance holding `allergenPercent` % of one allergen. */
function allergenIn(
  product: Product,
  fragrancePercent: number,
  allergen: { inci: string; cas?: string; percent: number },
  extra: Partial<EvaluationInputDraft> = {},
) {
  const input = aFormula(
    [
      aLine(100 - fragrancePercent, 'Aqua'),
      aFragranceLine(fragrancePercent, 'Test Fragrance', { '9': 10, '5A': 10 }, [allergen]),
    ],
    product,
    extra,
  );
  return evaluateFormula(input);
}

describe('fragrance allergens: percent in product and the labelling thresholds', () => {
  // Check values [CALC] from Regulation (EC) No 1223/2009, Annex III threshold wording (0.001 % leave-on, 0.01 % rinse-off)
  it('declares limonene at 0.6 % in a bath bomb (2.0 % fragrance × 30 %)', () => {
    const [limonene] = allergenIn(aBathBomb(), 2, {
      inci: 'Limonene',
      cas: '5989-27-5',
      percent: 30,
    }).allergens.EU!;
    expect(limonene?.percent).toBeCloseTo(0.6, 10);
    expect(limonene?.declared).toBe(true); // Regulation (EC) No 1223/2009, Annex III: > 0.01 % rinse-off
  });

  it('does not declare linalool at exactly 0.001 % in a body lotion (0.5 % × 0.2 %)', () => {
    const [linalool] = allergenIn(aBodyLotion(), 0.5, { inci: 'Linalool', percent: 0.2 }).allergens
      .EU!;
    expect(linalool?.percent).toBeCloseTo(0.001, 12);
    expect(linalool?.declared).toBe(false); // Regulation (EC) No 1223/2009, Annex III: "exceeds 0.001 %" leave-on
  });

  it('declares linalool at 0.00105 % in a body lotion (0.5 % × 0.21 %)', () => {
    const [linalool] = allergenIn(aBodyLotion(), 0.5, { inci: 'Linalool', percent: 0.21 }).allergens
      .EU!;
    expect(linalool?.declared).toBe(true); // Regulation (EC) No 1223/2009, Annex III
  });

  it('does not declare geraniol at exactly 0.01 % in a shower gel, but does in a body butter', () => {
    const showerGel = aBodyLotion({ use: 'rinse-off', ifraCategory: '9' });
    expect(
      allergenIn(showerGel, 1, { inci: 'Geraniol', percent: 1 }).allergens.EU![0]?.declared,
    ).toBe(false); // Annex III: > 0.01 % rinse-off
    expect(
      allergenIn(aBodyLotion(), 1, { inci: 'Geraniol', percent: 1 }).allergens.EU![0]?.declared,
    ).toBe(true); // Annex III: > 0.001 % leave-on
  });

  it('treats 0.001 % as not exceeding and 0.0011 % as exceeding the leave-on threshold', () => {
    // Regulation (EC) No 1223/2009, Annex III: "when its concentration exceeds 0.001 %"
    expect(exceedsThreshold(0.001, 0.001)).toBe(false);
    expect(exceedsThreshold(0.0011, 0.001)).toBe(true);
    expect(exceedsThreshold(0.5 * 0.2 * 0.01, 0.001)).toBe(false);
  });

  it('sums an allergen over several fragrance lines and a directly added ingredient', () => {
    const input = aFormula(
      [
        aLine(98.5, 'Aqua'),
        aFragranceLine(0.5, 'Fragrance A', { '5A': 2 }, [{ inci: 'Benzyl Alcohol', percent: 0.1 }]),
        aFragranceLine(0.5, 'Fragrance B', { '5A': 2 }, [
          { inci: 'Benzyl Alcohol', cas: '100-51-6', percent: 0.1 },
        ]),
        aLine(0.5, 'Benzyl Alcohol', { functions: ['preservative'] }),
      ],
      aBodyLotion(),
    );
    const allergens = evaluateFormula(input).allergens.EU!;
    expect(allergens).toHaveLength(1);
    expect(allergens[0]?.percent).toBeCloseTo(0.0005 + 0.0005 + 0.5, 10);
  });

  it('matches an allergen by CAS number when the supplier names it differently', () => {
    const [entry] = allergenIn(aBathBomb(), 2, {
      inci: 'd-Limonene',
      cas: '5989-27-5',
      percent: 10,
    }).allergens.EU!;
    expect(entry?.inci).toBe('Limonene'); // Annex III entry 88 covers CAS 5989-27-5
    expect(entry?.annexRef).toBe('88');
  });

  it('never declares allergens on US labels: they stay within "Fragrance"', () => {
    const result = allergenIn(aBathBomb(), 2, { inci: 'Limonene', percent: 30 });
    expect(result.allergens.US![0]?.declared).toBe(false); // FD&C Act 609(b): rule not yet made (RIN 0910-AI90)
    expect(result.declarations.US?.ingredients).not.toContain('Limonene');
  });
});

describe('allergen dates', () => {
  const benzaldehyde = { inci: 'Benzaldehyde', cas: '100-52-7', percent: 1 };

  it('requires an allergen added by (EU) 2023/1545 only for products placed on the EU market after 31 July 2026', () => {
    // Regulation (EU) 2023/1545, Annex III footnote: may be placed on the market until 31 July 2026
    const before = allergenIn(aBathBomb(), 2, benzaldehyde, { asOf: '2026-07-31' });
    expect(before.allergens.EU![0]?.declared).toBe(false);
    expect(
      before.findings.find((f) => f.code === 'ALLERGEN_UPCOMING' && f.market === 'EU')?.message,
    ).toMatch(/2026-08-01.*2028-07-31/);
    const after = allergenIn(aBathBomb(), 2, benzaldehyde, { asOf: '2026-08-01' });
    expect(after.allergens.EU![0]?.declared).toBe(true);
    expect(after.declarations.EU?.ingredients).toContain('Benzaldehyde');
  });

  it('requires the original allergens in Canada from 12 April 2026', () => {
    // SOR/2024-63: allergen provisions in force 12 April 2026
    expect(
      allergenIn(aBathBomb(), 2, { inci: 'Limonene', percent: 30 }, { asOf: '2026-04-11' })
        .allergens.CA![0]?.declared,
    ).toBe(false);
    expect(
      allergenIn(aBathBomb(), 2, { inci: 'Limonene', percent: 30 }, { asOf: '2026-04-12' })
        .allergens.CA![0]?.declared,
    ).toBe(true);
  });

  it('mirrors the EU dates in the UK and marks that as unconfirmed', () => {
    // from memory: GB adoption of the 2023/1545 list not confirmed
    const before = allergenIn(aBathBomb(), 2, benzaldehyde, { asOf: '2026-07-31' });
    expect(
      before.findings.find((f) => f.code === 'ALLERGEN_UPCOMING' && f.market === 'UK')?.status,
    ).toBe('M');
  });
});

describe('allergen limits and unknowns', () => {
  it('blocks isoeugenol above its 0.02 % Annex III maximum', () => {
    const result = allergenIn(aBodyLotion(), 1, { inci: 'Isoeugenol', cas: '97-54-1', percent: 3 });
    // Regulation (EC) No 1223/2009, Annex III entry 73: 0.02 % in products other than oral products
    const finding = result.findings.find(
      (f) => f.code === 'ALLERGEN_OVER_MAXIMUM' && f.market === 'EU',
    );
    expect(finding?.severity).toBe('block');
    expect(finding?.message).toMatch(/0\.03 %.*at most 0\.02 %/);
  });

  it('names an allergen it cannot find on its list as a precaution, and says so', () => {
    const result = allergenIn(aBathBomb(), 2, { inci: 'Florasol Accord', percent: 5 });
    expect(result.allergens.EU![0]?.declared).toBe(true);
    expect(result.findings.find((f) => f.code === 'ALLERGEN_NOT_LISTED')?.severity).toBe('warn');
  });

  it('blocks a former allergen now prohibited when a fragrance declares it, and does not name it as an allergen', () => {
    const result = allergenIn(aBathBomb(), 2, {
      inci: 'Butylphenyl Methylpropional',
      cas: '80-54-6',
      percent: 1,
    });
    // Regulation (EU) 2021/1902: butylphenyl methylpropional in Annex II from 1 March 2022
    const finding = result.findings.find(
      (f) => f.code === 'PROHIBITED_SUBSTANCE' && f.market === 'EU',
    );
    expect(finding?.severity).toBe('block');
    expect(finding?.message).toMatch(/declared inside a fragrance/);
    expect(result.findings.some((f) => f.code === 'ALLERGEN_NOT_LISTED' && f.market === 'EU')).toBe(
      false,
    );
  });

  it('asks the assessor about rinse-off vs leave-on when a bath product has an allergen between the two thresholds', () => {
    const result = allergenIn(aBathBomb(), 1, { inci: 'Linalool', percent: 0.5 });
    // Annex III thresholds: 0.005 % is above 0.001 % (leave-on) but not above 0.01 % (rinse-off)
    expect(result.allergens.EU![0]?.declared).toBe(false);
    expect(
      result.findings.find((f) => f.code === 'ALLERGEN_CLASSIFICATION_CHECK' && f.market === 'EU')
        ?.severity,
    ).toBe('warn');
  });
});

describe('allergen properties', () => {
  it('allergen percent in the product rises monotonically with the fragrance percent', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.01, max: 20, noNaN: true }),
        fc.double({ min: 0.01, max: 20, noNaN: true }),
        fc.double({ min: 0.001, max: 100, noNaN: true }),
        (a, b, allergenPercent) => {
          const [low, high] = a <= b ? [a, b] : [b, a];
          const percentAt = (fragranceGrams: number) =>
            evaluateFormula(
              aFormula(
                [
                  aLine(100, 'Aqua'),
                  aFragranceLine(fragranceGrams, 'Test Fragrance', { '9': 100 }, [
                    { inci: 'Limonene', percent: allergenPercent },
                  ]),
                ],
                aBathBomb(),
                { markets: ['EU'] },
              ),
            ).allergens.EU![0]!.percent;
          expect(percentAt(high)).toBeGreaterThanOrEqual(percentAt(low));
        },
      ),
    );
  });
});
