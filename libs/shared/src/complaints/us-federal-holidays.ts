import { addDays, calendarDayOf, isCalendarDay } from '../dates/calendar-day';

/**
 * The US federal legal public holidays and the days federal offices observe them, as data with
 * their sources. MoCRA counts its reporting deadlines in business days; "business day" is read
 * here as Monday to Friday except the days observed as federal legal public holidays (see
 * `business-days.ts`).
 *
 * Days a President closes federal offices by a one-off executive order (a Christmas Eve, say)
 * are not legal public holidays and are not counted: leaving them out can only bring a deadline
 * earlier, never later. Inauguration Day (5 U.S.C. 6103(c)) is a holiday only for employees in
 * the Washington area and is left out for the same reason.
 */

/** How a holiday's date is found in a year. */
export type HolidayRule =
  | { readonly kind: 'fixed'; readonly month: number; readonly day: number }
  | {
      readonly kind: 'nth-weekday';
      readonly month: number;
      readonly weekday: number;
      readonly n: number;
    }
  | { readonly kind: 'last-weekday'; readonly month: number; readonly weekday: number };

/** One legal public holiday as the law names it. */
export interface UsFederalHolidayDefinition {
  /** The holiday's name as 5 U.S.C. 6103(a) gives it (not the popular name). */
  readonly name: string;
  readonly rule: HolidayRule;
  /** First year the holiday is kept. */
  readonly fromYear: number;
  /** Where the holiday comes from. */
  readonly source: string;
}

const MONDAY = 1;
const THURSDAY = 4;
const SOURCE = '5 U.S.C. 6103(a)';

/**
 * First year the list below is right for: the Birthday of Martin Luther King, Jr. was first kept
 * in 1986 (from memory: Pub. L. 98-144). Earlier years are refused rather than answered wrongly.
 */
export const FIRST_US_HOLIDAY_YEAR = 1986;

const fixed = (name: string, month: number, day: number): UsFederalHolidayDefinition => ({
  name,
  rule: { kind: 'fixed', month, day },
  fromYear: FIRST_US_HOLIDAY_YEAR,
  source: SOURCE,
});

const nthWeekday = (
  name: string,
  month: number,
  weekday: number,
  n: number,
): UsFederalHolidayDefinition => ({
  name,
  rule: { kind: 'nth-weekday', month, weekday, n },
  fromYear: FIRST_US_HOLIDAY_YEAR,
  source: SOURCE,
});

/** The legal public holidays of 5 U.S.C. 6103(a), in calendar order. */
export const US_FEDERAL_HOLIDAYS: readonly UsFederalHolidayDefinition[] = [
  fixed("New Year's Day", 1, 1),
  nthWeekday('Birthday of Martin Luther King, Jr.', 1, MONDAY, 3),
  nthWeekday("Washington's Birthday", 2, MONDAY, 3),
  {
    name: 'Memorial Day',
    rule: { kind: 'last-weekday', month: 5, weekday: MONDAY },
    fromYear: FIRST_US_HOLIDAY_YEAR,
    source: SOURCE,
  },
  {
    ...fixed('Juneteenth National Independence Day', 6, 19),
    // Juneteenth National Independence Day Act, Pub. L. 117-17, signed 17 June 2021; first
    // observed on Friday 18 June 2021 (19 June 2021 was a Saturday).
    fromYear: 2021,
    source: `${SOURCE}, as amended by Pub. L. 117-17 (2021)`,
  },
  fixed('Independence Day', 7, 4),
  nthWeekday('Labor Day', 9, MONDAY, 1),
  nthWeekday('Columbus Day', 10, MONDAY, 2),
  fixed('Veterans Day', 11, 11),
  nthWeekday('Thanksgiving Day', 11, THURSDAY, 4),
  fixed('Christmas Day', 12, 25),
];

/**
 * The observed-day rule for federal employees on a Monday-to-Friday week: a holiday on a
 * Saturday is kept on the Friday before (5 U.S.C. 6103(b)), one on a Sunday on the Monday after
 * (Executive Order 11582, §3(a), 1971). OPM's holiday lists apply both.
 */
export const US_OBSERVED_DAY_SOURCE =
  '5 U.S.C. 6103(b) (Saturday → Friday before); Executive Order 11582 §3(a) (Sunday → Monday after)';

/** A day federal offices are closed for a legal public holiday. */
export interface UsFederalHoliday {
  /** The day it is observed, YYYY-MM-DD. */
  date: string;
  name: string;
  /** The holiday's own date, when it falls on a weekend and is observed on `date` instead. */
  observedFor?: string;
}

const dayOf = (year: number, month: number, day: number) =>
  calendarDayOf(new Date(Date.UTC(year, month - 1, day)));

const weekdayOf = (year: number, month: number, day: number) =>
  new Date(Date.UTC(year, month - 1, day)).getUTCDay();

function holidayDate(year: number, rule: HolidayRule): string {
  if (rule.kind === 'fixed') return dayOf(year, rule.month, rule.day);
  if (rule.kind === 'nth-weekday') {
    const first = (rule.weekday - weekdayOf(year, rule.month, 1) + 7) % 7;
    return dayOf(year, rule.month, 1 + first + (rule.n - 1) * 7);
  }
  // Day 0 of the next month is the last day of this one.
  const lastDay = new Date(Date.UTC(year, rule.month, 0)).getUTCDate();
  const back = (weekdayOf(year, rule.month, lastDay) - rule.weekday + 7) % 7;
  return dayOf(year, rule.month, lastDay - back);
}

/** Day of the week of a YYYY-MM-DD day, 0 = Sunday … 6 = Saturday. */
export function weekdayOfDay(day: string): number {
  if (!isCalendarDay(day)) throw new RangeError(`Not a calendar day: ${day}`);
  return new Date(`${day}T00:00:00Z`).getUTCDay();
}

const SATURDAY = 6;
const SUNDAY = 0;

/**
 * The federal holidays of `year` as observed, in date order. A holiday is listed under its own
 * year even when it is observed in the year before: New Year's Day 2022 (a Saturday) is kept on
 * Friday 31 December 2021 and appears in the list for 2022, as on OPM's list for 2022.
 */
export function usFederalHolidays(year: number): UsFederalHoliday[] {
  if (!Number.isInteger(year) || year < FIRST_US_HOLIDAY_YEAR || year > 9998) {
    throw new RangeError(`US federal holidays are known for ${FIRST_US_HOLIDAY_YEAR} to 9998`);
  }
  return US_FEDERAL_HOLIDAYS.filter((h) => h.fromYear <= year)
    .map((h) => {
      const date = holidayDate(year, h.rule);
      const weekday = weekdayOfDay(date);
      if (weekday === SATURDAY) return { date: addDays(date, -1), name: h.name, observedFor: date };
      if (weekday === SUNDAY) return { date: addDays(date, 1), name: h.name, observedFor: date };
      return { date, name: h.name };
    })
    .sort((a, b) => a.date.localeCompare(b.date));
}

const observedDaysByYear = new Map<number, ReadonlySet<string>>();

function observedDays(year: number): ReadonlySet<string> {
  let days = observedDaysByYear.get(year);
  if (!days) {
    days = new Set(usFederalHolidays(year).map((h) => h.date));
    observedDaysByYear.set(year, days);
  }
  return days;
}

/** The years whose observed holidays can fall on `day`: 31 December can be the next New Year's Day. */
const yearsObservedOn = (day: string) => {
  const year = Number(day.slice(0, 4));
  return day.endsWith('-12-31') ? [year, year + 1] : [year];
};

/** The observed federal holiday on `day`, if there is one. */
export function usFederalHolidayOn(day: string): UsFederalHoliday | null {
  for (const year of yearsObservedOn(day)) {
    const holiday = usFederalHolidays(year).find((h) => h.date === day);
    if (holiday) return holiday;
  }
  return null;
}

/**
 * Whether `day` is a US business day: Monday to Friday and not a day observed as a federal legal
 * public holiday.
 */
export function isUsBusinessDay(day: string): boolean {
  const weekday = weekdayOfDay(day);
  if (weekday === SATURDAY || weekday === SUNDAY) return false;
  return !yearsObservedOn(day).some((year) => observedDays(year).has(day));
}
