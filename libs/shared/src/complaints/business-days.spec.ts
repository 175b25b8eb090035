import { describe, expect, it } from 'vitest';
import { addUsBusinessDays, usBusinessDaysBetween } from './business-days';

describe('addUsBusinessDays', () => {
  it('counts the day of receipt as day 0', () => {
    expect(addUsBusinessDays('2026-11-20', 0)).toBe('2026-11-20');
    expect(addUsBusinessDays('2026-11-20', 1)).toBe('2026-11-23'); // Friday → Monday
  });

  it('skips Thanksgiving 2026: 15 business days from Friday 20 November is Monday 14 December', () => {
    // Hand-worked: Mon 23 (1), Tue 24 (2), Wed 25 (3), Thu 26 Thanksgiving skipped, Fri 27 (4),
    // Mon 30 (5), Tue 1 Dec (6), Wed 2 (7), Thu 3 (8), Fri 4 (9), Mon 7 (10), Tue 8 (11),
    // Wed 9 (12), Thu 10 (13), Fri 11 (14), Mon 14 (15). Without the holiday it would be Fri 11.
    expect(addUsBusinessDays('2026-11-20', 15)).toBe('2026-12-14');
  });

  it('starts a weekend receipt on the next business day', () => {
    // Received Saturday 21 November: day 1 is Monday 23rd, as for Friday 20th.
    expect(addUsBusinessDays('2026-11-21', 15)).toBe('2026-12-14');
  });

  it('skips both Fridays closed at the 2027 year end', () => {
    // Christmas 2027 (Saturday) is kept Fri 24 Dec; New Year's Day 2028 (Saturday) Fri 31 Dec.
    // Hand-worked from Fri 17 Dec 2027: Mon 20 (1), Tue 21 (2), Wed 22 (3), Thu 23 (4),
    // Fri 24 skipped, Mon 27 (5), Tue 28 (6), Wed 29 (7), Thu 30 (8), Fri 31 skipped,
    // Mon 3 Jan (9), Tue 4 (10), Wed 5 (11), Thu 6 (12), Fri 7 (13), Mon 10 (14), Tue 11 (15).
    expect(addUsBusinessDays('2027-12-17', 15)).toBe('2028-01-11');
  });

  it('refuses counts that are not whole and days that are not days', () => {
    expect(() => addUsBusinessDays('2026-11-20', -1)).toThrow(RangeError);
    expect(() => addUsBusinessDays('2026-11-20', 1.5)).toThrow(RangeError);
    expect(() => addUsBusinessDays('2026-02-30', 1)).toThrow(RangeError);
  });
});

describe('usBusinessDaysBetween', () => {
  it('counts the business days after the first day up to and including the second', () => {
    // Wed 2 Dec 2026 → Mon 14 Dec: Thu 3, Fri 4, Mon 7 … Fri 11, Mon 14 = 8.
    expect(usBusinessDaysBetween('2026-12-02', '2026-12-14')).toBe(8);
    expect(usBusinessDaysBetween('2026-12-14', '2026-12-14')).toBe(0);
    // Saturday to the Monday after: 1.
    expect(usBusinessDaysBetween('2026-12-12', '2026-12-14')).toBe(1);
  });

  it('is negative when the second day is earlier', () => {
    expect(usBusinessDaysBetween('2026-12-14', '2026-12-02')).toBe(-8);
    expect(usBusinessDaysBetween('2026-12-15', '2026-12-14')).toBe(-1);
  });

  it('agrees with addUsBusinessDays across the Thanksgiving week', () => {
    expect(usBusinessDaysBetween('2026-11-20', '2026-12-14')).toBe(15);
  });
});
