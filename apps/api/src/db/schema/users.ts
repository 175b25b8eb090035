import { index, integer, pgEnum, pgTable, text, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { ROLES } from '@batchproof/shared';
import { id, timestamps, workshopKey } from './columns';
import { workshops } from './workshops';

export const roleEnum = pgEnum('member_role', ROLES);

/**
 * A person who can sign in, always a member of exactly one workshop with one role.
 * E-mail is stored lower-cased and is unique across the installation. `tokenVersion` is copied
 * into every access token and checked on each request: raising it (password reset, sign out
 * everywhere) makes every outstanding access token fail at once.
 */
export const users = pgTable(
  'users',
  {
    id: id(),
    workshopId: uuid()
      .notNull()
      .references(() => workshops.id, { onDelete: 'cascade' }),
    email: text().notNull(),
    name: text().notNull(),
    passwordHash: text().notNull(),
    role: roleEnum().notNull(),
    tokenVersion: integer().notNull().default(0),
    ...timestamps,
  },
  (t) => [
    uniqueIndex('users_email_key').on(t.email),
    index('users_workshop_idx').on(t.workshopId),
    workshopKey('users', t),
  ],
);
