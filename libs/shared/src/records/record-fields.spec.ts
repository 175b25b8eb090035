import { describe, expect, it } from 'vitest';
import {
  isoDate,
  optionalText,
  quantity,
  requiredText,
  textField,
  wholeNumber,
} from './record-fields';

const messages = (result: { error?: { issues: { message: string }[] } }) =>
  result.error?.issues.map((i) => i.message) ?? [];

describe('the text rule', () => {
  it('refuses NUL, which PostgreSQL text and jsonb cannot store', () => {
    expect(messages(requiredText('Name').safeParse('Sea\u0000Salt'))).toEqual([
      'Name contains a character that cannot be stored (a NUL or a broken Unicode character)',
    ]);
    expect(optionalText('Notes').safeParse('\u0000').success).toBe(false);
  });

  it('refuses half of a surrogate pair and keeps whole pairs', () => {
    expect(textField('Name').safeParse('Mica\ud800').success).toBe(false);
    expect(textField('Name').safeParse('\udc00Mica').success).toBe(false);
    expect(textField('Name').safeParse('Lavender 🌿').success).toBe(true);
  });
});

describe('the date rule', () => {
  it('takes years 1 to 9999 and refuses year 0, which PostgreSQL’s date refuses', () => {
    const date = isoDate('the day it was received');
    expect(date.safeParse('0001-01-01').success).toBe(true);
    expect(date.safeParse('9999-12-31').success).toBe(true);
    expect(messages(date.safeParse('0000-01-01'))).toEqual([
      'Enter the day it was received in year 1 or later',
    ]);
    expect(date.safeParse('10000-01-01').success).toBe(false);
    expect(date.safeParse('2025-02-30').success).toBe(false);
  });
});

describe('the quantity rule', () => {
  const lot = quantity('The quantity', { decimals: 4, max: 1e9, zero: 'refused' });
  const line = quantity('The weight', { decimals: 6, max: 1e9, zero: 'allowed' });

  it('refuses a positive amount that would round to 0 at the column’s decimals', () => {
    expect(messages(lot.safeParse(0.00001))).toEqual([
      'The quantity is too small to record (0.0001 at least)',
    ]);
    expect(lot.safeParse(0.0001).success).toBe(true);
    expect(line.safeParse(0.0000001).success).toBe(false);
    expect(line.safeParse(0.000001).success).toBe(true);
  });

  it('allows 0 only where the column allows it, and never a negative or an oversize amount', () => {
    expect(line.safeParse(0).success).toBe(true);
    expect(messages(lot.safeParse(0))).toEqual(['The quantity must be more than 0']);
    expect(lot.safeParse(-1).success).toBe(false);
    expect(lot.safeParse(1e9 + 1).success).toBe(false);
  });
});

describe('the whole-number rule', () => {
  it('stays inside PostgreSQL’s integer and reads query text only when asked', () => {
    expect(wholeNumber('The version').safeParse(2_147_483_647).success).toBe(true);
    expect(wholeNumber('The version').safeParse(99_999_999_999).success).toBe(false);
    expect(wholeNumber('The version').safeParse('3').success).toBe(false);
    expect(wholeNumber('The version', { fromText: true }).safeParse('3').data).toBe(3);
    expect(wholeNumber('The version', { max: 10 }).safeParse(11).success).toBe(false);
  });
});
