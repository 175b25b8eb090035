import type { ProductIdentity, ProductIdentityRecord } from '@batchproof/shared';
import { recordAudit } from '../audit/audit-log';
import type { AuthUser } from '../auth/authenticate';
import { notFound } from '../core/app-error';
import type { Database } from '../db/database';
import { findFormula } from '../formulas/formulas-repository';
import * as repo from './product-identity-repository';

const FORMULA = 'That formula';

/** A formula's product identity; `identity` is null until one is entered. 404 for another workshop's. */
export async function getProductIdentity(
  db: Database,
  actor: AuthUser,
  formulaId: string,
): Promise<ProductIdentityRecord> {
  if (!(await findFormula(db, actor.workshopId, formulaId))) throw notFound(FORMULA);
  const row = await repo.findProductIdentity(db, actor.workshopId, formulaId);
  return {
    formulaId,
    identity: row?.identity ?? null,
    updatedAt: row?.updatedAt.toISOString() ?? null,
  };
}

/** Sets a formula's product identity and logs what changed. */
export async function putProductIdentity(
  db: Database,
  actor: AuthUser,
  formulaId: string,
  identity: ProductIdentity,
) {
  return db.transaction(async (tx) => {
    // Locking the formula serialises two saves of the same identity.
    if (!(await findFormula(tx, actor.workshopId, formulaId, true))) throw notFound(FORMULA);
    const before = await repo.findProductIdentity(tx, actor.workshopId, formulaId);
    await repo.upsertProductIdentity(tx, {
      workshopId: actor.workshopId,
      formulaId,
      identity,
      updatedBy: actor.id,
    });
    await recordAudit(tx, actor, {
      action: before ? 'product-identity.changed' : 'product-identity.created',
      subjectType: 'formula',
      subjectId: formulaId,
      detail: { before: before?.identity ?? null, after: identity },
    });
    return getProductIdentity(tx, actor, formulaId);
  });
}
