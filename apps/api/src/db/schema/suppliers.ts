import { index, pgTable, text, uuid } from 'drizzle-orm/pg-core';
import { archivedAt, id, timestamps, workshopKey } from './columns';
import { workshops } from './workshops';

/** A company the workshop buys materials from. */
export const suppliers = pgTable(
  'suppliers',
  {
    id: id(),
    workshopId: uuid()
      .notNull()
      .references(() => workshops.id, { onDelete: 'cascade' }),
    name: text().notNull(),
    contact: text(),
    email: text(),
    website: text(),
    notes: text(),
    archivedAt: archivedAt(),
    ...timestamps,
  },
  (t) => [
    index('suppliers_workshop_name_idx').on(t.workshopId, t.name),
    index('suppliers_workshop_created_idx').on(t.workshopId, t.createdAt),
    workshopKey('suppliers', t),
  ],
);
