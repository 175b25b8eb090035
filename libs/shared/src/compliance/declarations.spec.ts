import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { usCommonName } from './declarations';
import { evaluateFormula } from './evaluate-formula';
import {
  aBathBomb,
  aBodyLotion,
  aColourLine,
  aFormula,
  aFragranceLine,
  aLine,
} from './formula-builders';
import { normaliseName } from './ingredient-names';

describe('US ingredient declaration (21 CFR 701.3)', () => {
  it('lists ingredients in descending order of weight, using the US name where one is given', () => {
    const result = evaluateFormula(
      aFormula(
        [
          aLine(20, 'Citric Acid'),
          aLine(45, 'Sodium Bicarbonate'),
          aLine(12, 'Zea Mays Starch', { usName: 'Corn Starch' }),
        ],
        aBathBomb(),
        { markets: ['US'] },
      ),
    );
    // 21 CFR 701.3(a): descending order of predominance
    expect(result.declarations.US?.ingredients).toEqual([
      'Sodium Bicarbonate',
      'Citric Acid',
      'Corn Starch',
    ]);
    expect(result.declarations.US?.text).toBe(
      'Ingredients: Sodium Bicarbonate, Citric Acid, Corn Starch.',
    );
  });

  it('declares a fragrance oil as "Fragrance" and puts colour additives last whatever their weight', () => {
    const result = evaluateFormula(
      aFormula(
        [
          aLine(60, 'Sodium Bicarbonate'),
          aColourLine(5, 'CI 77891', '77891'),
          aLine(2, 'Polysorbate 80'),
          aFragranceLine(3, 'Orchard Breeze', { '9': 4 }),
        ],
        aBathBomb(),
        { markets: ['US'] },
      ),
    );
    // 21 CFR 701.3(a) ("fragrance"); 701.3(f)(3) colour additives after the others
    expect(result.declarations.US?.ingredients).toEqual([
      'Sodium Bicarbonate',
      'Fragrance',
      'Polysorbate 80',
      'Titanium Dioxide',
    ]);
    expect(result.declarations.US?.groups.colourants).toEqual(['Titanium Dioxide']);
  });

  it('puts an ingredient at exactly 1 % in the "any order" group in the US but keeps it ordered in the EU', () => {
    const input = aFormula(
      [aLine(90, 'Sodium Chloride'), aLine(9, 'Magnesium Sulfate'), aLine(1, 'Kaolin')],
      aBathBomb(),
      { markets: ['US', 'EU'] },
    );
    const result = evaluateFormula(input);
    // 21 CFR 701.3(f)(2): "not more than 1 percent"
    expect(result.declarations.US?.groups.anyOrder).toEqual(['Kaolin']);
    // from memory: Art. 19(1)(g) says "less than 1 %", so 1.00 % stays ordered
    expect(result.declarations.EU?.groups.ordered).toContain('Kaolin');
    expect(result.declarations.EU?.groups.anyOrder).toEqual([]);
  });

  it('expands a blend into its components and declares an ingredient arriving through several lines once, by its summed weight', () => {
    const base = aLine(40, 'Fizz Base Blend', {
      components: [
        { inci: 'Sodium Bicarbonate', percent: 50 },
        { inci: 'Citric Acid', percent: 50 },
      ],
    });
    const result = evaluateFormula(
      aFormula([aLine(30, 'Citric Acid'), base, aLine(25, 'Magnesium Sulfate')], aBathBomb(), {
        markets: ['US'],
      }),
    );
    // Citric acid 30 + 20 = 50 g; sodium bicarbonate 20 g; magnesium sulfate 25 g. 21 CFR 701.3(a)
    expect(result.declarations.US?.ingredients).toEqual([
      'Citric Acid',
      'Magnesium Sulfate',
      'Sodium Bicarbonate',
    ]);
    expect(result.declarations.US?.ingredients).not.toContain('Fizz Base Blend');
  });

  it('leaves incidental ingredients off and says so', () => {
    const result = evaluateFormula(
      aFormula(
        [aLine(80, 'Sodium Bicarbonate'), aLine(0.1, 'Tocopherol', { incidental: true })],
        aBathBomb(),
        { markets: ['US'] },
      ),
    );
    // 21 CFR 701.3(l)
    expect(result.declarations.US?.ingredients).toEqual(['Sodium Bicarbonate']);
    expect(result.findings.find((f) => f.code === 'DECLARATION_INCIDENTAL_OMITTED')?.source).toBe(
      '21 CFR 701.3(l)',
    );
  });
});

describe('EU, UK and Canada ingredient declarations (Regulation (EC) No 1223/2009, Art. 19(1)(g))', () => {
  const input = aFormula(
    [
      aLine(70, 'Butyrospermum Parkii Butter', { usName: 'Shea Butter' }),
      aColourLine(0.4, 'Iron Oxides', '77491'),
      aColourLine(0.3, 'Ultramarines', '77007'),
      aColourLine(0.5, 'Titanium Dioxide', '77891'),
      aFragranceLine(1, 'Meadow Accord', { '5A': 2 }, [
        { inci: 'Linalool', cas: '78-70-6', percent: 10 },
      ]),
    ],
    aBodyLotion(),
  );
  const result = evaluateFormula(input);

  it('uses INCI names, "Parfum" and CI numbers, with colourants last in CI number order', () => {
    // Art. 19(1)(g): "parfum"; colourants by CI number after the other ingredients
    expect(result.declarations.EU?.ingredients).toEqual([
      'Butyrospermum Parkii Butter',
      'Parfum',
      'Linalool',
      'CI 77007',
      'CI 77491',
      'CI 77891',
    ]);
    expect(result.declarations.UK?.ingredients).toEqual(result.declarations.EU?.ingredients);
  });

  it('names a labelled allergen above its threshold in addition to "Parfum"', () => {
    // Regulation (EC) No 1223/2009, Annex III entry 84: 1 % × 10 % = 0.1 % > 0.001 % leave-on
    expect(result.declarations.EU?.ingredients).toContain('Linalool');
    expect(result.declarations.US?.ingredients).not.toContain('Linalool');
  });

  it('in Canada uses INCI names under a bilingual heading and names allergens only from 12 April 2026', () => {
    expect(
      result.declarations.CA?.text.startsWith(
        'Ingredients/Ingrédients: Butyrospermum Parkii Butter, Parfum, Linalool',
      ),
    ).toBe(true); // common practice, no published source (heading)
    const before = evaluateFormula({ ...input, asOf: '2026-04-11' });
    // SOR/2024-63: allergen provisions in force 12 April 2026
    expect(before.declarations.CA?.ingredients).not.toContain('Linalool');
  });
});

describe('declaration properties', () => {
  const names = [
    'Aqua',
    'Glycerin',
    'Sodium Bicarbonate',
    'Citric Acid',
    'Kaolin',
    'Cetearyl Alcohol',
    'Magnesium Sulfate',
    'Polysorbate 80',
  ];
  const lineArb = fc.record({
    grams: fc.double({ min: 0.01, max: 500, noNaN: true }),
    parts: fc.uniqueArray(fc.constantFrom(...names), { minLength: 1, maxLength: 3 }),
    incidental: fc.boolean(),
  });

  it('a declaration is a permutation of the expanded, non-incidental ingredients (each named once)', () => {
    fc.assert(
      fc.property(
        fc.array(lineArb, { minLength: 1, maxLength: 12 }),
        fc.constantFrom('US', 'EU', 'UK', 'CA' as const),
        (lines, market) => {
          const drafts = lines.map((l, i) => {
            if (l.parts.length === 1)
              return aLine(l.grams, l.parts[0]!, { name: `Line ${i}`, incidental: l.incidental });
            const share = 100 / l.parts.length;
            return aLine(l.grams, 'Blend', {
              name: `Blend ${i}`,
              incidental: l.incidental,
              components: l.parts.map((inci) => ({ inci, percent: share })),
            });
          });
          const result = evaluateFormula(aFormula(drafts, aBathBomb(), { markets: [market] }));
          // 21 CFR 701.3: a US label prints the US name of an EU glossary name (Aqua as Water)
          const label = (name: string) =>
            normaliseName(market === 'US' ? usCommonName(name) : name);
          const expected = new Set(
            lines.filter((l) => !l.incidental).flatMap((l) => l.parts.map(label)),
          );
          const declared = result.declarations[market]!.ingredients.map(normaliseName);
          expect(new Set(declared).size).toBe(declared.length);
          expect([...declared].sort()).toEqual([...expected].sort());
        },
      ),
    );
  });

  it('the whole list, including the small-ingredient tail Batchproof keeps sorted, is in descending order of summed weight', () => {
    fc.assert(
      fc.property(fc.array(lineArb, { minLength: 1, maxLength: 12 }), (lines) => {
        const drafts = lines.map((l, i) => aLine(l.grams, l.parts[0]!, { name: `Line ${i}` }));
        const result = evaluateFormula(aFormula(drafts, aBathBomb(), { markets: ['EU'] }));
        const weight = new Map<string, number>();
        for (const l of lines) weight.set(l.parts[0]!, (weight.get(l.parts[0]!) ?? 0) + l.grams);
        const ordered = result.declarations.EU!.ingredients.map((n) => weight.get(n)!);
        // The tolerance only absorbs summation-order float noise (0.010000000000000012 vs ...14).
        for (let i = 1; i < ordered.length; i += 1)
          expect(ordered[i - 1]!).toBeGreaterThanOrEqual(ordered[i]! * (1 - 1e-12));
      }),
    );
  });
});
