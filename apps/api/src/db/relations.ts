import { relations } from 'drizzle-orm';
import {
  auditEvents,
  documents,
  formulaLines,
  formulas,
  formulaVersions,
  invitations,
  lotConsumptions,
  lots,
  materials,
  memberships,
  refreshSessions,
  suppliers,
  users,
  workshops,
} from './schema';

export const workshopRelations = relations(workshops, ({ many }) => ({
  memberships: many(memberships),
  invitations: many(invitations),
}));

export const userRelations = relations(users, ({ many }) => ({
  memberships: many(memberships),
  refreshSessions: many(refreshSessions),
}));

export const membershipRelations = relations(memberships, ({ one }) => ({
  workshop: one(workshops, { fields: [memberships.workshopId], references: [workshops.id] }),
  user: one(users, { fields: [memberships.userId], references: [users.id] }),
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

export const supplierRelations = relations(suppliers, ({ one, many }) => ({
  workshop: one(workshops, { fields: [suppliers.workshopId], references: [workshops.id] }),
  materials: many(materials),
}));

export const materialRelations = relations(materials, ({ one, many }) => ({
  workshop: one(workshops, { fields: [materials.workshopId], references: [workshops.id] }),
  supplier: one(suppliers, { fields: [materials.supplierId], references: [suppliers.id] }),
  lots: many(lots),
  documents: many(documents),
}));

export const lotRelations = relations(lots, ({ one, many }) => ({
  workshop: one(workshops, { fields: [lots.workshopId], references: [workshops.id] }),
  material: one(materials, { fields: [lots.materialId], references: [materials.id] }),
  consumptions: many(lotConsumptions),
  documents: many(documents),
}));

export const lotConsumptionRelations = relations(lotConsumptions, ({ one }) => ({
  lot: one(lots, { fields: [lotConsumptions.lotId], references: [lots.id] }),
}));

export const documentRelations = relations(documents, ({ one }) => ({
  workshop: one(workshops, { fields: [documents.workshopId], references: [workshops.id] }),
  material: one(materials, { fields: [documents.materialId], references: [materials.id] }),
  lot: one(lots, { fields: [documents.lotId], references: [lots.id] }),
  uploader: one(users, { fields: [documents.uploadedBy], references: [users.id] }),
}));

export const formulaRelations = relations(formulas, ({ one, many }) => ({
  workshop: one(workshops, { fields: [formulas.workshopId], references: [workshops.id] }),
  versions: many(formulaVersions),
}));

export const formulaVersionRelations = relations(formulaVersions, ({ one, many }) => ({
  formula: one(formulas, { fields: [formulaVersions.formulaId], references: [formulas.id] }),
  lines: many(formulaLines),
  releaser: one(users, { fields: [formulaVersions.releasedBy], references: [users.id] }),
}));

export const formulaLineRelations = relations(formulaLines, ({ one }) => ({
  version: one(formulaVersions, {
    fields: [formulaLines.versionId],
    references: [formulaVersions.id],
  }),
  material: one(materials, { fields: [formulaLines.materialId], references: [materials.id] }),
}));
