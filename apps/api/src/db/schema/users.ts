import {
  index,
  integer,
  pgEnum,
  pgTable,
  primaryKey,
  text,
  timestamp,
  uniqueIndex,
  uuid,
} from 'drizzle-orm/pg-core';
import { ROLES } from '@batchproof/shared';
import { id, timestamps } from './columns';
import { workshops } from './workshops';

export const roleEnum = pgEnum('member_role', ROLES);

/**
 * A person who can sign in. E-mail is stored lower-cased and is unique across the installation.
 * What they may do lives in their memberships: one per workshop, each with its own role.
 * `tokenVersion` is copied into every access token and checked on each request: raising it
 * (password reset, sign out everywhere) makes every outstanding access token fail at once.
 */
export const users = pgTable(
  'users',
  {
    id: id(),
    email: text().notNull(),
    name: text().notNull(),
    passwordHash: text().notNull(),
    tokenVersion: integer().notNull().default(0),
    ...timestamps,
  },
  (t) => [uniqueIndex('users_email_key').on(t.email)],
);

/**
 * A person's place in one workshop, with the role they hold there. An assessor or consultant
 * working for several makers has one membership per workshop and works in one at a time (the
 * access token names it). Every workshop record that names a person points at a membership
 * `(workshop_id, user_id)`, so the database refuses a record naming someone outside the workshop.
 */
export const memberships = pgTable(
  'memberships',
  {
    workshopId: uuid()
      .notNull()
      .references(() => workshops.id, { onDelete: 'cascade' }),
    userId: uuid()
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    role: roleEnum().notNull(),
    /** When the person last switched into (or signed into) this workshop; sign-in opens the latest. */
    lastActiveAt: timestamp({ withTimezone: true }),
    ...timestamps,
  },
  (t) => [
    primaryKey({ name: 'memberships_pkey', columns: [t.workshopId, t.userId] }),
    index('memberships_user_idx').on(t.userId),
  ],
);

/**
 * What a composite foreign key naming a person points at: the membership `(workshop_id, user_id)`.
 * Pass it where `workshopReference` takes a workshop table.
 */
export const members = { workshopId: memberships.workshopId, id: memberships.userId };
