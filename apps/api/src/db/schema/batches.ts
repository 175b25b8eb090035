import { sql } from 'drizzle-orm';
import {
  date,
  index,
  integer,
  jsonb,
  numeric,
  pgEnum,
  pgTable,
  text,
  timestamp,
  uniqueIndex,
  uuid,
} from 'drizzle-orm/pg-core';
import {
  BATCH_STATES,
  STOCK_ADJUSTMENT_REASONS,
  type BatchRecordFields,
  type LotPickRecord,
  type WeighSheetLineRecord,
} from '@batchproof/shared';
import { id, timestamps, workshopKey, workshopReference } from './columns';
import { formulaLines, formulas, formulaVersions } from './formulas';
import { materials } from './materials';
import { members } from './users';
import { workshops } from './workshops';

export const batchStateEnum = pgEnum('batch_state', BATCH_STATES);

/** The weigh sheet a batch was started with: lines, suggested lot picks, the rounding sum. */
export interface BatchSheet {
  lines: (WeighSheetLineRecord & {
    suggestedPicks: {
      status: 'single' | 'split' | 'short' | 'none';
      picks: LotPickRecord[];
      shortGrams: number;
      split: LotPickRecord[] | null;
      notes: string[];
    };
  })[];
  sum: {
    batchGrams: number;
    roundedGrams: number;
    differenceGrams: number;
    withinRounding: boolean;
  };
  notes: string[];
}

/**
 * A batch made from one released formula version; once released it is also the finished lot
 * (its batch code is the lot code on the labels, its units made the lot's quantity). A database
 * trigger (migration 0014) refuses any change to a released batch's record: corrections are
 * `batch_amendments`, and only the effective columns (`ready_on`, `units_made`) follow them.
 */
export const batches = pgTable(
  'batches',
  {
    id: id(),
    workshopId: uuid()
      .notNull()
      .references(() => workshops.id, { onDelete: 'cascade' }),
    formulaId: uuid().notNull(),
    versionId: uuid().notNull(),
    versionNumber: integer().notNull(),
    batchCode: text().notNull(),
    /** The sequence number the code was made with ({SEQ}), per workshop and day made. */
    sequence: integer().notNull(),
    state: batchStateEnum().notNull().default('draft'),
    madeOn: date({ mode: 'string' }).notNull(),
    units: integer(),
    unitMassGrams: numeric({ precision: 18, scale: 6, mode: 'number' }),
    targetGrams: numeric({ precision: 18, scale: 6, mode: 'number' }).notNull(),
    lossPercent: numeric({ precision: 6, scale: 3, mode: 'number' }).notNull(),
    batchGrams: numeric({ precision: 18, scale: 6, mode: 'number' }).notNull(),
    /** The workshop's tolerance when the batch was started. */
    tolerancePercent: numeric({ precision: 5, scale: 2, mode: 'number' }).notNull(),
    sheet: jsonb().$type<BatchSheet>().notNull(),
    /** What production recorded (lines with used material, lot picks and weights; conditions; checks). */
    record: jsonb().$type<BatchRecordFields>().notNull(),
    /** Effective (after amendments) day the batch is ready, for the home page and lists. */
    readyOn: date({ mode: 'string' }),
    /** Effective (after amendments) units made: the finished lot's quantity. */
    unitsMade: integer(),
    bestBeforeMonth: text(),
    expiresOn: date({ mode: 'string' }),
    periodAfterOpeningMonths: integer(),
    createdBy: uuid(),
    releasedAt: timestamp({ withTimezone: true }),
    releasedBy: uuid(),
    ...timestamps,
  },
  (t) => [
    uniqueIndex('batches_workshop_code_key').on(t.workshopId, t.batchCode),
    index('batches_workshop_made_idx').on(t.workshopId, t.madeOn, t.id),
    index('batches_workshop_state_ready_idx').on(t.workshopId, t.state, t.readyOn),
    index('batches_workshop_created_idx').on(t.workshopId, t.createdAt, t.id),
    index('batches_formula_idx').on(t.workshopId, t.formulaId, t.madeOn),
    index('batches_code_trgm_idx').using('gin', sql`${t.batchCode} gin_trgm_ops`),
    workshopKey('batches', t),
    workshopReference(
      'batches_formula_fk',
      { workshopId: t.workshopId, column: t.formulaId },
      formulas,
      'restrict',
    ),
    workshopReference(
      'batches_version_fk',
      { workshopId: t.workshopId, column: t.versionId },
      formulaVersions,
      'restrict',
    ),
    workshopReference(
      'batches_created_by_fk',
      { workshopId: t.workshopId, column: t.createdBy },
      members,
      'set null',
    ),
    workshopReference(
      'batches_released_by_fk',
      { workshopId: t.workshopId, column: t.releasedBy },
      members,
      'set null',
    ),
  ],
);

/** A correction to a released batch: the field, its value before and after, and why. */
export const batchAmendments = pgTable(
  'batch_amendments',
  {
    id: id(),
    workshopId: uuid()
      .notNull()
      .references(() => workshops.id, { onDelete: 'cascade' }),
    batchId: uuid().notNull(),
    field: text().notNull(),
    previousValue: jsonb().$type<unknown>(),
    value: jsonb().$type<unknown>(),
    reason: text().notNull(),
    amendedBy: uuid(),
    ...timestamps,
  },
  (t) => [
    index('batch_amendments_batch_idx').on(t.batchId, t.createdAt),
    workshopKey('batch_amendments', t),
    workshopReference(
      'batch_amendments_batch_fk',
      { workshopId: t.workshopId, column: t.batchId },
      batches,
      'restrict',
    ),
    workshopReference(
      'batch_amendments_amended_by_fk',
      { workshopId: t.workshopId, column: t.amendedBy },
      members,
      'set null',
    ),
  ],
);

/** An approved alternative material for one formula line, checked by the engine like the line's own. */
export const formulaLineSubstitutes = pgTable(
  'formula_line_substitutes',
  {
    id: id(),
    workshopId: uuid()
      .notNull()
      .references(() => workshops.id, { onDelete: 'cascade' }),
    lineId: uuid().notNull(),
    materialId: uuid().notNull(),
    position: integer().notNull(),
    ...timestamps,
  },
  (t) => [
    uniqueIndex('formula_line_substitutes_key').on(t.lineId, t.materialId),
    index('formula_line_substitutes_material_idx').on(t.workshopId, t.materialId),
    workshopKey('formula_line_substitutes', t),
    workshopReference(
      'formula_line_substitutes_line_fk',
      { workshopId: t.workshopId, column: t.lineId },
      formulaLines,
      'cascade',
    ),
    workshopReference(
      'formula_line_substitutes_material_fk',
      { workshopId: t.workshopId, column: t.materialId },
      materials,
      'restrict',
    ),
  ],
);

export const stockMovementKindEnum = pgEnum('stock_movement_kind', [
  'batch',
  'adjustment',
  'amendment',
]);
export const stockAdjustmentReasonEnum = pgEnum(
  'stock_adjustment_reason',
  STOCK_ADJUSTMENT_REASONS,
);
