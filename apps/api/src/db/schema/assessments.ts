import { sql } from 'drizzle-orm';
import {
  boolean,
  date,
  index,
  jsonb,
  pgEnum,
  pgTable,
  text,
  timestamp,
  uniqueIndex,
  uuid,
} from 'drizzle-orm/pg-core';
import {
  ASSESSMENT_STATUSES,
  MARKET_RECORD_KINDS,
  type ExposureInput,
  type PartB,
  type SafetyNotes,
  type SafetyPacket,
  type SubstanceInput,
} from '@batchproof/shared';
import { id, timestamps, workshopKey, workshopReference } from './columns';
import { formulas, formulaVersions } from './formulas';
import { members } from './users';
import { workshops } from './workshops';

export const assessmentStatusEnum = pgEnum('assessment_status', ASSESSMENT_STATUSES);
export const marketRecordKindEnum = pgEnum('market_record_kind', MARKET_RECORD_KINDS);

/** The maker's notes for Annex I Part A items 2–5, one row per formula version. */
export const safetyNotes = pgTable(
  'safety_notes',
  {
    id: id(),
    workshopId: uuid()
      .notNull()
      .references(() => workshops.id, { onDelete: 'cascade' }),
    versionId: uuid().notNull(),
    notes: jsonb().$type<SafetyNotes>().notNull(),
    updatedBy: uuid(),
    ...timestamps,
  },
  (t) => [
    uniqueIndex('safety_notes_version_key').on(t.workshopId, t.versionId),
    workshopKey('safety_notes', t),
    workshopReference(
      'safety_notes_version_fk',
      { workshopId: t.workshopId, column: t.versionId },
      formulaVersions,
      'cascade',
    ),
    workshopReference(
      'safety_notes_updated_by_fk',
      { workshopId: t.workshopId, column: t.updatedBy },
      members,
      'set null',
    ),
  ],
);

/**
 * One formula version shared with one assessor member. Unsharing sets `revokedAt`: the assessor
 * no longer sees the version (nor a draft assessment of it); a signed assessment stays on record
 * for the maker.
 */
export const assessmentShares = pgTable(
  'assessment_shares',
  {
    id: id(),
    workshopId: uuid()
      .notNull()
      .references(() => workshops.id, { onDelete: 'cascade' }),
    versionId: uuid().notNull(),
    assessorId: uuid().notNull(),
    sharedBy: uuid(),
    revokedAt: timestamp({ withTimezone: true }),
    ...timestamps,
  },
  (t) => [
    uniqueIndex('assessment_shares_live_key')
      .on(t.workshopId, t.versionId, t.assessorId)
      .where(sql`${t.revokedAt} IS NULL`),
    index('assessment_shares_assessor_idx').on(t.workshopId, t.assessorId),
    workshopKey('assessment_shares', t),
    workshopReference(
      'assessment_shares_version_fk',
      { workshopId: t.workshopId, column: t.versionId },
      formulaVersions,
      'cascade',
    ),
    workshopReference(
      'assessment_shares_assessor_fk',
      { workshopId: t.workshopId, column: t.assessorId },
      members,
      'cascade',
    ),
    workshopReference(
      'assessment_shares_shared_by_fk',
      { workshopId: t.workshopId, column: t.sharedBy },
      members,
      'set null',
    ),
  ],
);

/**
 * The assessment of one formula version (one per version). The assessor's inputs and Part B are
 * kept as typed; signing stores who, when, the SHA-256 of the packet content and the packet as
 * signed, after which a trigger refuses any change (a workshop's own deletion still cascades).
 */
export const assessments = pgTable(
  'assessments',
  {
    id: id(),
    workshopId: uuid()
      .notNull()
      .references(() => workshops.id, { onDelete: 'cascade' }),
    versionId: uuid().notNull(),
    shareId: uuid(),
    assessorId: uuid(),
    /** The assessor's name when the assessment was started, kept if they leave the workshop. */
    assessorName: text().notNull(),
    status: assessmentStatusEnum().notNull().default('draft'),
    exposure: jsonb().$type<ExposureInput | null>(),
    substances: jsonb().$type<SubstanceInput[]>().notNull().default([]),
    partB: jsonb().$type<PartB>().notNull(),
    signedAt: timestamp({ withTimezone: true }),
    signedBy: uuid(),
    signedByName: text(),
    /** SHA-256 (hex) of the packet content signed. */
    contentHash: text(),
    /** The packet as signed, so the signed PDF shows exactly what the hash covers. */
    signedPacket: jsonb().$type<SafetyPacket>(),
    ...timestamps,
  },
  (t) => [
    uniqueIndex('assessments_version_key').on(t.workshopId, t.versionId),
    index('assessments_workshop_updated_idx').on(t.workshopId, t.updatedAt),
    workshopKey('assessments', t),
    workshopReference(
      'assessments_version_fk',
      { workshopId: t.workshopId, column: t.versionId },
      formulaVersions,
      'restrict',
    ),
    workshopReference(
      'assessments_share_fk',
      { workshopId: t.workshopId, column: t.shareId },
      assessmentShares,
      'set null',
    ),
    workshopReference(
      'assessments_assessor_fk',
      { workshopId: t.workshopId, column: t.assessorId },
      members,
      'set null',
    ),
    workshopReference(
      'assessments_signed_by_fk',
      { workshopId: t.workshopId, column: t.signedBy },
      members,
      'set null',
    ),
  ],
);

/**
 * References the maker records per product and kind (EU and UK notification, US listing and
 * safety substantiation, Canada's notification form), one row per formula and kind.
 */
export const marketRecords = pgTable(
  'market_records',
  {
    id: id(),
    workshopId: uuid()
      .notNull()
      .references(() => workshops.id, { onDelete: 'cascade' }),
    formulaId: uuid().notNull(),
    kind: marketRecordKindEnum().notNull(),
    reference: text(),
    recordedOn: date({ mode: 'string' }),
    firstSaleOn: date({ mode: 'string' }),
    smallBusinessExempt: boolean(),
    notes: text(),
    updatedBy: uuid(),
    ...timestamps,
  },
  (t) => [
    uniqueIndex('market_records_formula_kind_key').on(t.workshopId, t.formulaId, t.kind),
    workshopKey('market_records', t),
    workshopReference(
      'market_records_formula_fk',
      { workshopId: t.workshopId, column: t.formulaId },
      formulas,
      'cascade',
    ),
    workshopReference(
      'market_records_updated_by_fk',
      { workshopId: t.workshopId, column: t.updatedBy },
      members,
      'set null',
    ),
  ],
);
