import { describe, expect, it } from 'vitest';
import {
  batchCodePatternSchema,
  batchCodeProblem,
  batchDurability,
  DEFAULT_BATCH_CODE_PATTERN,
  formatBatchCode,
  parseBatchCodePattern,
} from './batch-code';

const RFF = { day: '2026-12-02', productCode: 'RFF', sequence: 7 };

describe('formatBatchCode', () => {
  it('makes 261202-RFF-007 from the default pattern on 2026-12-02, code RFF, sequence 7', () => {
    expect(formatBatchCode(DEFAULT_BATCH_CODE_PATTERN, RFF)).toBe('261202-RFF-007');
  });

  it('fills every token', () => {
    // 2026-12-02 is day 336 of 2026 (334 days in January to November, not a leap year)
    expect(formatBatchCode('{YYYY}{MM}{DD}/{JJJ}_{CODE}{SEQ:2}', RFF)).toBe('20261202/336_RFF07');
    expect(formatBatchCode('{YY}.{CODE}.{SEQ:5}', RFF)).toBe('26.RFF.00007');
    expect(formatBatchCode('L{YYYYMMDD}{SEQ:1}', { ...RFF, sequence: 9 })).toBe('L202612029');
    // 2024 is a leap year: 31 December is day 366
    expect(formatBatchCode('{JJJ}{SEQ}', { ...RFF, day: '2024-12-31' })).toBe('366007');
  });

  it('refuses a sequence that does not fit its digits and a code over 20 characters', () => {
    expect(() => formatBatchCode(DEFAULT_BATCH_CODE_PATTERN, { ...RFF, sequence: 1000 })).toThrow(
      'Sequence 1000 does not fit 3 digits: widen the pattern',
    );
    // 6 + 1 + 11 + 1 + 3 = 22 characters
    expect(
      batchCodeProblem(DEFAULT_BATCH_CODE_PATTERN, { ...RFF, productCode: 'ROSE-FIZZ-1' }),
    ).toBe(
      'The batch code would have 22 characters; a GS1 lot code has at most 20: shorten the product code to 9 characters or change the pattern',
    );
    expect(formatBatchCode(DEFAULT_BATCH_CODE_PATTERN, { ...RFF, productCode: 'ROSE-FIZZ' })).toBe(
      '261202-ROSE-FIZZ-007',
    );
  });
});

describe('parseBatchCodePattern and batchCodePatternSchema', () => {
  it('refuses a space or # and names the character', () => {
    expect(parseBatchCodePattern('{YYMMDD} {SEQ}').problems).toEqual([
      'A batch code cannot contain a space: GS1 lot codes use letters, digits and ! " % & \' ( ) * + , - . / : ; < = > ? _',
    ]);
    const result = batchCodePatternSchema.safeParse('#{SEQ}');
    expect(result.success).toBe(false);
    expect(result.error!.issues[0]!.message).toMatch(/^A batch code cannot contain "#":/);
  });

  it('refuses unknown tokens, a pattern without a sequence and one that is always too long', () => {
    expect(parseBatchCodePattern('{YYMMDD}-{LOT}').problems).toEqual([
      '{LOT} is not a token: use {YYYYMMDD}, {YYMMDD}, {YYYY}, {YY}, {MM}, {DD}, {JJJ}, {CODE}, {SEQ} or {SEQ:n}',
      'Add {SEQ} to the pattern, so two batches made on the same day get different codes',
    ]);
    // 8 + 8 + 1 + 3 = 20 fixed characters and a product code of at least 1
    expect(parseBatchCodePattern('{YYYYMMDD}{YYYYMMDD}-{CODE}{SEQ}').problems).toEqual([
      'Codes from this pattern have at least 21 characters; a GS1 lot code has at most 20',
    ]);
    // A stray brace is a literal character outside the GS1 set
    expect(parseBatchCodePattern('{SEQ}{').problems[0]).toMatch(
      /^A batch code cannot contain "\{"/,
    );
  });

  it('accepts the default when the setting is left out', () => {
    expect(batchCodePatternSchema.parse(undefined)).toBe('{YYMMDD}-{CODE}-{SEQ}');
    expect(parseBatchCodePattern(DEFAULT_BATCH_CODE_PATTERN)).toMatchObject({
      fixedLength: 11,
      usesCode: true,
      usesSequence: true,
      problems: [],
    });
  });
});

describe('batchDurability', () => {
  it('gives the best-before month and its last day from the shelf life', () => {
    // Made 2026-12-02 + 18 months → June 2028, expired after 2028-06-30
    expect(
      batchDurability('2026-12-02', { shelfLifeMonths: 18, periodAfterOpeningMonths: 12 }),
    ).toEqual({
      bestBeforeMonth: '2028-06',
      expiresOn: '2028-06-30',
      periodAfterOpeningMonths: 12,
    });
    // Made 2027-01-15 + 13 months → February 2028, a leap year: 29 days
    expect(
      batchDurability('2027-01-15', { shelfLifeMonths: 13, periodAfterOpeningMonths: null })
        .expiresOn,
    ).toBe('2028-02-29');
    // 11 months from 2026-01-31 → December 2026
    expect(
      batchDurability('2026-01-31', { shelfLifeMonths: 11, periodAfterOpeningMonths: null })
        .expiresOn,
    ).toBe('2026-12-31');
  });

  it('has no date without a shelf life', () => {
    expect(
      batchDurability('2026-12-02', { shelfLifeMonths: null, periodAfterOpeningMonths: 6 }),
    ).toEqual({
      bestBeforeMonth: null,
      expiresOn: null,
      periodAfterOpeningMonths: 6,
    });
  });
});
