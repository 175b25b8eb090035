import { describe, expect, it } from 'vitest';
import { isUsBusinessDay, usFederalHolidayOn, usFederalHolidays } from './us-federal-holidays';

const listed = (year: number) => usFederalHolidays(year).map((h) => `${h.date} ${h.name}`);

describe('usFederalHolidays', () => {
  it('lists 2026 as OPM published it', () => {
    // OPM, "Federal Holidays" 2026 (opm.gov/policy-data-oversight/pay-leave/federal-holidays),
    // as copied on ca11.uscourts.gov/federal-holidays: Independence Day falls on a Saturday and
    // is kept on Friday 3 July.
    expect(listed(2026)).toEqual([
      "2026-01-01 New Year's Day",
      '2026-01-19 Birthday of Martin Luther King, Jr.',
      "2026-02-16 Washington's Birthday",
      '2026-05-25 Memorial Day',
      '2026-06-19 Juneteenth National Independence Day',
      '2026-07-03 Independence Day',
      '2026-09-07 Labor Day',
      '2026-10-12 Columbus Day',
      '2026-11-11 Veterans Day',
      '2026-11-26 Thanksgiving Day',
      '2026-12-25 Christmas Day',
    ]);
    expect(usFederalHolidays(2026)[5]).toEqual({
      date: '2026-07-03',
      name: 'Independence Day',
      observedFor: '2026-07-04',
    });
  });

  it('lists 2022 as OPM published it, New Year’s Day kept on Friday 31 December 2021', () => {
    // OPM's 2022 list (quoted on fedsmith.com, 21 Dec 2021): 1 January 2022 was a Saturday, so
    // the Friday before is the holiday (5 U.S.C. 6103(b)); Juneteenth and Christmas fell on
    // Sundays and moved to the Monday after (Executive Order 11582 §3(a)).
    expect(usFederalHolidays(2022).map((h) => h.date)).toEqual([
      '2021-12-31',
      '2022-01-17',
      '2022-02-21',
      '2022-05-30',
      '2022-06-20',
      '2022-07-04',
      '2022-09-05',
      '2022-10-10',
      '2022-11-11',
      '2022-11-24',
      '2022-12-26',
    ]);
    expect(usFederalHolidays(2022)[0]).toEqual({
      date: '2021-12-31',
      name: "New Year's Day",
      observedFor: '2022-01-01',
    });
    // …and it is not listed again under 2021, whose own Christmas (a Saturday) is Friday 24th.
    expect(usFederalHolidays(2021).map((h) => h.date)).not.toContain('2021-12-31');
    expect(usFederalHolidays(2021).at(-1)).toEqual({
      date: '2021-12-24',
      name: 'Christmas Day',
      observedFor: '2021-12-25',
    });
  });

  it('works out 2027 from the rules, weekend holidays moved both ways', () => {
    // Hand-worked: 1 Jan 2027 is a Friday; 1 Feb a Monday; 1 May a Saturday (so the last Monday
    // of May is the 31st); 19 June a Saturday; 4 July a Sunday; 1 Sept a Wednesday; 1 Oct a
    // Friday; 1 Nov a Monday; 25 Dec a Saturday.
    expect(listed(2027)).toEqual([
      "2027-01-01 New Year's Day",
      '2027-01-18 Birthday of Martin Luther King, Jr.',
      "2027-02-15 Washington's Birthday",
      '2027-05-31 Memorial Day',
      '2027-06-18 Juneteenth National Independence Day',
      '2027-07-05 Independence Day',
      '2027-09-06 Labor Day',
      '2027-10-11 Columbus Day',
      '2027-11-11 Veterans Day',
      '2027-11-25 Thanksgiving Day',
      '2027-12-24 Christmas Day',
    ]);
    // New Year's Day 2028 (a Saturday) is kept on Friday 31 December 2027, under 2028.
    expect(usFederalHolidays(2028)[0]).toEqual({
      date: '2027-12-31',
      name: "New Year's Day",
      observedFor: '2028-01-01',
    });
  });

  it('keeps Juneteenth from 2021 only', () => {
    // Juneteenth National Independence Day Act, Pub. L. 117-17, 17 June 2021.
    expect(usFederalHolidays(2020)).toHaveLength(10);
    expect(listed(2020)).not.toContain('2020-06-19 Juneteenth National Independence Day');
    expect(usFederalHolidays(2021)).toHaveLength(11);
    // 19 June 2021 was a Saturday: first kept on Friday 18 June 2021.
    expect(listed(2021)).toContain('2021-06-18 Juneteenth National Independence Day');
  });

  it('refuses years before the list was in force', () => {
    expect(() => usFederalHolidays(1985)).toThrow(RangeError);
    expect(() => usFederalHolidays(2026.5)).toThrow(RangeError);
  });
});

describe('isUsBusinessDay', () => {
  it('is false on weekends and observed holidays, true on other weekdays', () => {
    expect(isUsBusinessDay('2026-11-26')).toBe(false); // Thanksgiving, a Thursday
    expect(isUsBusinessDay('2026-11-27')).toBe(true); // the Friday after is not a holiday
    expect(isUsBusinessDay('2026-11-28')).toBe(false); // Saturday
    expect(isUsBusinessDay('2026-11-29')).toBe(false); // Sunday
    expect(isUsBusinessDay('2026-07-03')).toBe(false); // Independence Day observed
  });

  it('counts 19 June as a business day in 2020 and not in 2021', () => {
    expect(isUsBusinessDay('2020-06-19')).toBe(true); // a Friday, before Juneteenth was a holiday
    expect(isUsBusinessDay('2021-06-18')).toBe(false); // Juneteenth 2021 observed
  });

  it('closes 31 December 2021 for the next year’s New Year’s Day', () => {
    expect(isUsBusinessDay('2021-12-31')).toBe(false);
    expect(isUsBusinessDay('2021-12-30')).toBe(true);
    expect(usFederalHolidayOn('2021-12-31')).toEqual({
      date: '2021-12-31',
      name: "New Year's Day",
      observedFor: '2022-01-01',
    });
    expect(usFederalHolidayOn('2021-12-30')).toBeNull();
  });
});
