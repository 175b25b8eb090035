import { sql } from 'drizzle-orm';
import {
  check,
  date,
  index,
  integer,
  numeric,
  pgEnum,
  pgTable,
  text,
  timestamp,
  uuid,
} from 'drizzle-orm/pg-core';
import { LOT_UNITS } from '@batchproof/shared';
import { id, timestamps, workshopKey, workshopReference } from './columns';
import { batches, stockAdjustmentReasonEnum, stockMovementKindEnum } from './batches';
import { materials } from './materials';
import { members } from './users';
import { workshops } from './workshops';

export const lotUnitEnum = pgEnum('lot_unit', LOT_UNITS);

/** Goods-in: one supplier lot of a material as received. */
export const lots = pgTable(
  'lots',
  {
    id: id(),
    workshopId: uuid()
      .notNull()
      .references(() => workshops.id, { onDelete: 'cascade' }),
    // Restrict: a material with stock history must not vanish from under its lots.
    materialId: uuid().notNull(),
    /**
     * The material's trade name, copied so that the lots list sorts by it through an index (a sort
     * on the joined table reads every lot). Kept by database triggers (migration 0009), in the
     * writing transaction: set from the material on insert and on a change of material, and
     * rewritten when the material is renamed. The default only lets inserts leave it out.
     */
    materialName: text().notNull().default(''),
    supplierLotNumber: text().notNull(),
    quantity: numeric({ precision: 16, scale: 4, mode: 'number' }).notNull(),
    unit: lotUnitEnum().notNull(),
    receivedOn: date({ mode: 'string' }).notNull(),
    expiresOn: date({ mode: 'string' }),
    unitCost: numeric({ precision: 14, scale: 4, mode: 'number' }),
    notes: text(),
    ...timestamps,
  },
  (t) => [
    check(
      'lots_expiry_after_receipt',
      sql`${t.expiresOn} is null or ${t.expiresOn} >= ${t.receivedOn}`,
    ),
    check('lots_quantity_positive', sql`${t.quantity} > 0`),
    index('lots_workshop_received_idx').on(t.workshopId, t.receivedOn, t.id),
    index('lots_workshop_expires_idx').on(t.workshopId, t.expiresOn, t.id),
    index('lots_workshop_lot_number_idx').on(t.workshopId, t.supplierLotNumber, t.id),
    index('lots_workshop_quantity_idx').on(t.workshopId, t.quantity, t.id),
    index('lots_workshop_created_idx').on(t.workshopId, t.createdAt, t.id),
    index('lots_material_idx').on(t.materialId, t.receivedOn),
    index('lots_workshop_material_name_idx').on(t.workshopId, t.materialName, t.id),
    // Trigram index (pg_trgm, migration 0003) so "lot number contains …" avoids a full scan.
    index('lots_lot_number_trgm_idx').using('gin', sql`${t.supplierLotNumber} gin_trgm_ops`),
    workshopKey('lots', t),
    workshopReference(
      'lots_material_fk',
      { workshopId: t.workshopId, column: t.materialId },
      materials,
      'restrict',
    ),
  ],
);

/**
 * Stock taken out of a lot (positive) or put back (negative), in the lot's unit: a batch's
 * release (`kind` batch, with the batch and its line), an adjustment with its reason (spillage,
 * count correction, disposal), or an amendment's correction of a released batch's lot picks.
 * Stock on hand is always the lot's quantity minus the sum of these rows, never a stored counter;
 * writers lock the lot row (`SELECT … FOR UPDATE`) before they check and insert, so concurrent
 * releases can never take a lot below zero.
 */
export const lotConsumptions = pgTable(
  'lot_consumptions',
  {
    id: id(),
    workshopId: uuid()
      .notNull()
      .references(() => workshops.id, { onDelete: 'cascade' }),
    lotId: uuid().notNull(),
    quantity: numeric({ precision: 16, scale: 4, mode: 'number' }).notNull(),
    kind: stockMovementKindEnum().notNull().default('batch'),
    /** The batch that consumed it (kind batch or amendment). */
    batchId: uuid(),
    /** The batch's line (1-based) the lot was weighed for. */
    lineNumber: integer(),
    /** The same amount in grams, as weighed (batch and amendment rows). */
    grams: numeric({ precision: 18, scale: 6, mode: 'number' }),
    reason: stockAdjustmentReasonEnum(),
    consumedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    note: text(),
    createdBy: uuid(),
    ...timestamps,
  },
  (t) => [
    index('lot_consumptions_lot_idx').on(t.lotId, t.batchId),
    index('lot_consumptions_batch_idx').on(t.batchId, t.lotId),
    index('lot_consumptions_workshop_idx').on(t.workshopId),
    check(
      'lot_consumptions_batch_rows_name_batch',
      sql`${t.kind} = 'adjustment' or ${t.batchId} is not null`,
    ),
    check(
      'lot_consumptions_adjustments_have_reason',
      sql`${t.kind} <> 'adjustment' or ${t.reason} is not null`,
    ),
    workshopKey('lot_consumptions', t),
    workshopReference(
      'lot_consumptions_lot_fk',
      { workshopId: t.workshopId, column: t.lotId },
      lots,
      'restrict',
    ),
    workshopReference(
      'lot_consumptions_batch_fk',
      { workshopId: t.workshopId, column: t.batchId },
      batches,
      'restrict',
    ),
    workshopReference(
      'lot_consumptions_created_by_fk',
      { workshopId: t.workshopId, column: t.createdBy },
      members,
      'set null',
    ),
  ],
);
