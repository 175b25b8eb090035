import { describe, expect, it } from 'vitest';
import { evaluateFormula } from './evaluate-formula';
import type { EvaluationInputDraft } from './evaluation-input-schema';
import { aBathBomb, aBodyLotion, aColourLine, aFormula, aLine, aLipBalm } from './formula-builders';

type Product = EvaluationInputDraft['product'];
type LineDraft = EvaluationInputDraft['lines'][number];

/** Evaluates 100 g made of sodium bicarbonate plus the colour lines, in one market. */
function verdicts(market: 'US' | 'EU' | 'UK' | 'CA', product: Product, ...colours: LineDraft[]) {
  const colourGrams = colours.reduce((sum, l) => sum + l.grams, 0);
  const result = evaluateFormula(
    aFormula([aLine(100 - colourGrams, 'Sodium Bicarbonate'), ...colours], product, {
      markets: [market],
    }),
  );
  return {
    verdicts: result.colourants[market]!,
    findings: result.findings.filter((f) => f.market === market),
  };
}

describe('US colour additives against the product exposure', () => {
  it('blocks ultramarines in a bath bomb: listed for externally applied cosmetics only', () => {
    const {
      verdicts: [v],
      findings,
    } = verdicts('US', aBathBomb(), aColourLine(0.5, 'Ultramarines', '77007'));
    // 21 CFR 73.2725 (externally applied, incl. eye area); 21 CFR 82.3(n) (externally applied excludes mucous membranes)
    expect(v?.verdict).toBe('not-permitted');
    const block = findings.find((f) => f.code === 'COLOURANT_NOT_PERMITTED');
    expect(block?.severity).toBe('block');
    expect(block?.message).toMatch(
      /not permitted in the US for products used in the bath — 21 CFR 73\.2725/,
    );
    expect(block?.message).toMatch(/safety assessor/);
  });

  it('permits ultramarines in a body lotion (external skin only)', () => {
    // 21 CFR 73.2725
    expect(
      verdicts('US', aBodyLotion(), aColourLine(0.5, 'Ultramarines', '77007')).verdicts[0]?.verdict,
    ).toBe('permitted');
  });

  it('blocks ultramarines in a lip product', () => {
    // 21 CFR 73.2725 with 82.3(n): externally applied excludes the lips
    expect(
      verdicts('US', aLipBalm(), aColourLine(0.5, 'Ultramarines', '77007')).verdicts[0]?.verdict,
    ).toBe('not-permitted');
  });

  it('finds an external-only colour inside a mica blend', () => {
    const blend = aLine(1, 'Lagoon Blue Mica', {
      functions: ['colourant'],
      components: [
        { inci: 'Mica', colourIndex: 'CI 77019', percent: 80 },
        { inci: 'CI 77510', usName: 'Ferric Ferrocyanide', colourIndex: 'CI 77510', percent: 20 },
      ],
    });
    const { verdicts: list } = verdicts('US', aBathBomb(), blend);
    // 21 CFR 73.2496 (mica, generally); 21 CFR 73.2299 (ferric ferrocyanide, externally applied)
    expect(list.map((v) => [v.listing, v.verdict])).toEqual([
      ['Mica', 'permitted'],
      ['Ferric Ferrocyanide', 'not-permitted'],
    ]);
  });

  it('blocks D&C Black No. 2 in a bath bomb: restricted to eight product types', () => {
    // 21 CFR 74.2052(c)
    expect(
      verdicts(
        'US',
        aBathBomb(),
        aColourLine(0.2, 'Carbon Black', '77266', { usName: 'D&C Black No. 2' }),
      ).verdicts[0]?.verdict,
    ).toBe('not-permitted');
  });

  it('blocks FD&C Red No. 3 and FD&C Blue No. 2 in any cosmetic', () => {
    // FDA/ICMAD regulatory information sheet: no cosmetic listing (74.303, 74.1303; 74.102, 74.1102)
    for (const [name, ci] of [
      ['FD&C Red No. 3', '45430'],
      ['FD&C Blue No. 2', '73015'],
    ] as const) {
      const {
        verdicts: [v],
        findings,
      } = verdicts('US', aBodyLotion(), aColourLine(0.1, name, ci));
      expect(v?.verdict).toBe('not-permitted');
      expect(findings.some((f) => f.severity === 'block')).toBe(true);
    }
  });

  it('allows D&C Red No. 33 in a lip balm up to 3 % and blocks it above', () => {
    // 21 CFR 74.2333: lip products not to exceed 3 percent total color by weight
    const within = verdicts(
      'US',
      aLipBalm(),
      aColourLine(3, 'D&C Red No. 33', '17200', { usName: 'D&C Red No. 33' }),
    ).verdicts[0];
    expect(within?.verdict).toBe('permitted-with-conditions');
    expect(within?.conditions).toContain('Lip products: at most 3 % of the finished product');
    const over = verdicts(
      'US',
      aLipBalm(),
      aColourLine(3.5, 'D&C Red No. 33', '17200', { usName: 'D&C Red No. 33' }),
    );
    expect(over.verdicts[0]?.verdict).toBe('not-permitted');
  });

  it('allows D&C Orange No. 5 in a lip product at 5.0 % and blocks 5.1 %', () => {
    // 21 CFR 74.2255: lipsticks and lip cosmetics not exceeding 5.0 percent by weight
    expect(
      verdicts('US', aLipBalm(), aColourLine(5, 'D&C Orange No. 5', '45370:1')).verdicts[0]
        ?.verdict,
    ).toBe('permitted-with-conditions');
    expect(
      verdicts('US', aLipBalm(), aColourLine(5.1, 'D&C Orange No. 5', '45370:1')).verdicts[0]
        ?.verdict,
    ).toBe('not-permitted');
  });

  it('asks for a certified batch for a Part 74 colour', () => {
    const {
      verdicts: [v],
      findings,
    } = verdicts('US', aBathBomb(), aColourLine(0.05, 'FD&C Yellow No. 5', '19140'));
    // 21 CFR 74.2705 and Part 80: all batches certified
    expect(v?.verdict).toBe('permitted-with-conditions');
    expect(findings.find((f) => f.code === 'COLOURANT_CERTIFIED_BATCH')?.severity).toBe('warn');
  });

  it('allows FD&C Yellow No. 5 Aluminum Lake near the eyes but not FD&C Yellow No. 6', () => {
    const eye = aBodyLotion({ contact: { mucousMembranes: false, eyeArea: true, lips: false } });
    // FDA Regulatory Status of Color Additives (FDCYellow5): "Eye area use (includes Al lake)"
    expect(
      verdicts('US', eye, aColourLine(0.1, 'FD&C Yellow No. 5 Aluminum Lake', '19140')).verdicts[0]
        ?.verdict,
    ).toBe('permitted-with-conditions');
    // 21 CFR 70.5(a): no eye-area use unless the listing provides for it; 74.2706 does not
    expect(
      verdicts('US', eye, aColourLine(0.1, 'FD&C Yellow No. 6', '15985')).verdicts[0]?.verdict,
    ).toBe('not-permitted');
  });

  it('warns instead of blocking when the listing rests on a value from memory', () => {
    // from memory: D&C Orange No. 10 (74.2260) uses not yet confirmed
    const { findings } = verdicts(
      'US',
      aBathBomb(),
      aColourLine(0.1, 'D&C Orange No. 10', '45425:1'),
    );
    const finding = findings.find((f) => f.code === 'COLOURANT_NOT_PERMITTED');
    expect(finding?.severity).toBe('warn');
    expect(finding?.status).toBe('M');
    expect(finding?.message).toMatch(/from memory/);
  });

  it('needs the US name when a CI number belongs to listings with different uses', () => {
    // FDA/ICMAD information sheet: CI 42090 is FD&C Blue No. 1 and D&C Blue No. 4
    const bare = verdicts('US', aBathBomb(), aColourLine(0.05, 'CI 42090', '42090'));
    expect(bare.findings.find((f) => f.code === 'COLOURANT_AMBIGUOUS')?.severity).toBe('warn');
    const named = verdicts(
      'US',
      aBathBomb(),
      aColourLine(0.05, 'CI 42090', '42090', { usName: 'FD&C Blue No. 1' }),
    );
    expect(named.verdicts[0]?.listing).toBe('FD&C Blue No. 1');
  });

  it('warns about a colour that is on no list Batchproof holds', () => {
    const {
      verdicts: [v],
      findings,
    } = verdicts('US', aBathBomb(), aColourLine(0.1, 'Sparkle Pink', '12345'));
    expect(v?.verdict).toBe('not-listed');
    expect(findings[0]?.code).toBe('COLOURANT_NOT_LISTED');
  });
});

describe('EU and UK Annex IV colourants', () => {
  it('permits ultramarines in an EU bath bomb: no field-of-use restriction', () => {
    // Regulation (EC) No 1223/2009, Annex IV (CI 77007, no field restriction; C2)
    expect(
      verdicts('EU', aBathBomb(), aColourLine(0.5, 'CI 77007', '77007')).verdicts[0]?.verdict,
    ).toBe('permitted');
  });

  it('blocks CI 60730 in a bath product and in the UK too, but permits it in a body lotion', () => {
    // Regulation (EC) No 1223/2009, Annex IV entry 90: "Not to be used in products applied on mucous membranes"
    expect(
      verdicts('EU', aBathBomb(), aColourLine(0.1, 'CI 60730', '60730')).verdicts[0]?.verdict,
    ).toBe('not-permitted');
    const uk = verdicts('UK', aBathBomb(), aColourLine(0.1, 'CI 60730', '60730'));
    expect(uk.verdicts[0]?.verdict).toBe('not-permitted');
    expect(uk.findings[0]?.source).toMatch(/^UK Cosmetics Regulation/);
    expect(
      verdicts('EU', aBodyLotion(), aColourLine(0.1, 'CI 60730', '60730')).verdicts[0]?.verdict,
    ).toBe('permitted-with-conditions');
  });

  it('blocks a rinse-off-only colourant in a leave-on product', () => {
    // Regulation (EC) No 1223/2009, Annex IV entry 71 (CI 45100): rinse-off products
    expect(
      verdicts('EU', aBodyLotion(), aColourLine(0.1, 'CI 45100', '45100')).verdicts[0]?.verdict,
    ).toBe('not-permitted');
    expect(
      verdicts('EU', aBathBomb(), aColourLine(0.1, 'CI 45100', '45100')).verdicts[0]?.verdict,
    ).toBe('permitted-with-conditions');
  });

  it('matches a salt or lake to its parent entry', () => {
    // Annex IV preamble: a colorant includes its salts and lakes (CI 15850:1 under CI 15850)
    expect(
      verdicts('EU', aBathBomb(), aColourLine(0.1, 'CI 15850', '15850:1')).verdicts[0]?.listing,
    ).toMatch(/Lithol Rubine/);
  });

  it('blocks CI 12085 above its 3 % maximum', () => {
    // Directive 76/768/EEC Annex IV: 3 % max in the finished product (C2)
    expect(
      verdicts('EU', aLipBalm(), aColourLine(3.2, 'CI 12085', '12085')).verdicts[0]?.verdict,
    ).toBe('not-permitted');
    expect(
      verdicts('EU', aLipBalm(), aColourLine(2.9, 'CI 12085', '12085')).verdicts[0]?.verdict,
    ).toBe('permitted-with-conditions');
  });
});

describe('Canada colourants', () => {
  it('marks colourants as not checked and says where to look', () => {
    const {
      verdicts: [v],
      findings,
    } = verdicts('CA', aBathBomb(), aColourLine(0.1, 'CI 77891', '77891'));
    expect(v?.verdict).toBe('not-checked');
    expect(findings[0]?.message).toMatch(/Hotlist/);
  });
});
