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
 * up to `limit` finished lots whose batch code or product matches, newest first. Each side is a
 * UNION of index-backed lookups (trigram indexes on lot numbers, material names and batch codes;
 * a workshop's formulas and identities are few).
 */
export async function searchTrace(db: Database, workshopId: string, q: string, limit: number) {
  const p = containsPattern(q);
  const [lotRows, batchRows] = await Promise.all([
    db.execute<{ id: string; lotNumber: string; materialName: string; receivedOn: string }>(sql`
      select l.id, l.supplier_lot_number as "lotNumber", l.material_name as "materialName",
        l.received_on::text as "receivedOn"
      from lots l
      where l.workshop_id = ${workshopId} and l.id in (
        select x.id from lots x where x.workshop_id = ${workshopId} and x.supplier_lot_number ilike ${p}
        union
        select x.id from lots x join materials m on m.id = x.material_id
        where x.workshop_id = ${workshopId} and m.workshop_id = ${workshopId} and m.trade_name ilike ${p})
      order by l.received_on desc, l.id desc
      limit ${limit}`),
    db.execute<{ batchId: string; batchCode: string; productName: string; madeOn: string }>(sql`
      select b.id as "batchId", b.batch_code as "batchCode", ${productName} as "productName",
        b.made_on::text as "madeOn"
      from batches b
      where b.workshop_id = ${workshopId} and b.state = 'released' and b.id in (
        select x.id from batches x where x.workshop_id = ${workshopId} and x.batch_code ilike ${p}
        union
        select x.id from batches x where x.workshop_id = ${workshopId} and x.formula_id in (
          select f.id from formulas f where f.workshop_id = ${workshopId} and f.name ilike ${p}
          union
          select pi.formula_id from product_identities pi
          where pi.workshop_id = ${workshopId} and pi.identity->>'productName' ilike ${p}))
      order by b.made_on desc, b.id desc
      limit ${limit}`),
  ]);
  return { supplierLots: lotRows.rows, finishedLots: batchRows.rows };
}
