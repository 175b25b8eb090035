import type { FieldWarning, LotFields, LotListQuery } from '@batchproof/shared';
import { recordAudit } from '../audit/audit-log';
import type { AuthUser } from '../auth/authenticate';
import { AppError, conflict, notFound } from '../core/app-error';
import { withIsoDates } from '../core/list-paging';
import type { Database } from '../db/database';
import * as repo from './lots-repository';

/** A page of the caller's workshop's lots with stock on hand. */
export async function listLots(db: Database, actor: AuthUser, q: LotListQuery) {
  const { items, total } = await repo.pageLots(db, actor.workshopId, q);
  return { items: items.map(withIsoDates), total, page: q.page, pageSize: q.pageSize };
}

/** One lot of the caller's workshop; 404 for any other. */
export async function getLot(db: Database, actor: AuthUser, id: string) {
  const row = await repo.findLot(db, actor.workshopId, id);
  if (!row) throw notFound('That lot');
  return withIsoDates(row);
}

async function checkMaterial(db: Database, workshopId: string, input: LotFields) {
  if (!(await repo.materialExists(db, workshopId, input.materialId))) {
    throw new AppError(400, 'validation_failed', 'Some fields need attention.', {
      materialId: ['Choose one of this workshop’s materials'],
    });
  }
}

/**
 * What the user should know about a lot number: the material already has a lot with it
 * (ignoring case and spaces). A warning, not a refusal: a supplier may reuse a number.
 */
async function lotNumberWarnings(
  db: Database,
  workshopId: string,
  input: LotFields,
  exceptId: string,
): Promise<FieldWarning[]> {
  const same = await repo.lotsNumbered(
    db,
    workshopId,
    input.materialId,
    input.supplierLotNumber,
    exceptId,
  );
  if (same.length === 0) return [];
  const days = same.map((l) => l.receivedOn).join(', ');
  return [
    {
      field: 'supplierLotNumber',
      message: `This material already has lot ${input.supplierLotNumber}, received ${days}. Check this is not the same delivery entered twice.`,
    },
  ];
}

/**
 * Records goods-in. The read-back shares the insert's transaction: if it fails, no lot is left.
 * The answer's `warnings` name a lot of the material with the same number.
 */
export async function createLot(db: Database, actor: AuthUser, input: LotFields) {
  return db.transaction(async (tx) => {
    await checkMaterial(tx, actor.workshopId, input);
    const id = await repo.insertLot(tx, actor.workshopId, input);
    await recordAudit(tx, actor, {
      action: 'lot.received',
      subjectType: 'lot',
      subjectId: id,
      detail: lotDetail(input),
    });
    const warnings = await lotNumberWarnings(tx, actor.workshopId, input, id);
    return { ...(await getLot(tx, actor, id)), warnings };
  });
}

/**
 * Updates a lot. The received quantity may not drop below what batches already consumed, or
 * stock on hand would go negative.
 */
export async function updateLot(db: Database, actor: AuthUser, id: string, input: LotFields) {
  return db.transaction(async (tx) => {
    if (!(await repo.findLot(tx, actor.workshopId, id))) throw notFound('That lot');
    await checkMaterial(tx, actor.workshopId, input);
    const consumed = await repo.consumedQuantity(tx, actor.workshopId, id);
    if (input.quantity < consumed) {
      throw conflict(`Batches already used ${consumed} of this lot.`, {
        quantity: [`The quantity cannot be less than the ${consumed} already used`],
      });
    }
    await repo.updateLot(tx, actor.workshopId, id, input);
    await recordAudit(tx, actor, {
      action: 'lot.changed',
      subjectType: 'lot',
      subjectId: id,
      detail: lotDetail(input),
    });
    const warnings = await lotNumberWarnings(tx, actor.workshopId, input, id);
    return { ...(await getLot(tx, actor, id)), warnings };
  });
}

/** What the audit log keeps of goods-in: the lot as entered. */
const lotDetail = (input: LotFields) => ({
  supplierLotNumber: input.supplierLotNumber,
  quantity: input.quantity,
  unit: input.unit,
  receivedOn: input.receivedOn,
  expiresOn: input.expiresOn,
});

/** Deletes a lot no batch has drawn from. */
export async function deleteLot(db: Database, actor: AuthUser, id: string) {
  if (!(await repo.findLot(db, actor.workshopId, id))) throw notFound('That lot');
  if ((await repo.consumedQuantity(db, actor.workshopId, id)) > 0) {
    throw conflict('Batches have used this lot; it cannot be deleted.');
  }
  await db.transaction(async (tx) => {
    await repo.deleteLot(tx, actor.workshopId, id);
    await recordAudit(tx, actor, { action: 'lot.deleted', subjectType: 'lot', subjectId: id });
  });
}
