import fc from 'fast-check';
import { MF } from 'mf-parser';
import { describe, expect, it } from 'vitest';
import { caHotlistSubstances } from '../reference-data/ca-hotlist-substances';
import { euRestrictedSubstances } from '../reference-data/eu-restricted-substances';
import { evaluateFormula } from './evaluate-formula';
import { aBathBomb, aBodyLotion, aFormula, aFragranceLine, aLine } from './formula-builders';
import { molarMass } from './molar-mass';

type Draft = Parameters<typeof aFormula>;

function findingsFor(lines: Draft[0], product: Draft[1] = aBodyLotion(), extra: Draft[2] = {}) {
  return evaluateFormula(aFormula(lines, product, extra)).findings;
}
const codesIn = (findings: ReturnType<typeof findingsFor>, market: string) =>
  findings.filter((f) => f.market === market && /^(RESTRICTED|PROHIBITED)_/.test(f.code));

/** A lotion of 100 g with `grams` of one substance. */
function lotionWith(grams: number, inci: string, cas?: string) {
  return [aLine(100 - grams, 'Aqua'), aLine(grams, inci, cas ? { cas } : {})];
}

describe('Annex V preservatives: maxima in the finished product', () => {
  it('accepts phenoxyethanol at 1 % and blocks it at 1.01 % in the EU and UK', () => {
    // Regulation (EC) No 1223/2009, Annex V, entry 29: phenoxyethanol, 1,0 %
    expect(
      codesIn(findingsFor(lotionWith(1, 'Phenoxyethanol')), 'EU').map((f) => f.severity),
    ).not.toContain('block');
    const over = findingsFor(lotionWith(1.01, 'Phenoxyethanol'));
    for (const market of ['EU', 'UK']) {
      const finding = codesIn(over, market).find((f) => f.code === 'RESTRICTED_OVER_MAXIMUM');
      expect(finding?.severity, market).toBe('block');
      expect(finding?.message).toMatch(/above the 1 % maximum/);
    }
    // The US has no such list: nothing is said there
    expect(codesIn(over, 'US')).toEqual([]);
  });

  it('matches by CAS number when the INCI name is written differently', () => {
    // Annex V, entry 29: matched on CAS 122-99-6
    const findings = findingsFor(lotionWith(1.2, '2-Phenoxyethanol (supplier name)', '122-99-6'));
    expect(codesIn(findings, 'EU').map((f) => f.code)).toContain('RESTRICTED_OVER_MAXIMUM');
  });

  it('counts sodium benzoate as benzoic acid before applying the leave-on 0.5 % maximum', () => {
    // Regulation (EC) No 1223/2009, Annex V, entry 1: leave-on products 0,5 % (acid)
    // 0.58 % sodium benzoate × 122.12/144.10 = 0.492 % as acid: under the maximum, allowed
    expect(
      codesIn(findingsFor(lotionWith(0.58, 'Sodium Benzoate')), 'EU').some(
        (f) => f.severity === 'block',
      ),
    ).toBe(false);
    // 0.6 % sodium benzoate = 0.508 % as acid: over
    const over = codesIn(findingsFor(lotionWith(0.6, 'Sodium Benzoate')), 'EU');
    expect(over.find((f) => f.code === 'RESTRICTED_OVER_MAXIMUM')?.message).toMatch(
      /0\.508 % of the product \(as acid\)/,
    );
    // The same 0.6 % is within the rinse-off maximum of 2.5 %
    const rinseOff = codesIn(findingsFor(lotionWith(0.6, 'Sodium Benzoate'), aBathBomb()), 'EU');
    expect(rinseOff.some((f) => f.severity === 'block')).toBe(false);
  });

  it('sums benzoic acid and sodium benzoate as one entry', () => {
    // Annex V, entry 1: "Benzoic acid and its sodium salt" share one maximum
    const findings = findingsFor([
      aLine(99.3, 'Aqua'),
      aLine(0.3, 'Benzoic Acid'),
      aLine(0.4, 'Sodium Benzoate'),
    ]);
    // 0.3 + 0.4 × 0.8475 = 0.639 % as acid > 0.5 %
    expect(codesIn(findings, 'EU').map((f) => f.code)).toContain('RESTRICTED_OVER_MAXIMUM');
  });

  it('allows methylisothiazolinone only in rinse-off products, at most 0.0015 %', () => {
    // Regulation (EU) 2016/1198 (leave-on use removed) and (EU) 2017/1224 (0,0015 % rinse-off), Annex V entry 57
    const leaveOn = codesIn(findingsFor(lotionWith(0.001, 'Methylisothiazolinone')), 'EU');
    expect(leaveOn.find((f) => f.code === 'RESTRICTED_NOT_ALLOWED')?.severity).toBe('block');
    const atMax = codesIn(
      findingsFor(lotionWith(0.0015, 'Methylisothiazolinone'), aBathBomb()),
      'EU',
    );
    expect(atMax.some((f) => f.severity === 'block')).toBe(false);
    const over = codesIn(
      findingsFor(lotionWith(0.0016, 'Methylisothiazolinone'), aBathBomb()),
      'EU',
    );
    expect(over.find((f) => f.code === 'RESTRICTED_OVER_MAXIMUM')?.severity).toBe('block');
  });

  it('holds each paraben ester to 0.4 % and a mixture to 0.8 %, as acid', () => {
    // Regulation (EU) No 1004/2014, Annex V entry 12: 0,4 % (as acid) for single ester, 0,8 % for mixtures
    const both = findingsFor([
      aLine(99.4, 'Aqua'),
      aLine(0.3, 'Methylparaben'),
      aLine(0.3, 'Ethylparaben'),
    ]);
    expect(codesIn(both, 'EU').some((f) => f.severity === 'block')).toBe(false);
    const mixture = findingsFor([
      aLine(98.95, 'Aqua'),
      aLine(0.44, 'Methylparaben'), // 0.399 % as acid
      aLine(0.48, 'Ethylparaben'), // 0.399 % as acid
      aLine(0.13, 'Propylparaben'), // 0.0996 % as acid
    ]);
    const group = codesIn(mixture, 'EU').find((f) => f.subject.includes('+'));
    expect(group?.code).toBe('RESTRICTED_OVER_MAXIMUM');
    expect(group?.message).toMatch(/combined maximum of 0\.8 %/);
  });

  it('adds propyl- and butylparaben together against 0.14 % as acid', () => {
    // Annex V entry 12a: 0,14 % (as acid) for the sum of the individual concentrations
    const findings = findingsFor([
      aLine(99.8, 'Aqua'),
      aLine(0.1, 'Propylparaben'), // 0.0767 % as acid
      aLine(0.1, 'Butylparaben'), // 0.0711 % as acid
    ]);
    expect(
      codesIn(findings, 'EU').find((f) => f.code === 'RESTRICTED_OVER_MAXIMUM')?.subject,
    ).toMatch(/Propylparaben/);
  });

  it('asks about a label warning that applies only to some products, without printing it', () => {
    // Annex V entry 3 (salicylic acid): "Not to be used for children under 3 years of age", for products
    // which might be used for children under three
    const result = evaluateFormula(aFormula(lotionWith(0.3, 'Salicylic Acid'), aBodyLotion()));
    const finding = result.findings.find(
      (f) => f.market === 'EU' && f.code === 'RESTRICTED_CONDITION',
    );
    expect(finding?.severity).toBe('warn');
    expect(finding?.message).toMatch(/children under three/);
    expect(result.warnings.EU).toEqual([]);
  });
});

describe('Annex II prohibitions', () => {
  it('blocks butylphenyl methylpropional on its own line, in a blend or inside a fragrance', () => {
    // Regulation (EU) 2021/1902: butylphenyl methylpropional prohibited from 1 March 2022
    const own = findingsFor(lotionWith(0.01, 'Butylphenyl Methylpropional'));
    const inBlend = findingsFor([
      aLine(99, 'Aqua'),
      aLine(1, 'Blend', {
        name: 'Scent base',
        components: [
          { inci: 'Caprylic/Capric Triglyceride', percent: 99 },
          { inci: 'Butylphenyl Methylpropional', cas: '80-54-6', percent: 1 },
        ],
      }),
    ]);
    const inFragrance = findingsFor([
      aLine(98, 'Aqua'),
      aFragranceLine(2, 'Lily Accord', { '5A': 3 }, [
        { inci: 'Butylphenyl Methylpropional', cas: '80-54-6', percent: 0.5 },
      ]),
    ]);
    for (const findings of [own, inBlend, inFragrance]) {
      for (const market of ['EU', 'UK']) {
        expect(
          codesIn(findings, market).find((f) => f.code === 'PROHIBITED_SUBSTANCE')?.severity,
          market,
        ).toBe('block');
      }
    }
  });

  it('says a prohibition is coming, without blocking, before the day it applies', () => {
    // Regulation (EU) 2021/1902 applies from 1 March 2022
    const before = findingsFor(lotionWith(0.01, 'Butylphenyl Methylpropional'), aBodyLotion(), {
      asOf: '2022-02-28',
    });
    const finding = codesIn(before, 'EU')[0];
    expect(finding?.code).toBe('PROHIBITED_UPCOMING');
    expect(finding?.severity).toBe('warn');
    expect(finding?.message).toMatch(/2022-03-01/);
  });

  it('blocks hydroxyisohexyl 3-cyclohexene carboxaldehyde, atranol and chloroatranol by CAS', () => {
    // Regulation (EU) 2017/1410: HICC, atranol and chloroatranol moved to Annex II (entries 1380 to 1382)
    for (const cas of ['31906-04-4', '526-37-4', '57074-21-2']) {
      const findings = findingsFor([
        aLine(98, 'Aqua'),
        aFragranceLine(2, 'Moss Accord', { '5A': 3 }, [
          { inci: `Substance ${cas}`, cas, percent: 0.1 },
        ]),
      ]);
      expect(
        codesIn(findings, 'EU').map((f) => f.code),
        cas,
      ).toContain('PROHIBITED_SUBSTANCE');
    }
  });
});

describe('Canada', () => {
  it('allows the methylchloroisothiazolinone mixture only in rinse-off products', () => {
    // Health Canada, Cosmetic Ingredient Hotlist: MCI/MI permitted in rinse-off products only, ≤ 0.0015 %
    const mix = 'Methylchloroisothiazolinone (and) Methylisothiazolinone';
    const leaveOn = codesIn(findingsFor(lotionWith(0.001, mix)), 'CA');
    expect(leaveOn.map((f) => f.code)).toContain('RESTRICTED_NOT_ALLOWED');
    expect(
      codesIn(findingsFor(lotionWith(0.001, mix), aBathBomb()), 'CA').some(
        (f) => f.severity === 'block',
      ),
    ).toBe(false);
  });
});

describe('the restricted-substance reference rows', () => {
  const rows = [...euRestrictedSubstances, ...caHotlistSubstances];

  it('have unique ids, a source and a status', () => {
    expect(new Set(rows.map((r) => r.id)).size).toBe(rows.length);
    for (const row of rows) {
      expect(row.source, row.id).toMatch(/Regulation|Hotlist/);
      expect(row.forms.length, row.id).toBeGreaterThan(0);
    }
  });

  it.each(
    rows.flatMap((row) =>
      row.forms
        .filter((f) => f.formula && f.asFormula)
        .map((f) => [`${row.id}: ${f.inci}`, f.formula!, f.asFormula!, f.asFactor!] as const),
    ),
  )(
    '%s: the as-acid factor is the ratio of molar masses, checked with mf-parser',
    (_, formula, asFormula, factor) => {
      // CIAAW standard atomic weights via mf-parser (an independent molar-mass library)
      const ratio = new MF(asFormula).getInfo().mass / new MF(formula).getInfo().mass;
      expect(factor).toBeCloseTo(ratio, 3);
      // and our own molar-mass helper agrees where it knows every element
      if (/^[A-Z][A-Za-z0-9]*$/.test(asFormula)) {
        try {
          expect(molarMass(asFormula) / molarMass(formula)).toBeCloseTo(ratio, 3);
        } catch {
          // an element our helper does not carry (K, Ca): mf-parser alone decides
        }
      }
    },
  );

  it('never lets a mixture of forms of one entry fall under the entry by summing (property)', () => {
    const benzoate = euRestrictedSubstances.find((r) => r.id === 'eu-annex-v-1-benzoic-acid')!;
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 0.5, noNaN: true }),
        fc.double({ min: 0, max: 0.5, noNaN: true }),
        (acid, salt) => {
          const lines = [
            aLine(99, 'Aqua'),
            aLine(acid + 0.0001, 'Benzoic Acid'),
            aLine(salt + 0.0001, 'Sodium Benzoate'),
          ];
          const total =
            ((acid +
              0.0001 +
              (salt + 0.0001) *
                benzoate.forms.find((f) => f.inci === 'Sodium Benzoate')!.asFactor!) /
              (99 + acid + salt + 0.0002)) *
            100;
          const blocked = codesIn(findingsFor(lines), 'EU').some(
            (f) => f.code === 'RESTRICTED_OVER_MAXIMUM',
          );
          // Annex V entry 1, leave-on 0,5 % (acid): blocked exactly when the as-acid total exceeds it
          if (Math.abs(total - 0.5) > 1e-6) expect(blocked).toBe(total > 0.5);
        },
      ),
    );
  });
});
