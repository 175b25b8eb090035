import type { ProductionSettings, WorkshopLabelDetails } from '@batchproof/shared';
import { recordAudit } from '../audit/audit-log';
import type { AuthUser } from '../auth/authenticate';
import { notFound } from '../core/app-error';
import type { Database } from '../db/database';
import * as repo from './workshop-repository';

/** The name and address labels print for the caller's workshop; the address is null until entered. */
export async function getLabelDetails(db: Database, actor: AuthUser) {
  const row = await repo.findLabelDetails(db, actor.workshopId);
  if (!row) throw notFound('That workshop');
  return row;
}

/** Sets the workshop's name and address as labels print them, and logs the change. */
export async function putLabelDetails(
  db: Database,
  actor: AuthUser,
  details: WorkshopLabelDetails,
) {
  return db.transaction(async (tx) => {
    const before = await getLabelDetails(tx, actor);
    await repo.updateLabelDetails(tx, actor.workshopId, details);
    await recordAudit(tx, actor, {
      action: 'workshop.label-details-changed',
      subjectType: 'workshop',
      subjectId: actor.workshopId,
      detail: { before, after: details },
    });
    return getLabelDetails(tx, actor);
  });
}

/** The caller's workshop's production settings (every member reads them). */
export async function getProductionSettings(db: Database, actor: AuthUser) {
  const row = await repo.findProductionSettings(db, actor.workshopId);
  if (!row) throw notFound('That workshop');
  return row;
}

/**
 * Sets the weighing tolerance new batches take, the batch code pattern and the small-business
 * answer, and logs the change with the values before and after. Batches already started keep the
 * tolerance they were started with.
 */
export async function putProductionSettings(
  db: Database,
  actor: AuthUser,
  settings: ProductionSettings,
) {
  return db.transaction(async (tx) => {
    const before = await getProductionSettings(tx, actor);
    await repo.updateProductionSettings(tx, actor.workshopId, settings);
    await recordAudit(tx, actor, {
      action: 'workshop.production-settings-changed',
      subjectType: 'workshop',
      subjectId: actor.workshopId,
      detail: { before, after: settings },
    });
    return getProductionSettings(tx, actor);
  });
}
