import type { z } from 'zod';
import type { FieldWarning, SupplierListQuery, supplierCreateSchema } from '@batchproof/shared';
import type { AuthUser } from '../auth/authenticate';
import { notFound } from '../core/app-error';
import { withIsoDates } from '../core/list-paging';
import type { Database } from '../db/database';
import { deleteLogged, refuseWhileReferenced } from '../housekeeping/deletion';
import * as repo from './suppliers-repository';

/** Supplier fields after parsing with the shared schema. */
type SupplierFields = z.output<typeof supplierCreateSchema>;

/** A page of the caller's workshop's suppliers. */
export async function listSuppliers(db: Database, actor: AuthUser, q: SupplierListQuery) {
  const { items, total } = await repo.pageSuppliers(db, actor.workshopId, q);
  return { items: items.map(withIsoDates), total, page: q.page, pageSize: q.pageSize };
}

/** One supplier of the caller's workshop; 404 for any other. */
export async function getSupplier(db: Database, actor: AuthUser, id: string) {
  const row = await repo.findSupplier(db, actor.workshopId, id);
  if (!row) throw notFound('That supplier');
  return withIsoDates(row);
}

/**
 * What the user should know about a supplier's name: another supplier of the workshop already
 * has it, ignoring case and spaces. A warning, not a refusal: two companies can share a name.
 */
async function nameWarnings(
  db: Database,
  workshopId: string,
  name: string,
  exceptId?: string,
): Promise<FieldWarning[]> {
  const [same] = await repo.suppliersNamed(db, workshopId, name, exceptId);
  if (!same) return [];
  const where = same.archivedAt ? ' (archived)' : '';
  return [
    {
      field: 'name',
      message: `Another supplier is already called “${same.name}”${where}. Check this is not the same company entered twice.`,
    },
  ];
}

/** Creates a supplier; the answer's `warnings` name a supplier with the same name. */
export async function createSupplier(db: Database, actor: AuthUser, input: SupplierFields) {
  const id = await repo.insertSupplier(db, actor.workshopId, input);
  const warnings = await nameWarnings(db, actor.workshopId, input.name, id);
  return { ...(await getSupplier(db, actor, id)), warnings };
}

/** Replaces a supplier's fields; the answer's `warnings` name a supplier with the same name. */
export async function updateSupplier(
  db: Database,
  actor: AuthUser,
  id: string,
  input: SupplierFields,
) {
  if (!(await repo.updateSupplier(db, actor.workshopId, id, input)))
    throw notFound('That supplier');
  const warnings = await nameWarnings(db, actor.workshopId, input.name, id);
  return { ...(await getSupplier(db, actor, id)), warnings };
}

/**
 * Deletes a supplier no material names (archived materials too: their history names it), and
 * logs the deletion; a supplier still named is archived instead.
 */
export async function deleteSupplier(db: Database, actor: AuthUser, id: string) {
  await deleteLogged(db, actor, {
    subjectType: 'supplier',
    label: 'That supplier',
    id,
    find: (tx) => repo.findSupplier(tx, actor.workshopId, id),
    check: (_tx, supplier) =>
      refuseWhileReferenced('this supplier', [
        { count: supplier.materialCount, one: 'material', many: 'materials' },
      ]),
    remove: (tx) => repo.deleteSupplier(tx, actor.workshopId, id),
    detail: (supplier) => ({ name: supplier.name }),
  });
}
