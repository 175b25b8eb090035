import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { collectColourants, groupByColour } from './colourant-verdicts';
import { evaluateFormula } from './evaluate-formula';
import type { EvaluationInputDraft } from './evaluation-input-schema';
import { aBathBomb, aBodyLotion, aColourLine, aFormula, aLine, aLipBalm } from './formula-builders';
import { expandFormula } from './formula-expansion';

type Product = EvaluationInputDraft['product'];
type LineDraft = EvaluationInputDraft['lines'][number];

function check(market: 'US' | 'EU' | 'UK', product: Product, ...colours: LineDraft[]) {
  const colourGrams = colours.reduce((sum, l) => sum + l.grams, 0);
  const result = evaluateFormula(
    aFormula([aLine(100 - colourGrams, 'Ricinus Communis Seed Oil'), ...colours], product, {
      markets: [market],
    }),
  );
  return {
    result,
    verdicts: result.colourants[market]!,
    findings: result.findings.filter((f) => f.market === market),
  };
}

describe('one colour, many forms: limits apply to the total', () => {
  it('sums D&C Red No. 33 and its lake against the 3 % lip-product maximum', () => {
    // 21 CFR 74.2333(c): lip products "not to exceed 3 percent total color by weight"
    const alone = check('US', aLipBalm(), aColourLine(2, 'D&C Red No. 33', '17200'));
    expect(alone.findings.some((f) => f.severity === 'block')).toBe(false);
    const both = check(
      'US',
      aLipBalm(),
      aColourLine(2, 'D&C Red No. 33', '17200'),
      aColourLine(1.5, 'D&C Red No. 33 Aluminum Lake', '17200'),
    );
    const blocks = both.findings.filter((f) => f.code === 'COLOURANT_NOT_PERMITTED');
    expect(blocks.length).toBeGreaterThan(0);
    expect(blocks[0]!.message).toMatch(/3\.5 % of the product counting the same colour on line/);
    expect(both.verdicts.every((v) => v.totalPercent !== undefined && v.totalPercent > 3.49)).toBe(
      true,
    );
    // At exactly 3 % in total it is allowed
    const atMax = check(
      'US',
      aLipBalm(),
      aColourLine(1.5, 'D&C Red No. 33', '17200'),
      aColourLine(1.5, 'D&C Red No. 33 Aluminum Lake', '17200'),
    );
    expect(atMax.findings.some((f) => f.severity === 'block')).toBe(false);
  });

  it('sums the same colour arriving in two blends against an Annex IV maximum', () => {
    // Regulation (EC) No 1223/2009, Annex IV: CI 12085, maximum 3 % (a colorant includes its salts and lakes)
    const blend = (name: string) =>
      aLine(2, 'Blend', {
        name,
        components: [
          { inci: 'Mica', percent: 20 },
          { inci: 'CI 12085', colourIndex: '12085', functions: ['colourant'], percent: 80 },
        ],
      });
    const { findings } = check('EU', aBodyLotion(), blend('Red shimmer A'), blend('Red shimmer B'));
    // 2 × 2 g × 80 % = 3.2 % of the product in total
    expect(findings.find((f) => f.code === 'COLOURANT_NOT_PERMITTED')?.message).toMatch(
      /3\.2 % of the product, above the 3 % maximum/,
    );
  });

  it('summing a colour over its forms never lowers the total (property)', () => {
    const form = fc.record({
      grams: fc.double({ min: 0.001, max: 5, noNaN: true }),
      name: fc.constantFrom(
        'D&C Red No. 33',
        'D&C Red No. 33 Aluminum Lake',
        'Red 7 Calcium Lake',
        'D&C Red No. 7',
      ),
      ci: fc.constantFrom('17200', '15850', '15850:1'),
    });
    fc.assert(
      fc.property(
        fc.array(form, { minLength: 1, maxLength: 6 }),
        fc.constantFrom('US', 'EU' as const),
        (forms, market) => {
          const input = aFormula(
            [
              aLine(80, 'Ricinus Communis Seed Oil'),
              ...forms.map((f) => aColourLine(f.grams, f.name, f.ci)),
            ],
            aLipBalm(),
            { markets: [market] },
          );
          const occurrences = collectColourants(expandFormula(input).ingredients);
          const groups = groupByColour(market, occurrences, input.asOf);
          for (const occurrence of occurrences) {
            const group = groups.get(occurrence)!;
            expect(group.totalPercent).toBeGreaterThanOrEqual(occurrence.percent * (1 - 1e-12));
          }
          // every occurrence is counted once: the distinct group totals add up to the colour percent
          const distinct = new Map(
            [...groups.values()].map((g) => [g.lines.join(','), g.totalPercent]),
          );
          const sum = [...distinct.values()].reduce((s, t) => s + t, 0);
          const all = occurrences.reduce((s, o) => s + o.percent, 0);
          expect(sum).toBeCloseTo(all, 9);
        },
      ),
    );
  });
});

describe('product types reach the engine', () => {
  const black = aColourLine(0.5, 'D&C Black No. 2', '77266');

  it('blocks D&C Black No. 2 in soap, where its listing does not allow it', () => {
    // 21 CFR 74.2052(c): eyeliner, brush-on-brow, eye shadow, mascara, lipstick, blushers and rouge,
    // makeup and foundation, nail enamel only
    const { findings } = check('US', aBodyLotion({ type: 'soap', use: 'rinse-off' }), black);
    const block = findings.find((f) => f.code === 'COLOURANT_NOT_PERMITTED');
    expect(block?.severity).toBe('block');
    expect(block?.message).toMatch(/in a soap — 21 CFR 74\.2052 allows it only in eyeliner/);
  });

  it('permits it in a lipstick, one of the products its listing names', () => {
    // 21 CFR 74.2052(c): lipstick is listed
    const { verdicts, findings } = check('US', aLipBalm({ type: 'lipstick' }), black);
    expect(findings.some((f) => f.severity === 'block')).toBe(false);
    expect(verdicts[0]?.verdict).toBe('permitted-with-conditions');
  });

  it('asks when the type may or may not be one of the listed products', () => {
    // 21 CFR 74.2052(c): an "eye-area product" may be a mascara (listed) or an eye cream (not)
    const { findings } = check('US', aBodyLotion({ type: 'eye-area-product' }), black);
    expect(findings.find((f) => f.code === 'COLOURANT_CONDITION')?.severity).toBe('warn');
    expect(findings.some((f) => f.severity === 'block')).toBe(false);
  });

  it('treats a lip balm as touching the lips even if the profile forgot to say so', () => {
    // 21 CFR 82.3(n): externally applied excludes the lips; Ext. D&C Violet No. 2 is externally applied only (74.2602a)
    const product = aBodyLotion({
      type: 'lip-balm',
      contact: { mucousMembranes: false, eyeArea: false, lips: false },
    });
    const { findings } = check('US', product, aColourLine(0.1, 'Ext. D&C Violet No. 2', '60730'));
    expect(findings.find((f) => f.code === 'COLOURANT_NOT_PERMITTED')?.message).toMatch(
      /lip products/,
    );
  });
});

describe('interpretations are labelled as such', () => {
  const violet = aColourLine(0.2, 'Ext. D&C Violet No. 2', '60730');

  it('keeps the block on an externally-applied colour in a bath product, marked as an interpretation', () => {
    // 21 CFR 82.3(n) names lips and mucous membranes, not bath products: "in the bath = mucous
    // membranes" is Batchproof's reading
    const { findings, verdicts } = check('US', aBathBomb(), violet);
    const block = findings.find((f) => f.code === 'COLOURANT_NOT_PERMITTED');
    expect(block?.severity).toBe('block');
    expect(block?.status).toBe('interpretation');
    expect(block?.message).toMatch(/Batchproof's reading/);
    expect(block?.message).toMatch(/override at release/);
    expect(verdicts[0]?.status).toBe('interpretation');
  });

  it('uses the rule’s own status when the maker says the product touches mucous membranes', () => {
    // 21 CFR 74.2602a: externally applied cosmetics only; 82.3(n)
    const product = aBathBomb({ contact: { mucousMembranes: true, eyeArea: false, lips: false } });
    const block = check('US', product, violet).findings.find(
      (f) => f.code === 'COLOURANT_NOT_PERMITTED',
    );
    expect(block?.status).toBe('C');
  });

  it('marks the EU bath-product block on a not-mucous-membranes colourant as an interpretation', () => {
    // Regulation (EC) No 1223/2009, Annex IV, CI 60730: "Not to be used in products applied on mucous membranes"
    const block = check('EU', aBathBomb(), violet).findings.find(
      (f) => f.code === 'COLOURANT_NOT_PERMITTED',
    );
    expect(block?.severity).toBe('block');
    expect(block?.status).toBe('interpretation');
  });

  it('never calls an interpretation confirmed, and never blocks on one that rests on a value from memory', () => {
    // from memory: D&C Orange No. 10 (74.2260) uses not yet confirmed, so the bath-product reading only warns
    const { findings } = check('US', aBathBomb(), aColourLine(0.1, 'D&C Orange No. 10', '45425:1'));
    const finding = findings.find((f) => f.code === 'COLOURANT_NOT_PERMITTED');
    expect(finding?.severity).toBe('warn');
    expect(finding?.status).toBe('M');
  });
});

describe('nano', () => {
  it('prints "(nano)" after a nanomaterial in EU and UK lists only', () => {
    // Regulation (EC) No 1223/2009, Art. 19(1)(g): "the name of the substance followed by the word 'nano' in brackets"
    const result = evaluateFormula(
      aFormula(
        [aLine(95, 'Butyrospermum Parkii Butter'), aLine(5, 'Zinc Oxide', { nano: true })],
        aBodyLotion(),
        { markets: ['US', 'EU', 'UK'] },
      ),
    );
    expect(result.declarations.EU!.ingredients).toContain('Zinc Oxide (nano)');
    expect(result.declarations.UK!.ingredients).toContain('Zinc Oxide (nano)');
    expect(result.declarations.US!.ingredients).toContain('Zinc Oxide');
  });

  it('applies carbon black’s nano conditions to the nano form only', () => {
    // Regulation (EC) No 1223/2009, Annex IV, entry 126a (nano, max 10 %) and entry 126 (ordinary carbon black)
    const ordinary = check('EU', aBodyLotion(), aColourLine(12, 'Carbon Black', '77266'));
    expect(ordinary.verdicts[0]?.listing).toBe('Carbon black');
    expect(ordinary.findings.some((f) => f.severity === 'block')).toBe(false);
    const nano = check(
      'EU',
      aBodyLotion(),
      aColourLine(12, 'Carbon Black', '77266', { nano: true }),
    );
    expect(nano.verdicts[0]?.listing).toBe('Carbon black (nano)');
    expect(nano.findings.find((f) => f.code === 'COLOURANT_NOT_PERMITTED')?.message).toMatch(
      /above the 10 % maximum/,
    );
    expect(nano.result.declarations.EU!.groups.colourants).toContain('CI 77266 (nano)');
  });
});

describe('names that change meaning', () => {
  it('keeps the lake designation when the US name comes from the matched listing', () => {
    // from memory: 21 CFR 82.51 and 82.1051 name a lake by its straight colour and the salt
    const { result } = check(
      'US',
      aBodyLotion(),
      aColourLine(0.2, 'Red 7 Calcium Lake', '15850:1'),
    );
    expect(result.declarations.US!.ingredients).toContain('D&C Red No. 7 Calcium Lake');
  });

  it('prints an EU glossary name by its US name on the US label', () => {
    // 21 CFR 701.3(a) with Parfum/Fragrance as the regulation's own pair; Aqua → Water from the glossary
    const result = evaluateFormula(
      aFormula([aLine(80, 'Aqua'), aLine(20, 'Cera Alba')], aBodyLotion(), {
        markets: ['US', 'EU'],
      }),
    );
    expect(result.declarations.US!.ingredients).toEqual(['Water', 'Beeswax']);
    expect(result.declarations.EU!.ingredients).toEqual(['Aqua', 'Cera Alba']);
  });

  it('holds CI 45396 to Annex IV’s 1 % in lip products', () => {
    // Regulation (EC) No 1223/2009, Annex IV entry 77: "1 %, when used in lip products"; "Only in free acid form"
    const under = check('EU', aLipBalm(), aColourLine(0.9, 'CI 45396', '45396'));
    expect(under.findings.some((f) => f.severity === 'block')).toBe(false);
    expect(under.verdicts[0]?.conditions.join(' ')).toMatch(/free acid/);
    const over = check('EU', aLipBalm(), aColourLine(1.1, 'CI 45396', '45396'));
    expect(over.findings.find((f) => f.code === 'COLOURANT_NOT_PERMITTED')?.severity).toBe('block');
  });
});
