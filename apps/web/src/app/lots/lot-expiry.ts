import {
  addDays as addCalendarDays,
  ATTENTION_EXPIRY_DAYS,
  calendarDayOf,
} from '@batchproof/shared';

/**
 * How close to its expiry date a lot counts as expiring soon.
 * // common practice, no published source: a month is the usual reorder and use-up window.
 */
export const EXPIRING_SOON_DAYS = 30;

/** Where a lot stands against its expiry date. */
export type ExpiryState = 'none' | 'ok' | 'soon' | 'expired';

/** The word and icon for each state, so it never rests on colour alone. */
export const EXPIRY_FLAGS: Record<'soon' | 'expired', { word: string; icon: string }> = {
  soon: { word: 'Expires soon', icon: 'schedule' },
  expired: { word: 'Expired', icon: 'event_busy' },
};

/** The "expiry" filter of the lots list, as it appears in the URL. */
export const EXPIRY_FILTERS = [
  { value: 'expired', label: 'Already expired' },
  { value: '30', label: 'Expired or expiring within 30 days' },
  // The home page's "expiring" rows link here with this window.
  {
    value: String(ATTENTION_EXPIRY_DAYS),
    label: `Expired or expiring within ${ATTENTION_EXPIRY_DAYS} days`,
  },
  { value: '90', label: 'Expired or expiring within 90 days' },
] as const;

/** The calendar day of `date` as YYYY-MM-DD: Batchproof's one "today" (shared with the server). */
export function isoDay(date: Date): string {
  return calendarDayOf(date);
}

/** The day `days` after `today` (negative for before), as YYYY-MM-DD. */
export function addDays(today: Date, days: number): string {
  return addCalendarDays(calendarDayOf(today), days);
}

/** Where a lot expiring on `expiresOn` stands on `today`. */
export function expiryState(expiresOn: string | null, today: Date): ExpiryState {
  if (!expiresOn) return 'none';
  if (expiresOn < isoDay(today)) return 'expired';
  if (expiresOn <= addDays(today, EXPIRING_SOON_DAYS)) return 'soon';
  return 'ok';
}

/**
 * The API's `expiresBefore` cut-off for an expiry filter from the URL, or undefined for none
 * (or one we do not know). The API keeps lots expiring on or before the cut-off.
 */
export function expiresBeforeFor(filter: string | undefined, today: Date): string | undefined {
  if (filter === 'expired') return addDays(today, -1);
  const days = Number(filter);
  if (EXPIRY_FILTERS.some((f) => f.value === filter) && Number.isInteger(days)) {
    return addDays(today, days);
  }
  return undefined;
}
