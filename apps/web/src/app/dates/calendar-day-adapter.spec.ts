import { TestBed } from '@angular/core/testing';
import { DateAdapter } from '@angular/material/core';
import { CalendarDayAdapter, formatCalendarDay, provideCalendarDays } from './calendar-day-adapter';
import { formatDay } from './calendar-day-pipe';

function adapterFor(locale: string): DateAdapter<string> {
  TestBed.configureTestingModule({ providers: [provideCalendarDays()] });
  const adapter = TestBed.inject(DateAdapter<string>);
  adapter.setLocale(locale);
  return adapter;
}

describe('CalendarDayAdapter', () => {
  it('holds days as YYYY-MM-DD and shows them the one way dates are shown in lists', () => {
    const adapter = adapterFor('en-GB');
    expect(adapter).toBeInstanceOf(CalendarDayAdapter);
    const shown = adapter.format('2026-12-02', { day: 'numeric', month: 'short', year: 'numeric' });
    expect(shown).toBe(formatCalendarDay('2026-12-02', 'en-GB'));
    expect(shown).toBe('2 Dec 2026');
    expect(formatDay('2026-12-02', 'en-US')).toBe('Dec 2, 2026');
  });

  it("reads what a maker types: the shown form, the locale's numeric order and YYYY-MM-DD", () => {
    const gb = adapterFor('en-GB');
    expect(gb.parse('2 Dec 2026', null)).toBe('2026-12-02');
    expect(gb.parse('02/12/2026', null)).toBe('2026-12-02');
    expect(gb.parse('2026-12-02', null)).toBe('2026-12-02');
    gb.setLocale('en-US');
    expect(gb.parse('12/2/2026', null)).toBe('2026-12-02');
    expect(gb.parse('Dec 2, 2026', null)).toBe('2026-12-02');
  });

  it('answers no date for an empty field and an invalid one for text that is not a day', () => {
    const adapter = adapterFor('en-GB');
    expect(adapter.parse('', null)).toBeNull();
    expect(adapter.deserialize('')).toBeNull();
    for (const text of ['31/02/2026', 'soon', '2027-02-29']) {
      const parsed = adapter.parse(text, null);
      expect(adapter.getValidDateOrNull(parsed)).toBeNull();
      expect(adapter.isValid(parsed as string)).toBe(false);
    }
  });

  it('does calendar arithmetic across month and year ends', () => {
    const adapter = adapterFor('en-GB');
    expect(adapter.addCalendarDays('2026-12-31', 1)).toBe('2027-01-01');
    expect(adapter.addCalendarMonths('2026-01-31', 1)).toBe('2026-02-28');
    expect(adapter.getNumDaysInMonth('2028-02-10')).toBe(29);
  });
});
