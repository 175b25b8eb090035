/**
 * Calendar days as `YYYY-MM-DD` strings, the one form the API, the database's `date` columns, the
 * engine's effective dates and the browser's date inputs share. Batchproof's "today" is the UTC
 * calendar day, in the browser and on the server alike, so a live check and the server's check of the
 * same draft always agree on which rules are in force. Day arithmetic goes through the calendar
 * (Date.UTC with a day offset), never through milliseconds, so it is right across month ends, leap
 * years and clock changes.
 */

const DAY_PATTERN = /^(\d{4})-(\d{2})-(\d{2})$/;

/** The UTC calendar day of an instant. */
export function calendarDayOf(instant: Date): string {
  return instant.toISOString().slice(0, 10);
}

/** Today as the UTC calendar day. */
export function todayIso(now: Date = new Date()): string {
  return calendarDayOf(now);
}

/** Whether a string is a real calendar day (2027-02-29 is not). */
export function isCalendarDay(day: string): boolean {
  const match = DAY_PATTERN.exec(day);
  if (!match) return false;
  const [y, m, d] = [Number(match[1]), Number(match[2]), Number(match[3])];
  const date = new Date(Date.UTC(y, m - 1, d));
  return date.getUTCFullYear() === y && date.getUTCMonth() === m - 1 && date.getUTCDate() === d;
}

/** A day's year, month (1–12) and day of the month. Throws on a string that is not `YYYY-MM-DD`. */
export function calendarDayParts(day: string): { year: number; month: number; day: number } {
  const match = DAY_PATTERN.exec(day);
  if (!match) throw new RangeError(`Not a calendar day: ${day}`);
  return { year: Number(match[1]), month: Number(match[2]), day: Number(match[3]) };
}

/** The day `days` after `day` (negative for before). Throws on a string that is not a day. */
export function addDays(day: string, days: number): string {
  const p = calendarDayParts(day);
  return calendarDayOf(new Date(Date.UTC(p.year, p.month - 1, p.day + days)));
}

/**
 * The same month and day `years` later; 29 February rolls to 1 March, the later reading, so a
 * period counted in years never ends early. Throws on a string that is not a real day.
 */
export function addYears(day: string, years: number): string {
  if (!isCalendarDay(day)) throw new RangeError(`Not a calendar day: ${day}`);
  const p = calendarDayParts(day);
  return calendarDayOf(new Date(Date.UTC(p.year + years, p.month - 1, p.day)));
}

/** Whole days from `from` to `to` (negative when `to` is earlier). */
export function daysBetween(from: string, to: string): number {
  const [a, b] = [from, to].map((day) => {
    const p = calendarDayParts(day);
    return Date.UTC(p.year, p.month - 1, p.day);
  }) as [number, number];
  return Math.round((b - a) / 86_400_000);
}
