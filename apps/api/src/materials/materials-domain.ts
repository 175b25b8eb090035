import {
  summariseCalibrations,
  type Material,
  type MaterialFields,
  type MaterialListItem,
  type MaterialListQuery,
  type MaterialPage,
  type MaterialsById,
} from '@batchproof/shared';
import type { AuthUser } from '../auth/authenticate';
import { AppError, notFound } from '../core/app-error';
import { withIsoDates } from '../core/list-paging';
import type { Database } from '../db/database';
import { deleteLogged, refuseWhileReferenced } from '../housekeeping/deletion';
import * as repo from './materials-repository';

/** The API shape of a stored material: ISO dates and the calibration summary. */
export function toMaterial(row: repo.MaterialRow): Material {
  return {
    ...withIsoDates(row),
    calibrationSummary: summariseCalibrations(row.calibrations),
  };
}

/**
 * A page of the caller's workshop's materials. Filtered by text, each row says whether the
 * material's own names matched or only one of its blend's components did (and which).
 */
export async function listMaterials(
  db: Database,
  actor: AuthUser,
  q: MaterialListQuery,
): Promise<MaterialPage> {
  const { items, total } = await repo.pageMaterials(db, actor.workshopId, q);
  return {
    items: items.map(({ ownMatch, matchedComponent, ...row }) => ({
      ...withIsoDates(row),
      ...matchOf(ownMatch, matchedComponent),
    })),
    total,
    page: q.page,
    pageSize: q.pageSize,
  };
}

function matchOf(
  ownMatch: boolean | null,
  component: string | null,
): Pick<MaterialListItem, 'matchedIn' | 'matchedComponent'> {
  if (ownMatch === null) return {};
  if (ownMatch) return { matchedIn: 'name' };
  return component === null
    ? { matchedIn: 'components' }
    : { matchedIn: 'components', matchedComponent: component };
}

/** One material of the caller's workshop; 404 for any other. */
export async function getMaterial(db: Database, actor: AuthUser, id: string) {
  const row = await repo.findMaterial(db, actor.workshopId, id);
  if (!row) throw notFound('That material');
  return toMaterial(row);
}

/**
 * The full records of those of `ids` that are the caller's workshop's materials. An id that is
 * not (removed, or another workshop's) is left out, never an error, so one stale id does not
 * spoil the rest.
 */
export async function getMaterials(
  db: Database,
  actor: AuthUser,
  ids: readonly string[],
): Promise<MaterialsById> {
  const rows = await repo.findMaterials(db, actor.workshopId, ids);
  return { items: rows.map(toMaterial) };
}

/** A supplier id from another workshop is a bad field, not a leak: say only that it's unknown. */
async function checkSupplier(db: Database, workshopId: string, input: MaterialFields) {
  if (input.supplierId && !(await repo.supplierExists(db, workshopId, input.supplierId))) {
    throw new AppError(400, 'validation_failed', 'Some fields need attention.', {
      supplierId: ['Choose one of this workshop’s suppliers'],
    });
  }
}

export async function createMaterial(db: Database, actor: AuthUser, input: MaterialFields) {
  await checkSupplier(db, actor.workshopId, input);
  const [id] = await repo.insertMaterials(db, actor.workshopId, [input]);
  return getMaterial(db, actor, id!);
}

export async function updateMaterial(
  db: Database,
  actor: AuthUser,
  id: string,
  input: MaterialFields,
) {
  await checkSupplier(db, actor.workshopId, input);
  if (!(await repo.updateMaterial(db, actor.workshopId, id, input)))
    throw notFound('That material');
  return getMaterial(db, actor, id);
}

/**
 * Deletes a material that no lot, formula line or document refers to (their history must stay
 * readable; such a material is archived instead), and logs the deletion.
 */
export async function deleteMaterial(db: Database, actor: AuthUser, id: string) {
  await deleteLogged(db, actor, {
    subjectType: 'material',
    label: 'That material',
    id,
    find: (tx) => repo.findMaterial(tx, actor.workshopId, id),
    check: async (tx) => {
      const uses = await repo.countMaterialUses(tx, actor.workshopId, id);
      refuseWhileReferenced('this material', [
        { count: uses.lots, one: 'lot', many: 'lots' },
        { count: uses.lines, one: 'formula line', many: 'formula lines' },
        { count: uses.documents, one: 'document', many: 'documents' },
      ]);
    },
    remove: (tx) => repo.deleteMaterial(tx, actor.workshopId, id),
    detail: (material) => ({ tradeName: material.tradeName }),
  });
}
