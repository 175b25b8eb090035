import { addDays, isCalendarDay } from '../dates/calendar-day';
import { isUsBusinessDay } from './us-federal-holidays';

/**
 * Counting in US business days (Monday to Friday, less observed federal legal public holidays;
 * see `us-federal-holidays.ts`). The day something is received is day 0, whatever kind of day it
 * is; day 1 is the first business day after it. "N business days after" a day is then the N-th
 * business day counted this way. MoCRA does not define "business day"; this reading is the usual
 * one for federal deadlines (common practice, no published source).
 */

/** Longest count accepted: far beyond any deadline, and it keeps a mistaken call finite. */
const MAX_BUSINESS_DAYS = 100_000;

/** The `n`-th US business day after `day` (`day` itself when `n` is 0). */
export function addUsBusinessDays(day: string, n: number): string {
  if (!isCalendarDay(day)) throw new RangeError(`Not a calendar day: ${day}`);
  if (!Number.isInteger(n) || n < 0 || n > MAX_BUSINESS_DAYS) {
    throw new RangeError(`Count business days as a whole number from 0 to ${MAX_BUSINESS_DAYS}`);
  }
  let current = day;
  for (let counted = 0; counted < n;) {
    current = addDays(current, 1);
    if (isUsBusinessDay(current)) counted += 1;
  }
  return current;
}

/**
 * Business days from `from` to `to`: those after `from` up to and including `to`, so a deadline
 * on the next business day is 1 away and a deadline today is 0. Negative when `to` is earlier:
 * the business days after `to` up to and including `from`.
 */
export function usBusinessDaysBetween(from: string, to: string): number {
  for (const day of [from, to]) {
    if (!isCalendarDay(day)) throw new RangeError(`Not a calendar day: ${day}`);
  }
  if (to < from) return -usBusinessDaysBetween(to, from);
  let count = 0;
  for (let current = from; current < to;) {
    current = addDays(current, 1);
    if (isUsBusinessDay(current)) count += 1;
  }
  return count;
}
