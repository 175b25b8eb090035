import type { ReportingClock } from '@batchproof/shared';
import { DAY_FORMAT } from '../dates/calendar-day-adapter';

/** A due day with its weekday, in `locale`: "Mon 14 Dec 2026" in en-GB. */
export function formatDueDay(day: string, locale: string): string {
  const [y, m, d] = day.split('-').map(Number);
  return new Intl.DateTimeFormat(locale, { weekday: 'short', ...DAY_FORMAT, timeZone: 'UTC' })
    .format(Date.UTC(y!, m! - 1, d!))
    .replace(/,/g, '');
}

const businessDays = (n: number) => `${n} business ${n === 1 ? 'day' : 'days'}`;

/**
 * The US reporting clock in plain words: "Report to FDA by Mon 14 Dec 2026 — 8 business days
 * left.", the last day, how long ago it passed, or when it was reported.
 */
export function reportingDeadline(
  clock: Pick<ReportingClock, 'dueOn' | 'businessDaysLeft' | 'state' | 'reportedOn'>,
  locale: string,
): string {
  const due = formatDueDay(clock.dueOn, locale);
  const left = clock.businessDaysLeft ?? 0;
  switch (clock.state) {
    case 'reported':
      return `Reported to FDA on ${formatDueDay(clock.reportedOn!, locale)}, within the deadline (${due}).`;
    case 'reported-late':
      return `Reported to FDA on ${formatDueDay(clock.reportedOn!, locale)}, after the deadline of ${due}.`;
    case 'overdue':
      return `Overdue: the report to FDA was due by ${due}, ${businessDays(-left)} ago.`;
    case 'running':
      return left === 0
        ? `Report to FDA by ${due} — today is the last day.`
        : `Report to FDA by ${due} — ${businessDays(left)} left.`;
  }
}
