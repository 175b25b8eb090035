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

/** The day `days` after `day` (negative for before). Throws on a string that is not a day. */
export function addDays(day: string, days: number): string {
  const match = DAY_PATTERN.exec(day);
  if (!match) throw new RangeError(`Not a calendar day: ${day}`);
  const date = new Date(Date.UTC(Number(match[1]), Number(match[2]) - 1, Number(match[3]) + days));
  return calendarDayOf(date);
}

/** Whole days from `from` to `to` (negative when `to` is earlier). */
export function daysBetween(from: string, to: string): number {
  const [a, b] = [from, to].map((day) => {
    const match = DAY_PATTERN.exec(day);
    if (!match) throw new RangeError(`Not a calendar day: ${day}`);
    return Date.UTC(Number(match[1]), Number(match[2]) - 1, Number(match[3]));
  }) as [number, number];
  return Math.round((b - a) / 86_400_000);
}
