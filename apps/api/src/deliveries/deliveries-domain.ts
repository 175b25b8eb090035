import { unitsLeftMessage, type DeliveryFields, type DeliveryListQuery } from '@batchproof/shared';
import { recordAudit } from '../audit/audit-log';
import type { AuthUser } from '../auth/authenticate';
import { AppError, notFound } from '../core/app-error';
import { withIsoDates } from '../core/list-paging';
import type { Database } from '../db/database';
import * as repo from './deliveries-repository';

const LABEL = 'That delivery';

/** Rows of deliveries with their lines attached, as the delivery contract has them. */
async function withLines<R extends { id: string; createdAt: Date; updatedAt: Date }>(
  db: Database,
  workshopId: string,
  rows: R[],
) {
  const lines = await repo.linesOf(
    db,
    workshopId,
    rows.map((r) => r.id),
  );
  return rows.map((row) => ({
    ...withIsoDates(row),
    lines: lines
      .filter((l) => l.deliveryId === row.id)
      .map(({ deliveryId: _deliveryId, ...line }) => line),
  }));
}

/** A page of the caller's workshop's deliveries, each with its lines. */
export async function listDeliveries(db: Database, actor: AuthUser, q: DeliveryListQuery) {
  const { items, total } = await repo.pageDeliveries(db, actor.workshopId, q);
  return {
    items: await withLines(db, actor.workshopId, items),
    total,
    page: q.page,
    pageSize: q.pageSize,
  };
}

/** One delivery of the caller's workshop; 404 for any other. */
export async function getDelivery(db: Database, actor: AuthUser, id: string) {
  const row = await repo.findDelivery(db, actor.workshopId, id);
  if (!row) throw notFound(LABEL);
  const [delivery] = await withLines(db, actor.workshopId, [row]);
  return delivery!;
}

/** The refusal of a delivery whose fields do not hold against the workshop's records. */
const fieldsRefused = (fieldErrors: Record<string, string[]>) =>
  new AppError(400, 'validation_failed', 'Some fields need attention.', fieldErrors);

/**
 * The finished lots of these codes, locked for the rest of the transaction, with the units of each
 * still to deliver (units made less units on other deliveries; null when units made is unknown).
 */
export async function finishedLotsLeft(
  db: Database,
  workshopId: string,
  lotCodes: string[],
  exceptDeliveryId?: string,
) {
  const lots = await repo.lockReleasedLots(db, workshopId, [...new Set(lotCodes)]);
  const delivered = await repo.deliveredUnits(
    db,
    workshopId,
    lots.map((l) => l.id),
    exceptDeliveryId,
  );
  return new Map(
    lots.map((lot) => [
      lot.batchCode,
      {
        id: lot.id,
        left: lot.unitsMade === null ? null : lot.unitsMade - (delivered.get(lot.id) ?? 0),
      },
    ]),
  );
}

/**
 * Checks a delivery against the workshop: its customer is one of the workshop's, each line's lot
 * code is a released batch's, and no lot goes past its units made over all its deliveries. Answers
 * the stored values, or throws 400 with `customerId`, `lines.N.lotCode` or `lines.N.units`.
 */
async function checkDelivery(
  db: Database,
  workshopId: string,
  input: DeliveryFields,
  exceptDeliveryId?: string,
): Promise<repo.DeliveryValues> {
  const fieldErrors: Record<string, string[]> = {};
  if (!(await repo.customerExists(db, workshopId, input.customerId)))
    fieldErrors['customerId'] = ['Choose one of this workshop’s customers'];
  const lots = await finishedLotsLeft(
    db,
    workshopId,
    input.lines.map((l) => l.lotCode),
    exceptDeliveryId,
  );
  const lines = input.lines.map((line, index) => {
    const lot = lots.get(line.lotCode);
    if (!lot) {
      fieldErrors[`lines.${index}.lotCode`] = [`No released batch has lot code ${line.lotCode}`];
    } else if (lot.left !== null && line.units > lot.left) {
      fieldErrors[`lines.${index}.units`] = [unitsLeftMessage(line.lotCode, lot.left)];
    }
    return { batchId: lot?.id ?? '', units: line.units };
  });
  if (Object.keys(fieldErrors).length > 0) throw fieldsRefused(fieldErrors);
  const { customerId, deliveredOn, reference, notes } = input;
  return { customerId, deliveredOn, reference, notes, lines };
}

/** What the audit log keeps of a delivery. */
const auditDetail = (delivery: {
  deliveredOn: string;
  reference: string | null;
  lines: { lotCode: string; units: number }[];
}) => ({
  deliveredOn: delivery.deliveredOn,
  reference: delivery.reference,
  lines: delivery.lines.map((l) => ({ lotCode: l.lotCode, units: l.units })),
});

/** Records a delivery, checked and logged in one transaction. */
export async function createDelivery(db: Database, actor: AuthUser, input: DeliveryFields) {
  return db.transaction(async (tx) => {
    const values = await checkDelivery(tx, actor.workshopId, input);
    const id = await insertLogged(tx, actor, values, input);
    return getDelivery(tx, actor, id);
  });
}

/** Inserts a checked delivery and logs its creation (`via` says when an import made it). */
export async function insertLogged(
  db: Database,
  actor: AuthUser,
  values: repo.DeliveryValues,
  input: DeliveryFields,
  via?: 'import',
) {
  const id = await repo.insertDelivery(db, actor.workshopId, actor.id, values);
  await recordAudit(db, actor, {
    action: 'create',
    subjectType: 'delivery',
    subjectId: id,
    detail: { ...auditDetail(input), ...(via ? { via } : {}) },
  });
  return id;
}

/** Replaces a delivery's fields and lines, checked and logged in one transaction. */
export async function updateDelivery(
  db: Database,
  actor: AuthUser,
  id: string,
  input: DeliveryFields,
) {
  return db.transaction(async (tx) => {
    if (!(await repo.findDelivery(tx, actor.workshopId, id))) throw notFound(LABEL);
    const values = await checkDelivery(tx, actor.workshopId, input, id);
    await repo.updateDelivery(tx, actor.workshopId, id, values);
    await recordAudit(tx, actor, {
      action: 'update',
      subjectType: 'delivery',
      subjectId: id,
      detail: auditDetail(input),
    });
    return getDelivery(tx, actor, id);
  });
}

/** Deletes a delivery and its lines, and logs what it was. */
export async function deleteDelivery(db: Database, actor: AuthUser, id: string) {
  await db.transaction(async (tx) => {
    const before = await getDelivery(tx, actor, id);
    await repo.deleteDelivery(tx, actor.workshopId, id);
    await recordAudit(tx, actor, {
      action: 'delete',
      subjectType: 'delivery',
      subjectId: id,
      detail: { customerName: before.customerName, ...auditDetail(before) },
    });
  });
}
