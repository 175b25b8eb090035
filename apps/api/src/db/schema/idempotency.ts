import { integer, pgTable, primaryKey, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { workshopReference } from './columns';
import { members } from './users';
import { workshops } from './workshops';

/**
 * The first answer to each create sent with an `Idempotency-Key`, per workshop and user. The row
 * is written in the same transaction as the record it answers for, so either both are committed
 * or neither is: a retry finds the answer, or finds nothing and creates the record itself.
 */
export const idempotencyKeys = pgTable(
  'idempotency_keys',
  {
    workshopId: uuid()
      .notNull()
      .references(() => workshops.id, { onDelete: 'cascade' }),
    userId: uuid().notNull(),
    key: text().notNull(),
    /** SHA-256 of the method, path and body: the same key with another request is refused. */
    requestHash: text().notNull(),
    /** The first answer's status and JSON body, replayed byte for byte; null only mid-request. */
    responseStatus: integer(),
    responseBody: text(),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    primaryKey({ columns: [t.workshopId, t.userId, t.key] }),
    workshopReference(
      'idempotency_keys_user_fk',
      { workshopId: t.workshopId, column: t.userId },
      members,
      'cascade',
    ),
  ],
);
