import { index, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { id, timestamps, workshopKey, workshopReference } from './columns';
import { members, roleEnum } from './users';
import { workshops } from './workshops';

/** Pending invitations; only the SHA-256 of the token sent by e-mail is kept. */
export const invitations = pgTable(
  'invitations',
  {
    id: id(),
    workshopId: uuid()
      .notNull()
      .references(() => workshops.id, { onDelete: 'cascade' }),
    email: text().notNull(),
    role: roleEnum().notNull(),
    tokenHash: text().notNull().unique(),
    invitedBy: uuid(),
    expiresAt: timestamp({ withTimezone: true }).notNull(),
    acceptedAt: timestamp({ withTimezone: true }),
    ...timestamps,
  },
  (t) => [
    index('invitations_workshop_idx').on(t.workshopId),
    workshopKey('invitations', t),
    workshopReference(
      'invitations_invited_by_fk',
      { workshopId: t.workshopId, column: t.invitedBy },
      members,
      'set null',
    ),
  ],
);

/** One-time password-reset links; only the token's SHA-256 is kept. */
export const passwordResets = pgTable(
  'password_resets',
  {
    id: id(),
    workshopId: uuid()
      .notNull()
      .references(() => workshops.id, { onDelete: 'cascade' }),
    userId: uuid().notNull(),
    tokenHash: text().notNull().unique(),
    expiresAt: timestamp({ withTimezone: true }).notNull(),
    usedAt: timestamp({ withTimezone: true }),
    ...timestamps,
  },
  (t) => [
    workshopKey('password_resets', t),
    workshopReference(
      'password_resets_user_fk',
      { workshopId: t.workshopId, column: t.userId },
      members,
      'cascade',
    ),
  ],
);

/**
 * Refresh sessions: a long-lived opaque token held in an httpOnly cookie, rotated on every
 * refresh; only its SHA-256 is kept, and sign-out or reuse revokes it. Every token rotated from
 * one sign-in shares its `familyId`, so a spent token presented again revokes the whole family.
 */
export const refreshSessions = pgTable(
  'refresh_sessions',
  {
    id: id(),
    workshopId: uuid()
      .notNull()
      .references(() => workshops.id, { onDelete: 'cascade' }),
    userId: uuid().notNull(),
    familyId: uuid().notNull().defaultRandom(),
    tokenHash: text().notNull().unique(),
    expiresAt: timestamp({ withTimezone: true }).notNull(),
    revokedAt: timestamp({ withTimezone: true }),
    ...timestamps,
  },
  (t) => [
    index('refresh_sessions_user_idx').on(t.userId),
    index('refresh_sessions_family_idx').on(t.familyId),
    workshopKey('refresh_sessions', t),
    workshopReference(
      'refresh_sessions_user_fk',
      { workshopId: t.workshopId, column: t.userId },
      members,
      'cascade',
    ),
  ],
);

/**
 * A sign-up waiting for its e-mail to be confirmed. The workshop and its owner are created only
 * when the link is opened, so the sign-up answer is the same whether or not the address already
 * has an account. Holds no workshop data yet, hence no workshop id; only the token's SHA-256 and
 * the password's bcrypt hash are kept.
 */
export const signUpRequests = pgTable(
  'sign_up_requests',
  {
    id: id(),
    email: text().notNull(),
    name: text().notNull(),
    workshopName: text().notNull(),
    passwordHash: text().notNull(),
    tokenHash: text().notNull().unique(),
    expiresAt: timestamp({ withTimezone: true }).notNull(),
    usedAt: timestamp({ withTimezone: true }),
    ...timestamps,
  },
  (t) => [index('sign_up_requests_email_idx').on(t.email)],
);
