import {
  lotCreateSchema,
  materialCreateSchema,
  supplierCreateSchema,
  type LotCreate,
  type MaterialCreate,
  type SupplierCreate,
} from '@batchproof/shared';
import type { Database } from '../../apps/api/src/db/database';
import { lotConsumptions, lots, materials, suppliers } from '../../apps/api/src/db/schema';
import { aLot } from '../../fixtures/builders/lot-builder';
import { aMaterial, aSupplier } from '../../fixtures/builders/material-builder';

// Rows inserted straight into the database (no route) for setting up a test, each validated by
// the shared schema first. The bodies come from the plain builders in fixtures/builders.

/** Inserts a supplier. */
export async function buildSupplier(
  db: Database,
  workshopId: string,
  overrides: Partial<SupplierCreate> = {},
) {
  const [row] = await db
    .insert(suppliers)
    .values({ ...supplierCreateSchema.parse(aSupplier(overrides)), workshopId })
    .returning();
  return row!;
}

/** Inserts a material. */
export async function buildMaterial(
  db: Database,
  workshopId: string,
  body: MaterialCreate = aMaterial(),
) {
  const [row] = await db
    .insert(materials)
    .values({ ...materialCreateSchema.parse(body), workshopId })
    .returning();
  return row!;
}

/** Inserts a lot of a material. */
export async function buildLot(
  db: Database,
  workshopId: string,
  materialId: string,
  overrides: Partial<LotCreate> = {},
) {
  const [row] = await db
    .insert(lots)
    .values({ ...lotCreateSchema.parse(aLot(materialId, overrides)), workshopId })
    .returning();
  return row!;
}

/** Takes `quantity` (in the lot's unit) out of a lot, as a count correction. */
export async function consumeFromLot(
  db: Database,
  workshopId: string,
  lotId: string,
  quantity: number,
) {
  await db.insert(lotConsumptions).values({
    workshopId,
    lotId,
    quantity,
    kind: 'adjustment',
    reason: 'count-correction',
  });
}
