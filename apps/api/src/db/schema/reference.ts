import {
  date,
  index,
  integer,
  jsonb,
  pgTable,
  primaryKey,
  text,
  timestamp,
} from 'drizzle-orm/pg-core';

/**
 * Reference lists (colourant permissions, labelled allergens, required warnings). They are not
 * workshop data: the rows ship with the code in `@batchproof/shared` and are re-synced into these
 * tables at start-up, so the app can filter, sort and page them.
 */
export const referenceLists = pgTable('reference_lists', {
  key: text().primaryKey(),
  title: text().notNull(),
  description: text().notNull(),
  position: integer().notNull(),
  rowCount: integer().notNull(),
  syncedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
});

export const referenceRows = pgTable(
  'reference_rows',
  {
    listKey: text()
      .notNull()
      .references(() => referenceLists.key, { onDelete: 'cascade' }),
    rowId: text().notNull(),
    position: integer().notNull(),
    /** The row's display name (colour name, allergen name, warning title). */
    label: text().notNull(),
    /** Lower-cased text the list page's filter searches: names, CI and CAS numbers, source. */
    searchText: text().notNull(),
    source: text().notNull(),
    status: text().notNull(),
    effectiveFrom: date({ mode: 'string' }),
    effectiveTo: date({ mode: 'string' }),
    note: text(),
    data: jsonb().$type<Record<string, unknown>>().notNull(),
  },
  (t) => [
    primaryKey({ columns: [t.listKey, t.rowId] }),
    index('reference_rows_label_idx').on(t.listKey, t.label),
  ],
);
