import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { ZodError } from 'zod';
import { gs1CheckDigit, gs1ElementString, type Gs1ElementInput } from './gs1-element-string';

function messagesFor(input: Gs1ElementInput): { path: string; message: string }[] {
  try {
    gs1ElementString(input);
    return [];
  } catch (error) {
    // ZodError expected from gs1ElementInputSchema.parse
    return (error as ZodError).issues.map((i) => ({ path: i.path.join('.'), message: i.message }));
  }
}

describe('gs1CheckDigit (GS1 General Specifications §7.9.1)', () => {
  it.each([
    ['0952123454321', 3], // [CALC] GS1 General Specifications, section 7.9 check digit calculation (mod 10, weights 3 and 1)
    ['400638133393', 1], // GS1 General Specifications §7.9.1, worked example 2
    ['629104150021', 3], // GS1 General Specifications §7.9.1, worked example 3
  ])('gives %s the check digit %d', (digits, expected) => {
    expect(gs1CheckDigit(digits)).toBe(expected);
  });

  it('makes the 3-1 weighted sum of the full number a multiple of 10', () => {
    // GS1 General Specifications §7.9.1
    fc.assert(
      fc.property(fc.stringMatching(/^\d{1,17}$/), (digits) => {
        const full = digits + String(gs1CheckDigit(digits));
        const sum = [...full]
          .reverse()
          .reduce((total, d, i) => total + Number(d) * (i === 0 ? 1 : i % 2 === 1 ? 3 : 1), 0);
        expect(sum % 10).toBe(0);
      }),
    );
  });

  it('refuses anything but 1 to 17 digits', () => {
    expect(() => gs1CheckDigit('12A4')).toThrow(RangeError);
  });
});

describe('gs1ElementString', () => {
  it('builds (01)(17)(10) with the lot last so no separator is needed', () => {
    // GS1 General Specifications (element strings, FNC1 and predefined lengths) and GS1 Barcode Syntax Dictionary [CALC]
    const result = gs1ElementString({
      gtin: '09521234543213',
      expiry: '2026-07-31',
      lot: 'LOT-42A',
    });
    expect(result.hri).toBe('(01)09521234543213(17)260731(10)LOT-42A');
    expect(result.data).toBe('01095212345432131726073110LOT-42A');
    expect(result.warnings).toEqual([]);
  });

  it('pads a GTIN-13 to 14 digits', () => {
    // GS1 Barcode Syntax Dictionary: AI (01) is N14
    expect(gs1ElementString({ gtin: '4006381333931', lot: 'A1' }).elements[0]?.value).toBe(
      '04006381333931',
    );
  });

  it('writes a month-only expiry with day 00', () => {
    // GS1 General Specifications: DD = 00 is read as the last day of the month
    const result = gs1ElementString({ gtin: '09521234543213', expiry: '2027-02', lot: 'B7' });
    expect(result.elements[1]?.value).toBe('270200');
    expect(result.warnings.join(' ')).toMatch(/last day of that month/);
  });

  it('warns that a lot without a GTIN is not a valid GS1 barcode', () => {
    // GS1 Barcode Syntax Dictionary: AI 10 req=01,02,8006,8026
    expect(gs1ElementString({ lot: 'B7' }).warnings[0]).toMatch(/together with a GTIN/);
  });

  it('names each character GS1 does not allow in a lot code', () => {
    // GS1 AI encodable character set 82 excludes space, # and non-ASCII
    expect(messagesFor({ lot: 'LOT 42#é' })).toEqual([
      { path: 'lot', message: expect.stringMatching(/cannot contain space, "#", "é"/) },
    ]);
  });

  it('rejects a lot code longer than 20 characters and an empty one', () => {
    // GS1 Barcode Syntax Dictionary: AI (10) X..20
    expect(messagesFor({ lot: 'A'.repeat(21) })[0]?.message).toMatch(
      /at most 20 characters; this one has 21/,
    );
    expect(gs1ElementString({ lot: 'A'.repeat(20) }).elements[0]?.value).toHaveLength(20);
    expect(messagesFor({ lot: '' })[0]?.message).toBe('Enter a lot code');
  });

  it('says which check digit a mistyped GTIN should have', () => {
    expect(messagesFor({ gtin: '09521234543214', lot: 'A1' })).toEqual([
      { path: 'gtin', message: "The GTIN's check digit should be 3, not 4: check the number" },
    ]);
  });

  it('rejects an impossible expiry date', () => {
    expect(messagesFor({ expiry: '2026-02-30', lot: 'A1' })[0]).toEqual({
      path: 'expiry',
      message: 'Expiry day must be 01 to 28 for that month',
    });
  });
});

describe('best before, AI (15)', () => {
  it('encodes a best-before date with AI (15), before the lot', () => {
    // GS1 General Specifications: AI (15) BEST BEFORE or BEST BY, N6 YYMMDD
    const result = gs1ElementString({
      gtin: '09521234543213',
      bestBefore: '2027-03-15',
      lot: 'C3',
    });
    expect(result.hri).toBe('(01)09521234543213(15)270315(10)C3');
    expect(result.elements.map((e) => e.ai)).toEqual(['01', '15', '10']);
  });

  it('can carry both (15) and (17), in ascending AI order', () => {
    // GS1 General Specifications: predefined-length AIs (15) and (17) need no separator
    const result = gs1ElementString({
      gtin: '09521234543213',
      bestBefore: '2027-01',
      expiry: '2027-06-30',
      lot: 'D4',
    });
    expect(result.hri).toBe('(01)09521234543213(15)270100(17)270630(10)D4');
  });

  it('refuses an impossible best-before date with a message naming it', () => {
    // GS1 General Specifications: YYMMDD with a valid month
    expect(() =>
      gs1ElementString({ gtin: '09521234543213', bestBefore: '2027-13-01', lot: 'E5' }),
    ).toThrow(/Best-before date month must be 01 to 12/);
  });
});
