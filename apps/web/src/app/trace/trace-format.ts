import { browserLocale } from '../dates/calendar-day-adapter';
import { formatDay } from '../dates/calendar-day-pipe';

const locale = browserLocale();
const numbers = new Intl.NumberFormat(locale, { maximumFractionDigits: 3 });

/** A quantity as the trace tables show it: up to three decimals, grouped for the reader. */
export const formatAmount = (value: number | null): string =>
  value === null ? '' : numbers.format(value);

/** A calendar day as the app writes dates. */
export const formatTraceDay = (day: string): string => formatDay(day, locale);

/** "1 unit", "20 units". */
export const unitsWord = (n: number): string =>
  `${numbers.format(n)} ${n === 1 ? 'unit' : 'units'}`;

/** "1 customer", "3 customers" and so on for any noun with a plain -s plural. */
export const counted = (n: number, noun: string): string => `${n} ${n === 1 ? noun : `${noun}s`}`;
