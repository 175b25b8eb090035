import { sql } from 'drizzle-orm';
import { containsPattern } from '../core/list-paging';
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
 * lines), by customer name then day. The lines come through delivery_lines(batch_id,
 * delivery_id); each line's delivery, customer and batch is then one key lookup. The lookups are
 * LATERAL with LIMIT 1 so the planner cannot turn them into a hash join, which reads every
 * delivery of the workshop (a full scan that grows with the years) to answer a few hundred rows.
 */
export async function deliveriesOfFinishedLots(
  db: Database,
  workshopId: string,
  batchIds: readonly string[],
): Promise<FinishedLotDelivery[]> {
  const ids = uuidArray(batchIds);
  if (ids === '{}') return [];
  const result = await db.execute<FinishedLotDelivery & Record<string, unknown>>(sql`
    select dl.delivery_id as "deliveryId", d.delivered_on::text as "deliveredOn", d.reference,
      c.id as "customerId", c.name as "customerName", c.email, c.phone,
      fl.id as "batchId", fl.batch_code as "batchCode", fl.product_name as "productName",
      dl.units
    from (
      select l.delivery_id, l.batch_id, sum(l.units)::int as units
      from delivery_lines l
      where l.batch_id = any(${ids}::uuid[]) and l.workshop_id = ${workshopId}
      group by l.delivery_id, l.batch_id
    ) dl
    cross join lateral (
      select x.delivered_on, x.reference, x.customer_id from deliveries x
      where x.id = dl.delivery_id and x.workshop_id = ${workshopId} limit 1
    ) d
    cross join lateral (
      select x.id, x.name, x.email, x.phone from customers x
      where x.id = d.customer_id and x.workshop_id = ${workshopId} limit 1
    ) c
    cross join lateral (
      select b.id, b.batch_code, ${productName} as product_name from batches b
      where b.id = dl.batch_id and b.workshop_id = ${workshopId} limit 1
    ) fl
    order by c.name, d.delivered_on, fl.batch_code, dl.delivery_id, fl.id`);
  return result.rows;
}

/** A supplier lot with its material and the material's supplier, as the trace shows it. */
export interface TraceLotRow {
  id: string;
  lotNumber: string;
  materialId: string;
  materialName: string;
  supplierId: string | null;
  supplierName: string | null;
  quantity: number;
  unit: 'g' | 'kg' | 'mL' | 'L' | 'units';
  receivedOn: string;
  expiresOn: string | null;
}

/** The columns of {@link TraceLotRow}, from lots `l`, materials `m` and suppliers `s`. */
const lotColumns =
  sql.raw(`l.id, l.supplier_lot_number as "lotNumber", l.material_id as "materialId",
  m.trade_name as "materialName", s.id as "supplierId", s.name as "supplierName",
  l.quantity::float8 as quantity, l.unit, l.received_on::text as "receivedOn",
  l.expires_on::text as "expiresOn"`);

/** One supplier lot of the workshop with its material and supplier, or undefined. */
export async function findTraceLot(
  db: Database,
  workshopId: string,
  lotId: string,
): Promise<TraceLotRow | undefined> {
  const result = await db.execute<TraceLotRow & Record<string, unknown>>(sql`
    select ${lotColumns}
    from lots l
    join materials m on m.id = l.material_id and m.workshop_id = l.workshop_id
    left join suppliers s on s.id = m.supplier_id and s.workshop_id = l.workshop_id
    where l.id = ${lotId} and l.workshop_id = ${workshopId}`);
  return result.rows[0];
}

/** A batch of the workshop (any state) with what the backward trace shows of it. */
export interface TraceBatchRow {
  batchId: string;
  batchCode: string;
  state: string;
  formulaId: string;
  productName: string;
  versionNumber: number;
  madeOn: string;
  unitsMade: number | null;
  expiresOn: string | null;
  bestBeforeMonth: string | null;
}

/** One batch of the workshop, or undefined. */
export async function findTraceBatch(
  db: Database,
  workshopId: string,
  batchId: string,
): Promise<TraceBatchRow | undefined> {
  const result = await db.execute<TraceBatchRow & Record<string, unknown>>(sql`
    select b.id as "batchId", b.batch_code as "batchCode", b.state::text as state,
      b.formula_id as "formulaId", ${productName} as "productName",
      b.version_number as "versionNumber", b.made_on::text as "madeOn",
      b.units_made as "unitsMade", b.expires_on::text as "expiresOn",
      b.best_before_month as "bestBeforeMonth"
    from batches b
    where b.id = ${batchId} and b.workshop_id = ${workshopId}`);
  return result.rows[0];
}

/** A supplier lot one line of a batch drew on, net of amendments. */
export interface BatchLotUse extends TraceLotRow {
  lineNumber: number | null;
  quantityUsed: number;
  gramsUsed: number | null;
}

/**
 * Every supplier lot each line of the batch drew on, net of amendments (a lot an amendment
 * returned entirely is left out), by line then lot number. One query through
 * lot_consumptions(batch_id, lot_id).
 */
export async function lotsUsedByBatch(
  db: Database,
  workshopId: string,
  batchId: string,
): Promise<BatchLotUse[]> {
  const result = await db.execute<BatchLotUse & Record<string, unknown>>(sql`
    select ${lotColumns}, used.line_number as "lineNumber",
      used.quantity::float8 as "quantityUsed", used.grams::float8 as "gramsUsed"
    from (
      select c.lot_id, c.line_number, sum(c.quantity) as quantity, sum(c.grams) as grams
      from lot_consumptions c
      where c.batch_id = ${batchId} and c.workshop_id = ${workshopId}
        and c.kind in ('batch', 'amendment')
      group by c.lot_id, c.line_number
      having sum(c.quantity) > 0
    ) used
    join lots l on l.id = used.lot_id and l.workshop_id = ${workshopId}
    join materials m on m.id = l.material_id and m.workshop_id = l.workshop_id
    left join suppliers s on s.id = m.supplier_id and s.workshop_id = l.workshop_id
    order by used.line_number nulls last, l.supplier_lot_number, l.id`);
  return result.rows;
}

/** A supplier document of a lot or of a material, for the backward trace. */
export interface TraceDocumentRow {
  id: string;
  kind: string;
  title: string;
  issuedOn: string;
  lotId: string | null;
  materialId: string | null;
}

/**
 * The documents on file (not archived) of these lots and of these materials, newest first. One
 * query through documents(workshop_id, lot_id) and documents(workshop_id, material_id, kind).
 */
export async function documentsOfLotsAndMaterials(
  db: Database,
  workshopId: string,
  lotIds: readonly string[],
  materialIds: readonly string[],
): Promise<TraceDocumentRow[]> {
  const lotsArray = uuidArray(lotIds);
  const materialsArray = uuidArray(materialIds);
  if (lotsArray === '{}' && materialsArray === '{}') return [];
  const result = await db.execute<TraceDocumentRow & Record<string, unknown>>(sql`
    select d.id, d.kind::text as kind, d.title, d.issued_on::text as "issuedOn",
      d.lot_id as "lotId", d.material_id as "materialId"
    from documents d
    where d.workshop_id = ${workshopId} and d.archived_at is null
      and (d.lot_id = any(${lotsArray}::uuid[]) or d.material_id = any(${materialsArray}::uuid[]))
    order by d.issued_on desc, d.title, d.id`);
  return result.rows;
}

/**
 * The picker of the trace page: up to `limit` supplier lots whose number or material matches, and
 * up to `limit` finished lots whose batch code or product matches, newest first. Each branch
 * takes its own newest `limit` through an index (trigram indexes on lot numbers, material names
 * and batch codes; batches by formula and day made), so the merge and the reads of the rows shown
 * stay small. The text matches sit behind OFFSET 0 so that they are found through the trigram
 * index: otherwise the planner may walk the whole by-day index testing each row against the
 * pattern, newest first, reading every batch for a code that matches only old ones.
 */
export async function searchTrace(db: Database, workshopId: string, q: string, limit: number) {
  const p = containsPattern(q);
  const [lotRows, batchRows] = await Promise.all([
    db.execute<{ id: string; lotNumber: string; materialName: string; receivedOn: string }>(sql`
      select hit.id, hit.supplier_lot_number as "lotNumber", hit.material_name as "materialName",
        hit.received_on::text as "receivedOn"
      from (
        (select * from (
            select l.id, l.supplier_lot_number, l.material_name, l.received_on from lots l
            where l.workshop_id = ${workshopId} and l.supplier_lot_number ilike ${p}
            offset 0
          ) l
          order by l.received_on desc, l.id desc limit ${limit})
        union
        (select l.id, l.supplier_lot_number, l.material_name, l.received_on
          from materials m
          cross join lateral (
            select l.id, l.supplier_lot_number, l.material_name, l.received_on from lots l
            where l.material_id = m.id and l.workshop_id = ${workshopId}
            order by l.received_on desc, l.id desc limit ${limit}
          ) l
          where m.workshop_id = ${workshopId} and m.trade_name ilike ${p})
      ) hit
      order by hit.received_on desc, hit.id desc
      limit ${limit}`),
    db.execute<{ batchId: string; batchCode: string; productName: string; madeOn: string }>(sql`
      select b.id as "batchId", b.batch_code as "batchCode", ${productName} as "productName",
        b.made_on::text as "madeOn"
      from (
        (select * from (
            select x.id, x.made_on from batches x
            where x.workshop_id = ${workshopId} and x.state = 'released' and x.batch_code ilike ${p}
            offset 0
          ) x
          order by x.made_on desc, x.id desc limit ${limit})
        union
        (select x.id, x.made_on
          from (
            select f.id from formulas f where f.workshop_id = ${workshopId} and f.name ilike ${p}
            union
            select pi.formula_id from product_identities pi
            where pi.workshop_id = ${workshopId} and pi.identity->>'productName' ilike ${p}
          ) product
          cross join lateral (
            select x.id, x.made_on from batches x
            where x.workshop_id = ${workshopId} and x.formula_id = product.id
              and x.state = 'released'
            order by x.made_on desc, x.id desc limit ${limit}
          ) x)
      ) hit
      join batches b on b.id = hit.id and b.workshop_id = ${workshopId}
      order by hit.made_on desc, hit.id desc
      limit ${limit}`),
  ]);
  return { supplierLots: lotRows.rows, finishedLots: batchRows.rows };
}
