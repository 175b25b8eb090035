import { inject, Injectable, type Provider } from '@angular/core';
import {
  DateAdapter,
  MAT_DATE_FORMATS,
  MAT_DATE_LOCALE,
  type MatDateFormats,
  NativeDateAdapter,
} from '@angular/material/core';
import { isCalendarDay } from '@batchproof/shared';

const DAY = /^(\d{4})-(\d{2})-(\d{2})$/;

/** How Batchproof writes a day everywhere, in the reader's locale: "2 Dec 2026", "Dec 2, 2026". */
export const DAY_FORMAT: Intl.DateTimeFormatOptions = {
  day: 'numeric',
  month: 'short',
  year: 'numeric',
};

/** Material's display formats, built on the one day format. */
export const CALENDAR_DAY_FORMATS: MatDateFormats = {
  parse: { dateInput: null },
  display: {
    dateInput: DAY_FORMAT,
    monthLabel: { month: 'short' },
    monthYearLabel: { year: 'numeric', month: 'short' },
    dateA11yLabel: { year: 'numeric', month: 'long', day: 'numeric' },
    monthYearA11yLabel: { year: 'numeric', month: 'long' },
  },
};

/** A `YYYY-MM-DD` day written in `locale`'s way with {@link DAY_FORMAT}. */
export function formatCalendarDay(day: string, locale: string): string {
  const match = DAY.exec(day);
  if (!match) return day;
  const instant = Date.UTC(Number(match[1]), Number(match[2]) - 1, Number(match[3]));
  return new Intl.DateTimeFormat(locale, { ...DAY_FORMAT, timeZone: 'UTC' }).format(instant);
}

/** Where year, month and day stand in `locale`'s numeric dates (e.g. day, month, year in en-GB). */
function numericOrder(locale: string): ('year' | 'month' | 'day')[] {
  return new Intl.DateTimeFormat(locale, { year: 'numeric', month: 'numeric', day: 'numeric' })
    .formatToParts(new Date(2001, 10, 22))
    .map((p) => p.type)
    .filter((t): t is 'year' | 'month' | 'day' => t === 'year' || t === 'month' || t === 'day');
}

/**
 * Material's date adapter for calendar days held as `YYYY-MM-DD` strings, the form the shared
 * contract, the API and the database use, so a form control holds exactly what is sent and the
 * zod schemas check it unchanged. Days are shown in the browser's locale (`MAT_DATE_LOCALE`) with
 * {@link DAY_FORMAT}, the same way the {@link CalendarDayPipe} shows them in lists; typing accepts
 * that form, the locale's numeric order (02/12/2026 in en-GB, 12/2/2026 in en-US) and
 * `YYYY-MM-DD`. Calendar arithmetic and names are NativeDateAdapter's.
 */
@Injectable()
export class CalendarDayAdapter extends DateAdapter<string> {
  private readonly native = new NativeDateAdapter();

  constructor() {
    super();
    this.setLocale(inject(MAT_DATE_LOCALE, { optional: true }) ?? 'en-US');
  }

  override setLocale(locale: unknown): void {
    super.setLocale(locale);
    this.native.setLocale(locale);
  }

  private toDate(day: string): Date {
    const [y, m, d] = [day.slice(0, 4), day.slice(5, 7), day.slice(8, 10)].map(Number);
    const date = new Date(2000, 0, 1);
    date.setFullYear(y!, m! - 1, d!);
    return date;
  }

  private fromDate(date: Date): string {
    const pad = (n: number, width: number) => String(n).padStart(width, '0');
    return `${pad(date.getFullYear(), 4)}-${pad(date.getMonth() + 1, 2)}-${pad(date.getDate(), 2)}`;
  }

  getYear(day: string): number {
    return Number(day.slice(0, 4));
  }
  getMonth(day: string): number {
    return Number(day.slice(5, 7)) - 1;
  }
  getDate(day: string): number {
    return Number(day.slice(8, 10));
  }
  getDayOfWeek(day: string): number {
    return this.native.getDayOfWeek(this.toDate(day));
  }
  getMonthNames(style: 'long' | 'short' | 'narrow'): string[] {
    return this.native.getMonthNames(style);
  }
  getDateNames(): string[] {
    return this.native.getDateNames();
  }
  getDayOfWeekNames(style: 'long' | 'short' | 'narrow'): string[] {
    return this.native.getDayOfWeekNames(style);
  }
  getYearName(day: string): string {
    return this.native.getYearName(this.toDate(day));
  }
  getFirstDayOfWeek(): number {
    return this.native.getFirstDayOfWeek();
  }
  getNumDaysInMonth(day: string): number {
    return this.native.getNumDaysInMonth(this.toDate(day));
  }
  clone(day: string): string {
    return day;
  }
  createDate(year: number, month: number, date: number): string {
    return this.fromDate(this.native.createDate(year, month, date));
  }
  today(): string {
    return this.fromDate(new Date());
  }

  /** Reads a typed day: `YYYY-MM-DD`, the locale's numeric order, or a day with a month name. */
  parse(value: unknown): string | null {
    if (typeof value !== 'string' || value.trim() === '') return null;
    const text = value.trim();
    if (DAY.test(text)) return isCalendarDay(text) ? text : this.invalid();
    const numbers = text.match(/\d+/g) ?? [];
    const letters = text
      .replace(/[\d\s.,/-]+/g, ' ')
      .trim()
      .toLocaleLowerCase(this.locale);
    let parts: Partial<Record<'year' | 'month' | 'day', number>> = {};
    if (!letters && numbers.length === 3) {
      const order = numericOrder(this.locale);
      parts = Object.fromEntries(order.map((key, i) => [key, Number(numbers[i])]));
      if (parts.month !== undefined) parts.month -= 1;
    } else if (letters && numbers.length === 2) {
      const names = [...this.getMonthNames('long'), ...this.getMonthNames('short')].map((n) =>
        n.replace(/\./g, '').toLocaleLowerCase(this.locale),
      );
      const found = names.findIndex((n) => n === letters.replace(/\./g, ''));
      if (found < 0) return this.invalid();
      const [a, b] = numbers.map(Number) as [number, number];
      const yearFirst = numbers[0]!.length > 2;
      parts = { month: found % 12, year: yearFirst ? a : b, day: yearFirst ? b : a };
    } else {
      return this.invalid();
    }
    const { year, month, day } = parts;
    if (year === undefined || month === undefined || day === undefined) return this.invalid();
    const fullYear = year < 100 ? 2000 + year : year;
    const iso = `${String(fullYear).padStart(4, '0')}-${String(month + 1).padStart(2, '0')}-${String(day).padStart(2, '0')}`;
    return isCalendarDay(iso) ? iso : this.invalid();
  }

  format(day: string, displayFormat: Intl.DateTimeFormatOptions): string {
    if (!this.isValid(day)) return '';
    return this.native.format(this.toDate(day), displayFormat);
  }
  addCalendarYears(day: string, years: number): string {
    return this.fromDate(this.native.addCalendarYears(this.toDate(day), years));
  }
  addCalendarMonths(day: string, months: number): string {
    return this.fromDate(this.native.addCalendarMonths(this.toDate(day), months));
  }
  addCalendarDays(day: string, days: number): string {
    return this.fromDate(this.native.addCalendarDays(this.toDate(day), days));
  }
  toIso8601(day: string): string {
    return day;
  }
  /** Whether `obj` is a day string (valid or not: `invalid()` answers a non-day marker). */
  isDateInstance(obj: unknown): boolean {
    return typeof obj === 'string' && (DAY.test(obj) || obj === INVALID);
  }
  isValid(day: string): boolean {
    return typeof day === 'string' && isCalendarDay(day);
  }
  invalid(): string {
    return INVALID;
  }

  /** An empty control (`''`, how the forms start a date they do not have) is no date, not a wrong one. */
  override deserialize(value: unknown): string | null {
    if (value === '' || value === null || value === undefined) return null;
    return super.deserialize(value);
  }
}

/** What {@link CalendarDayAdapter.invalid} answers for text that is not a day. */
const INVALID = 'invalid-day';

/** The browser's language, which every date on screen follows. */
export const browserLocale = (): string => globalThis.navigator?.language || 'en-US';

/**
 * The date adapter, formats and locale (the browser's language) for a component with date inputs
 * (`matDatepicker`). Provided by those components rather than the app, so the first page load
 * does not carry the datepicker's code.
 */
export function provideCalendarDays(): Provider[] {
  return [
    { provide: MAT_DATE_LOCALE, useFactory: browserLocale },
    { provide: DateAdapter, useClass: CalendarDayAdapter },
    { provide: MAT_DATE_FORMATS, useValue: CALENDAR_DAY_FORMATS },
  ];
}
