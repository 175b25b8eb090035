import { relations } from 'drizzle-orm';
import { auditEvents, invitations, refreshSessions, users, workshops } from './schema';

export const workshopRelations = relations(workshops, ({ many }) => ({
  users: many(users),
  invitations: many(invitations),
}));

export const userRelations = relations(users, ({ one, many }) => ({
  workshop: one(workshops, { fields: [users.workshopId], references: [workshops.id] }),
  refreshSessions: many(refreshSessions),
}));

export const invitationRelations = relations(invitations, ({ one }) => ({
  workshop: one(workshops, { fields: [invitations.workshopId], references: [workshops.id] }),
  inviter: one(users, { fields: [invitations.invitedBy], references: [users.id] }),
}));

export const refreshSessionRelations = relations(refreshSessions, ({ one }) => ({
  user: one(users, { fields: [refreshSessions.userId], references: [users.id] }),
}));

export const auditEventRelations = relations(auditEvents, ({ one }) => ({
  workshop: one(workshops, { fields: [auditEvents.workshopId], references: [workshops.id] }),
}));
