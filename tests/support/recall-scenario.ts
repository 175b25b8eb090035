import { randomUUID } from 'node:crypto';
import type { Database } from '../../apps/api/src/db/database';
import {
  customers,
  deliveries,
  deliveryLines,
  lotConsumptions,
} from '../../apps/api/src/db/schema';
import { buildFinishedLot, buildReleasedFormula } from './finished-lot-builder';
import { buildLot, buildMaterial } from './row-builders';
import { uniqueEmail } from './workshop-builder';

/** Inserts a customer straight into the database. */
export async function buildCustomer(
  db: Database,
  workshopId: string,
  values: { name: string; email: string | null; phone: string | null },
) {
  const [row] = await db
    .insert(customers)
    .values({ workshopId, kind: 'stockist', ...values })
    .returning();
  return row!;
}

/** Inserts a delivery of finished lots to a customer on a day. */
export async function buildDelivery(
  db: Database,
  workshopId: string,
  customerId: string,
  deliveredOn: string,
  lines: { batchId: string; units: number }[],
) {
  const [delivery] = await db
    .insert(deliveries)
    .values({ workshopId, customerId, deliveredOn })
    .returning();
  await db
    .insert(deliveryLines)
    .values(lines.map((l, i) => ({ workshopId, deliveryId: delivery!.id, position: i + 1, ...l })));
  return delivery!;
}

/**
 * A workshop's small recall world with a known answer:
 * - supplier lot `citricLot` went into finished lots `f1` (40 made) and `f2` (units not counted);
 *   `f3` (20 made) did not use it;
 * - Harbour Soap Shop (e-mail) got 12 + 6 of f1, Tideline Market Stall (phone only) 5 of f1,
 *   Kelp and Co (e-mail) 4 of f3; nobody got f2.
 * So a recall of the citric lot covers f1 and f2, reaches Harbour (18) and Tideline (5): 23 units.
 */
export async function buildRecallScenario(db: Database, workshopId: string) {
  const tag = randomUUID().slice(0, 4).toUpperCase();
  const formula = await buildReleasedFormula(db, workshopId, { name: 'Sea Glass Fizzer' });
  const citric = await buildMaterial(db, workshopId);
  const citricLot = await buildLot(db, workshopId, citric.id, { supplierLotNumber: `CA-${tag}` });
  const lot = (code: string, unitsMade: number | null, madeOn: string) =>
    buildFinishedLot(db, workshopId, {
      ...formula,
      batchCode: `${code}-${tag}`,
      unitsMade,
      madeOn,
    });
  const f1 = await lot('261101-SGF-1', 40, '2026-01-10');
  const f2 = await lot('261102-SGF-2', null, '2026-01-12');
  const f3 = await lot('261103-SGF-3', 20, '2026-01-14');
  await db.insert(lotConsumptions).values(
    [
      { batchId: f1.id, quantity: 1.2 },
      { batchId: f2.id, quantity: 0.8 },
    ].map((c) => ({
      ...c,
      workshopId,
      lotId: citricLot.id,
      kind: 'batch' as const,
      lineNumber: 1,
    })),
  );
  const harbour = await buildCustomer(db, workshopId, {
    name: 'Harbour Soap Shop',
    email: uniqueEmail('harbour'),
    phone: '01632 960001',
  });
  const tideline = await buildCustomer(db, workshopId, {
    name: 'Tideline Market Stall',
    email: null,
    phone: '07700 900123',
  });
  const kelp = await buildCustomer(db, workshopId, {
    name: 'Kelp and Co',
    email: uniqueEmail('kelp'),
    phone: null,
  });
  await buildDelivery(db, workshopId, harbour.id, '2026-02-01', [{ batchId: f1.id, units: 12 }]);
  await buildDelivery(db, workshopId, harbour.id, '2026-02-10', [{ batchId: f1.id, units: 6 }]);
  await buildDelivery(db, workshopId, tideline.id, '2026-02-03', [{ batchId: f1.id, units: 5 }]);
  await buildDelivery(db, workshopId, kelp.id, '2026-02-04', [{ batchId: f3.id, units: 4 }]);
  return { formula, citricLot, f1, f2, f3, harbour, tideline, kelp };
}

export type RecallScenario = Awaited<ReturnType<typeof buildRecallScenario>>;
