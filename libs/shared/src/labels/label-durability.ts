import { calendarDayParts } from '../dates/calendar-day';
import type { ComplianceMarket } from '../reference-data/reference-row';
import {
  EU_DATE_OF_MINIMUM_DURABILITY_MAX_MONTHS,
  periodAfterOpeningText,
  type ProductIdentity,
} from './product-identity';

/**
 * What a label says about how long the product keeps: an expiry date, a date of minimum durability
 * worked out from the shelf life, or the period after opening.
 */

/** Said beside a PAO text, so the renderer and the maker know what it stands for. */
export const PAO_NOTE =
  'The period-after-opening (open-jar) symbol’s text: print it in or beside the open-jar symbol (Regulation (EC) No 1223/2009, Art. 19(1)(c) and Annex VII, point 2).';

/** The durability text of one market's label, its name in the UI's words, and a note if any. */
export interface DurabilityText {
  readonly name: string;
  readonly text: string;
  readonly note?: string;
}

/**
 * The month `months` after the month of `madeOn`, as `YYYY-MM`: made 2026-12-02 with 18 months of
 * shelf life → `2028-06`, printed as "the end of 06/2028".
 */
export function bestBeforeMonth(madeOn: string, months: number): string {
  const { year, month } = calendarDayParts(madeOn);
  const index = year * 12 + (month - 1) + months;
  return `${Math.floor(index / 12)}-${String((index % 12) + 1).padStart(2, '0')}`;
}

/** The date of minimum durability's wording (Regulation (EC) No 1223/2009, Art. 19(1)(c)). */
const BEST_BEFORE = 'Best used before the end of';

/**
 * EU and UK (Regulation (EC) No 1223/2009, Art. 19(1)(c), retained in the UK): a date of minimum
 * durability, as day, month and year from an expiry date or month and year from a shelf life of
 * 30 months or less; above 30 months the period after opening, which is then required (and is
 * added to an expiry date too).
 */
function euDurability(
  identity: ProductIdentity,
  expiresOn: string | null,
  madeOn: string,
): DurabilityText | null {
  const { shelfLifeMonths, periodAfterOpeningMonths } = identity;
  let date: string | null = null;
  if (expiresOn) {
    const { year, month, day } = calendarDayParts(expiresOn);
    date = `${BEST_BEFORE} ${String(day).padStart(2, '0')}/${String(month).padStart(2, '0')}/${year}`;
  } else if (
    shelfLifeMonths !== null &&
    shelfLifeMonths <= EU_DATE_OF_MINIMUM_DURABILITY_MAX_MONTHS
  ) {
    const [year, month] = bestBeforeMonth(madeOn, shelfLifeMonths).split('-');
    date = `${BEST_BEFORE} ${month}/${year}`;
  }
  const paoRequired =
    date === null ||
    (shelfLifeMonths !== null && shelfLifeMonths > EU_DATE_OF_MINIMUM_DURABILITY_MAX_MONTHS);
  const pao =
    paoRequired && periodAfterOpeningMonths !== null
      ? periodAfterOpeningText(periodAfterOpeningMonths)
      : null;
  if (date && pao)
    return {
      name: 'Best-before date and period after opening',
      text: `${date} · ${pao}`,
      note: PAO_NOTE,
    };
  if (date) return { name: 'Best-before date', text: date };
  if (pao) return { name: 'Period after opening', text: pao, note: PAO_NOTE };
  return null;
}

/**
 * The durability line of one market's label, or null when there is nothing to print. US and
 * Canada: the expiry date when one is given ("Exp. 2028-03-15"; neither market's rules ask for a
 * date on most cosmetics, so without one nothing is printed — common practice, no published source).
 * The full day is printed so the label never promises more than the date the maker gave.
 */
export function durabilityText(
  market: ComplianceMarket,
  identity: ProductIdentity,
  expiresOn: string | null,
  madeOn: string,
): DurabilityText | null {
  if (market === 'EU' || market === 'UK') return euDurability(identity, expiresOn, madeOn);
  return expiresOn ? { name: 'Expiry date', text: `Exp. ${expiresOn}` } : null;
}
