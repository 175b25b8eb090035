import { Pipe, type PipeTransform } from '@angular/core';
import { browserLocale, DAY_FORMAT, formatCalendarDay } from './calendar-day-adapter';

/**
 * Shows a date the one way Batchproof writes dates, in the browser's locale (as the date inputs
 * do): a calendar day (`2026-12-02`) as that day; a moment (an ISO timestamp) as
 * the day it fell on where the reader is, with the time when `'time'` is asked for.
 * `{{ lot.expiresOn | day }}`, `{{ v.updatedAt | day: 'time' }}`.
 */
/** {@link CalendarDayPipe}'s formatting, for text built in code (e.g. the home page's rows). */
export function formatDay(value: string, locale: string, withTime?: 'time'): string {
  if (/^\d{4}-\d{2}-\d{2}$/.test(value)) return formatCalendarDay(value, locale);
  const instant = new Date(value);
  if (Number.isNaN(instant.getTime())) return value;
  return new Intl.DateTimeFormat(locale, {
    ...DAY_FORMAT,
    ...(withTime ? { hour: '2-digit', minute: '2-digit' } : {}),
  }).format(instant);
}

@Pipe({ name: 'day' })
export class CalendarDayPipe implements PipeTransform {
  private readonly locale = browserLocale();

  transform(value: string | null | undefined, withTime?: 'time'): string {
    return value ? formatDay(value, this.locale, withTime) : '';
  }
}
