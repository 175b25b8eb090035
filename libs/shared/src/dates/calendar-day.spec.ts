import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { addDays, calendarDayOf, daysBetween, isCalendarDay, todayIso } from './calendar-day';

describe('calendar days', () => {
  it('takes the UTC day of an instant, so browser and server agree', () => {
    // common practice, no published source: one time zone for "today" across client and server
    expect(todayIso(new Date('2026-12-02T23:30:00-08:00'))).toBe('2026-12-03');
    expect(calendarDayOf(new Date('2026-12-02T00:00:00Z'))).toBe('2026-12-02');
  });

  it('adds days across month ends and leap days', () => {
    // Gregorian calendar: 2028 is a leap year, 2027 is not
    expect(addDays('2028-02-28', 1)).toBe('2028-02-29');
    expect(addDays('2027-02-28', 1)).toBe('2027-03-01');
    expect(addDays('2026-12-31', 1)).toBe('2027-01-01');
    expect(addDays('2026-03-01', -1)).toBe('2026-02-28');
  });

  it('knows real days from look-alikes', () => {
    expect(isCalendarDay('2028-02-29')).toBe(true);
    expect(isCalendarDay('2027-02-29')).toBe(false);
    expect(isCalendarDay('2026-13-01')).toBe(false);
    expect(isCalendarDay('26-01-01')).toBe(false);
  });

  it('adding n days and counting them back agree (property)', () => {
    fc.assert(
      fc.property(
        fc.date({ min: new Date('1900-01-01'), max: new Date('2100-12-31'), noInvalidDate: true }),
        fc.integer({ min: -4000, max: 4000 }),
        (date, n) => {
          const day = calendarDayOf(date);
          expect(daysBetween(day, addDays(day, n))).toBe(n);
        },
      ),
    );
  });
});
