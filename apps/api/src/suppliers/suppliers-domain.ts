import type { z } from 'zod';
import type { SupplierListQuery, supplierCreateSchema } from '@batchproof/shared';
import type { AuthUser } from '../auth/authenticate';
import { notFound } from '../core/app-error';
import { withIsoDates } from '../core/list-paging';
import type { Database } from '../db/database';
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

export async function createSupplier(db: Database, actor: AuthUser, input: SupplierFields) {
  const id = await repo.insertSupplier(db, actor.workshopId, input);
  return getSupplier(db, actor, id);
}

export async function updateSupplier(
  db: Database,
  actor: AuthUser,
  id: string,
  input: SupplierFields,
) {
  if (!(await repo.updateSupplier(db, actor.workshopId, id, input)))
    throw notFound('That supplier');
  return getSupplier(db, actor, id);
}

/** Deletes a supplier; its materials stay and simply lose the link. */
export async function deleteSupplier(db: Database, actor: AuthUser, id: string) {
  if (!(await repo.deleteSupplier(db, actor.workshopId, id))) throw notFound('That supplier');
}
