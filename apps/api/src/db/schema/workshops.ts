import { pgTable, text } from 'drizzle-orm/pg-core';
import { id, timestamps } from './columns';

/** The tenant: one small business and everything it records. */
export const workshops = pgTable('workshops', {
  id: id(),
  name: text().notNull(),
  /** The business address printed on labels (the maker's name and address); null until entered. */
  address: text(),
  ...timestamps,
});
