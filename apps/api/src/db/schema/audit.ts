import { index, jsonb, pgTable, text, uuid } from 'drizzle-orm/pg-core';
import { id, timestamps, workshopKey, workshopReference } from './columns';
import { members } from './users';
import { workshops } from './workshops';

/** Who did what to which record, across the workshop's data. */
export const auditEvents = pgTable(
  'audit_events',
  {
    id: id(),
    workshopId: uuid()
      .notNull()
      .references(() => workshops.id, { onDelete: 'cascade' }),
    actorId: uuid(),
    action: text().notNull(),
    subjectType: text().notNull(),
    subjectId: text(),
    detail: jsonb().$type<Record<string, unknown>>(),
    ...timestamps,
  },
  (t) => [
    index('audit_events_workshop_idx').on(t.workshopId, t.createdAt),
    workshopKey('audit_events', t),
    workshopReference(
      'audit_events_actor_fk',
      { workshopId: t.workshopId, column: t.actorId },
      members,
      'set null',
    ),
  ],
);
