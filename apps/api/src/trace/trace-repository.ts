import { sql } from 'drizzle-orm';
import type { Database } from '../db/database';

/** A finished lot: a released batch (its id, lot code, product and quantity made). */
export interface FinishedLotRef {
  batchId: string;
  batchCode: string;
  formulaId: string;
  productName: string;
  madeOn: string;
  unitsMade: number | null;
}

/** A finished lot drawing on a supplier lot, with how much it drew (net of amendments). */
export interface SupplierLotUse extends FinishedLotRef {
  /** In the lot's unit; positive. */
  quantity: number;
  grams: number | null;
}

/** One delivery line of a finished lot, with its customer's contact details. */
export interface FinishedLotDelivery {
  deliveryId: string;
  deliveredOn: string;
  reference: string | null;
  customerId: string;
  customerName: string;
  email: string | null;
  phone: string | null;
  batchId: string;
  batchCode: string;
  productName: string;
  units: number;
}

/**
 * The product name a finished lot carries: its formula's product identity, else the formula's
 * name. `b` is the batches alias of the query using it; the identity is one index lookup
 * (unique workshop_id, formula_id).
 */
const productName = sql.raw(`coalesce(
  (select pi.identity->>'productName' from product_identities pi
    where pi.workshop_id = b.workshop_id and pi.formula_id = b.formula_id),
  (select f.name from formulas f where f.workshop_id = b.workshop_id and f.id = b.formula_id))`);

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** A PostgreSQL uuid[] literal of the ids that are uuids (others cannot match a row). */
function uuidArray(ids: readonly string[]): string {
  return `{${[...new Set(ids.filter((id) => UUID.test(id)))].join(',')}}`;
}

/**
 * Released batches that drew on the supplier lot, net of amendments (a batch whose amendment
 * returned the whole lot did not use it), with the quantity used, oldest first. One query: the
 * lot's movements through lot_consumptions(lot_id, batch_id), then each batch by its key.
 */
export async function supplierLotUses(
  db: Database,
  workshopId: string,
  lotId: string,
): Promise<SupplierLotUse[]> {
  if (!UUID.test(lotId)) return [];
  const result = await db.execute<{
    batchId: string;
    batchCode: string;
    formulaId: string;
    productName: string;
    madeOn: string;
    unitsMade: number | null;
    quantity: string;
    grams: string | null;
  }>(sql`
    select b.id as "batchId", b.batch_code as "batchCode", b.formula_id as "formulaId",
      ${productName} as "productName", b.made_on::text as "madeOn", b.units_made as "unitsMade",
      used.quantity::text as quantity, used.grams::text as grams
    from (
      select c.batch_id, sum(c.quantity) as quantity, sum(c.grams) as grams
      from lot_consumptions c
      where c.lot_id = ${lotId} and c.workshop_id = ${workshopId}
        and c.kind in ('batch', 'amendment') and c.batch_id is not null
      group by c.batch_id
      having sum(c.quantity) > 0
    ) used
    join batches b on b.id = used.batch_id and b.workshop_id = ${workshopId}
    where b.state = 'released'
    order by b.made_on, b.batch_code, b.id`);
  return result.rows.map((r) => ({
    ...r,
    quantity: Number(r.quantity),
    grams: r.grams === null ? null : Number(r.grams),
  }));
}

/** Released batches that drew on the supplier lot (net of amendments), oldest first. */
export async function finishedLotsUsingSupplierLot(
  db: Database,
  workshopId: string,
  lotId: string,
): Promise<FinishedLotRef[]> {
  const uses = await supplierLotUses(db, workshopId, lotId);
  return uses.map(({ batchId, batchCode, formulaId, productName, madeOn, unitsMade }) => ({
    batchId,
    batchCode,
    formulaId,
    productName,
    madeOn,
    unitsMade,
  }));
}

/**
 * Every delivery of these finished lots (one row per delivery and lot, units summed over its
 * lines), by customer name then day. One query through delivery_lines(batch_id, delivery_id).
 */
export async function deliveriesOfFinishedLots(
  db: Database,
  workshopId: string,
  batchIds: readonly string[],
): Promise<FinishedLotDelivery[]> {
  const ids = uuidArray(batchIds);
  if (ids === '{}') return [];
  const result = await db.execute<FinishedLotDelivery & Record<string, unknown>>(sql`
    select d.id as "deliveryId", d.delivered_on::text as "deliveredOn", d.reference,
      c.id as "customerId", c.name as "customerName", c.email, c.phone,
      b.id as "batchId", b.batch_code as "batchCode", ${productName} as "productName",
      sum(dl.units)::int as units
    from delivery_lines dl
    join deliveries d on d.id = dl.delivery_id and d.workshop_id = ${workshopId}
    join customers c on c.id = d.customer_id and c.workshop_id = ${workshopId}
    join batches b on b.id = dl.batch_id and b.workshop_id = ${workshopId}
    where dl.batch_id = any(${ids}::uuid[]) and dl.workshop_id = ${workshopId}
    group by d.id, c.id, b.id
    order by c.name, d.delivered_on, b.batch_code, d.id, b.id`);
  return result.rows;
}
