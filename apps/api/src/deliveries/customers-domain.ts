import type { CustomerFields, CustomerListQuery, FieldWarning } from '@batchproof/shared';
import { recordAudit } from '../audit/audit-log';
import type { AuthUser } from '../auth/authenticate';
import { notFound } from '../core/app-error';
import { withIsoDates } from '../core/list-paging';
import type { Database } from '../db/database';
import { deleteLogged, refuseWhileReferenced } from '../housekeeping/deletion';
import * as repo from './customers-repository';

const LABEL = 'That customer';

/** A page of the caller's workshop's customers, each with how many deliveries name it. */
export async function listCustomers(db: Database, actor: AuthUser, q: CustomerListQuery) {
  const { items, total } = await repo.pageCustomers(db, actor.workshopId, q);
  return { items: items.map(withIsoDates), total, page: q.page, pageSize: q.pageSize };
}

/** One customer of the caller's workshop; 404 for any other. */
export async function getCustomer(db: Database, actor: AuthUser, id: string) {
  const row = await repo.findCustomer(db, actor.workshopId, id);
  if (!row) throw notFound(LABEL);
  return withIsoDates(row);
}

/**
 * Another customer of the workshop already has the name, ignoring case and spaces. A warning,
 * not a refusal: two shops can share a name in different towns.
 */
async function nameWarnings(
  db: Database,
  workshopId: string,
  name: string,
  exceptId: string,
): Promise<FieldWarning[]> {
  const [same] = await repo.customersNamed(db, workshopId, name, exceptId);
  if (!same) return [];
  const where = same.archivedAt ? ' (archived)' : '';
  return [
    {
      field: 'name',
      message: `Another customer is already called “${same.name}”${where}. Check this is not the same customer entered twice.`,
    },
  ];
}

/** Adds a customer and logs it; the answer's `warnings` name a customer with the same name. */
export async function createCustomer(db: Database, actor: AuthUser, input: CustomerFields) {
  return db.transaction(async (tx) => {
    const id = await repo.insertCustomer(tx, actor.workshopId, input);
    await recordAudit(tx, actor, {
      action: 'create',
      subjectType: 'customer',
      subjectId: id,
      detail: { name: input.name },
    });
    const warnings = await nameWarnings(tx, actor.workshopId, input.name, id);
    return { ...(await getCustomer(tx, actor, id)), warnings };
  });
}

/** Replaces a customer's fields and logs it; `warnings` as for a create. */
export async function updateCustomer(
  db: Database,
  actor: AuthUser,
  id: string,
  input: CustomerFields,
) {
  return db.transaction(async (tx) => {
    if (!(await repo.updateCustomer(tx, actor.workshopId, id, input))) throw notFound(LABEL);
    await recordAudit(tx, actor, {
      action: 'update',
      subjectType: 'customer',
      subjectId: id,
      detail: { name: input.name },
    });
    const warnings = await nameWarnings(tx, actor.workshopId, input.name, id);
    return { ...(await getCustomer(tx, actor, id)), warnings };
  });
}

/**
 * Deletes a customer no delivery names, and logs it; a customer with deliveries is archived
 * instead, so that a trace still finds who received a lot.
 */
export async function deleteCustomer(db: Database, actor: AuthUser, id: string) {
  await deleteLogged(db, actor, {
    subjectType: 'customer',
    label: LABEL,
    id,
    find: (tx) => repo.findCustomer(tx, actor.workshopId, id),
    check: (_tx, customer) =>
      refuseWhileReferenced('this customer', [
        { count: customer.deliveryCount, one: 'delivery', many: 'deliveries' },
      ]),
    remove: (tx) => repo.deleteCustomer(tx, actor.workshopId, id),
    detail: (customer) => ({ name: customer.name }),
  });
}
