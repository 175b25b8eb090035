import { boolean, numeric, pgTable, text } from 'drizzle-orm/pg-core';
import { DEFAULT_BATCH_CODE_PATTERN, DEFAULT_WEIGHING_TOLERANCE_PERCENT } from '@batchproof/shared';
import { id, timestamps } from './columns';

/** The tenant: one small business and everything it records. */
export const workshops = pgTable('workshops', {
  id: id(),
  name: text().notNull(),
  /** The business address printed on labels (the maker's name and address); null until entered. */
  address: text(),
  /** ± percent a weighed line may differ from its target before it is flagged (`checkWeighing`). */
  weighingTolerancePercent: numeric({ precision: 5, scale: 2, mode: 'number' })
    .notNull()
    .default(DEFAULT_WEIGHING_TOLERANCE_PERCENT),
  /** How batch codes are made (`formatBatchCode`); GS1 (10) characters only. */
  batchCodePattern: text().notNull().default(DEFAULT_BATCH_CODE_PATTERN),
  /**
   * The owner's answer to "is this a small business under MoCRA?": adverse-event records are kept
   * 3 years instead of 6 (FD&C Act §605(e)). The owner decides; the app does not judge it.
   */
  smallBusiness: boolean().notNull().default(false),
  ...timestamps,
});
