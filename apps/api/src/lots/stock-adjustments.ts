import { roundTo, type StockAdjustmentFields, type StockMovement } from '@batchproof/shared';
import { recordAudit } from '../audit/audit-log';
import type { AuthUser } from '../auth/authenticate';
import { AppError, notFound } from '../core/app-error';
import type { Database } from '../db/database';
import { lockLots, stockOnHandOf } from '../batches/batches-repository';
import { findLot } from './lots-repository';
import * as repo from './stock-movements-repository';

const LOT = 'That lot';

/** An amount in a lot's unit as people read it: "3.2 kg", "12 units". */
export const lotAmount = (quantity: number, unit: string) => `${roundTo(quantity, 4)} ${unit}`;

/**
 * Records an adjustment of a lot's stock (spillage, count correction, disposal, other) with its
 * reason: in one transaction the lot row is locked (`SELECT … FOR UPDATE`, as releases and
 * amendments lock it), stock on hand is read, and an adjustment that would take it below zero is
 * refused with 409 `stock_short`. The API's quantity is negative to take stock away; the movement
 * stores it the other way round (positive = out), like every row of `lot_consumptions`.
 */
export async function adjustStock(
  db: Database,
  actor: AuthUser,
  input: StockAdjustmentFields,
): Promise<StockMovement> {
  const { workshopId } = actor;
  return db.transaction(async (tx) => {
    const lot = (await lockLots(tx, workshopId, [input.lotId])).get(input.lotId);
    if (!lot) throw notFound(LOT);
    const onHand = (await stockOnHandOf(tx, workshopId, [lot.id])).get(lot.id) ?? 0;
    if (roundTo(onHand + input.quantity, 4) < 0)
      throw new AppError(
        409,
        'stock_short',
        `Lot ${lot.supplierLotNumber} has only ${lotAmount(Math.max(0, onHand), lot.unit)} on hand: an adjustment cannot take it below zero.`,
        { quantity: [`Only ${lotAmount(Math.max(0, onHand), lot.unit)} on hand`] },
      );
    const id = await repo.insertAdjustment(tx, {
      workshopId,
      lotId: lot.id,
      quantity: -input.quantity,
      reason: input.reason,
      note: input.note,
      createdBy: actor.id,
    });
    await recordAudit(tx, actor, {
      action: 'lot.stock-adjusted',
      subjectType: 'lot',
      subjectId: lot.id,
      detail: {
        supplierLotNumber: lot.supplierLotNumber,
        quantity: input.quantity,
        unit: lot.unit,
        reason: input.reason,
        note: input.note,
        stockBefore: onHand,
        stockAfter: roundTo(onHand + input.quantity, 4),
      },
    });
    const [movement] = await repo.findMovements(tx, workshopId, lot.id, id);
    return movement!;
  });
}

/**
 * Every stock movement of a lot of the caller's workshop, newest first: batch releases,
 * adjustments and amendments, with the batch code where a batch moved it and who recorded it.
 */
export async function listStockMovements(
  db: Database,
  actor: AuthUser,
  lotId: string,
): Promise<StockMovement[]> {
  if (!(await findLot(db, actor.workshopId, lotId))) throw notFound(LOT);
  return repo.findMovements(db, actor.workshopId, lotId);
}
