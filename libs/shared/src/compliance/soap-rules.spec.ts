import { describe, expect, it } from 'vitest';
import { evaluateFormula } from './evaluate-formula';
import { aBodyLotion, aColourLine, aFormula, aLine } from './formula-builders';

const soap = (soldAsSoap: boolean) =>
  aBodyLotion({ name: 'Oat Bar', type: 'soap', use: 'rinse-off', soldAsSoap });
const lines = [aLine(99.5, 'Sodium Olivate'), aColourLine(0.5, 'D&C Black No. 2', '77266')];

describe('true soap (21 CFR 701.20)', () => {
  it('flags a soap sold as soap as outside the US cosmetic rules, keeping US blocks as checks', () => {
    // 21 CFR 701.20(a): "soap" = alkali salts of fatty acids, labeled, sold, and represented only as soap
    const result = evaluateFormula(aFormula(lines, soap(true), { markets: ['US', 'EU'] }));
    const note = result.findings.find((f) => f.code === 'SOAP_NOT_A_COSMETIC');
    expect(note?.severity).toBe('info');
    expect(note?.message).toMatch(/labeled, sold and represented only as soap/);
    const usBlack = result.findings.find(
      (f) => f.market === 'US' && f.code === 'COLOURANT_NOT_PERMITTED',
    );
    expect(usBlack?.severity).toBe('warn');
    expect(usBlack?.message).toMatch(/701\.20/);
    // the EU treats soap as a cosmetic: its findings are unchanged
    expect(result.findings.some((f) => f.market === 'EU' && f.code === 'SOAP_NOT_A_COSMETIC')).toBe(
      false,
    );
  });

  it('keeps the US block when the soap is sold as a cosmetic', () => {
    // 21 CFR 701.20(b) and 74.2052(c): a cleansing bar that is not "soap" is a cosmetic
    const result = evaluateFormula(aFormula(lines, soap(false), { markets: ['US'] }));
    expect(result.findings.find((f) => f.code === 'COLOURANT_NOT_PERMITTED')?.severity).toBe(
      'block',
    );
    expect(result.findings.some((f) => f.code === 'SOAP_NOT_A_COSMETIC')).toBe(false);
  });

  it('ignores "sold as soap" on a product that is not a soap', () => {
    // 21 CFR 701.20 concerns soap only
    const lotion = aBodyLotion({ soldAsSoap: true });
    const result = evaluateFormula(aFormula(lines, lotion, { markets: ['US'] }));
    expect(result.findings.some((f) => f.code === 'SOAP_NOT_A_COSMETIC')).toBe(false);
  });
});
