import { index, jsonb, pgTable, text, uuid } from 'drizzle-orm/pg-core';
import type { LabelStock } from '@batchproof/shared';
import { archivedAt, id, timestamps, workshopKey } from './columns';
import { workshops } from './workshops';

/** A stock's geometry as stored: everything of the shared label stock but its name. */
export type StoredLabelStockGeometry = DistributiveOmit<LabelStock, 'name'>;
type DistributiveOmit<T, K extends PropertyKey> = T extends unknown ? Omit<T, K> : never;

/**
 * A label stock a workshop defined itself; the built-in ones live in the shared library. The
 * geometry is checked with the shared `labelStockSchema` before it is stored.
 */
export const labelStocks = pgTable(
  'label_stocks',
  {
    id: id(),
    workshopId: uuid()
      .notNull()
      .references(() => workshops.id, { onDelete: 'cascade' }),
    name: text().notNull(),
    geometry: jsonb().$type<StoredLabelStockGeometry>().notNull(),
    archivedAt: archivedAt(),
    ...timestamps,
  },
  (t) => [
    index('label_stocks_workshop_name_idx').on(t.workshopId, t.name),
    workshopKey('label_stocks', t),
  ],
);
