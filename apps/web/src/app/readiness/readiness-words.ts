import {
  canadaNotificationDue,
  type ComplianceMarket,
  daysBetween,
  MARKET_RECORD_KINDS,
  MARKET_RECORD_MARKET,
  type MarketRecordKind,
  type ReadinessItem,
} from '@batchproof/shared';
import { MARKETS } from '../formulas/product-types';

/** A market's full name, as the readiness page heads its blocks ("European Union"). */
export const marketName = (code: ComplianceMarket) =>
  MARKETS.find((m) => m.code === code)?.name ?? code;

/** What each record is called on its button and dialog. */
export const RECORD_TITLES: Record<MarketRecordKind, string> = {
  'eu-notification': 'EU notification',
  'uk-notification': 'UK notification',
  'us-listing': 'US product listing',
  'us-substantiation': 'US safety substantiation',
  'ca-notification': 'Canada notification',
};

/** What the reference field holds for each kind, in the maker's words. */
export const REFERENCE_HINTS: Record<MarketRecordKind, string> = {
  'eu-notification': 'The reference the EU notification portal gave',
  'uk-notification': 'The reference the UK notification service gave',
  'us-listing': 'The listing number FDA gave',
  'us-substantiation': 'Where the safety records are kept: a file name or folder',
  'ca-notification': 'The number Health Canada gave the notification form',
};

/** The record kinds of one market, in the contract's order. */
export function recordKindsOf(market: ComplianceMarket): MarketRecordKind[] {
  return MARKET_RECORD_KINDS.filter((kind) => MARKET_RECORD_MARKET[kind] === market);
}

/**
 * The record an item asks for, when the place it is done is this page's own dialog (its link is
 * `/readiness`): the market's kind its key names (`notification`, `listing`, `substantiation`,
 * as `marketReadiness` keys them, or the whole kind), else the market's only kind.
 */
export function recordKindOfItem(
  item: ReadinessItem,
  market: ComplianceMarket,
): MarketRecordKind | null {
  if (!item.link?.startsWith('/readiness')) return null;
  const kinds = recordKindsOf(market);
  const named = kinds.find(
    (kind) => item.key.includes(kind) || item.key.includes(kind.slice(kind.indexOf('-') + 1)),
  );
  return named ?? (kinds.length === 1 ? kinds[0]! : null);
}

/** Where Canada's 10-day clock stands for a first sale on `firstSaleOn`. */
export interface CanadaClock {
  /** The last day the notification may be sent. */
  dueOn: string;
  /** Days from `today` to `dueOn` (negative once it has passed). */
  daysLeft: number;
  overdue: boolean;
}

/** The source of Canada's clock, shown beside it. */
export const CANADA_CLOCK_SOURCE = 'Cosmetic Regulations (C.R.C., c. 869), s. 30(1)';

/**
 * Canada's notification clock: the form is due "at the latest 10 days after the manufacturer or
 * importer first sells a cosmetic" (Cosmetic Regulations (C.R.C., c. 869), s. 30(1)); the due day
 * is the shared rule's, so the dialog and the readiness item agree.
 */
export function canadaClock(firstSaleOn: string, today: string): CanadaClock {
  const dueOn = canadaNotificationDue(firstSaleOn);
  const daysLeft = daysBetween(today, dueOn);
  return { dueOn, daysLeft, overdue: daysLeft < 0 };
}
