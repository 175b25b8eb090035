import {
  BUILT_IN_LABEL_STOCKS,
  type BuiltInLabelStock,
  type LabelStock,
  type LabelStockListQuery,
  type LabelStockRecord,
} from '@batchproof/shared';
import type { AuthUser } from '../auth/authenticate';
import { conflict, notFound } from '../core/app-error';
import { isRecordId } from '../core/record-id';
import type { Database } from '../db/database';
import { deleteLogged } from '../housekeeping/deletion';
import * as repo from './label-stocks-repository';

const LABEL = 'That label stock';

/** A built-in stock as answered: its key is its id. */
function builtInRecord(builtIn: BuiltInLabelStock): LabelStockRecord {
  const { key, ...stock } = builtIn;
  return {
    id: key,
    builtIn: true,
    key,
    stock,
    archivedAt: null,
    createdAt: null,
    updatedAt: null,
  };
}

/** A workshop's own stock as answered: the stored geometry with its name put back. */
function ownRecord(row: repo.LabelStockRow): LabelStockRecord {
  return {
    id: row.id,
    builtIn: false,
    key: null,
    stock: { ...row.geometry, name: row.name } as LabelStock,
    archivedAt: row.archivedAt?.toISOString() ?? null,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

const builtInByKey = (id: string) => BUILT_IN_LABEL_STOCKS.find((s) => s.key === id);

/** 409 for any change to a built-in stock: they are shared by every workshop. */
function refuseBuiltIn(id: string): void {
  if (builtInByKey(id)) {
    throw conflict(
      'Built-in label stocks cannot be changed, archived or deleted. Add a stock of your own with the measurements you need.',
    );
  }
}

/** The id of one of the workshop's own stocks in a path: a built-in key is refused, anything else is 404. */
export function ownStockId(raw: unknown): string {
  if (typeof raw === 'string') refuseBuiltIn(raw);
  if (!isRecordId(raw)) throw notFound(LABEL);
  return raw;
}

/** The built-in stocks, then the workshop's own by name. */
export async function listLabelStocks(db: Database, actor: AuthUser, q: LabelStockListQuery) {
  const own = await repo.listLabelStocks(db, actor.workshopId, q.includeArchived);
  return { items: [...BUILT_IN_LABEL_STOCKS.map(builtInRecord), ...own.map(ownRecord)] };
}

/** One stock: a built-in by its key, or one of the caller's workshop's own; 404 for any other. */
export async function getLabelStock(db: Database, actor: AuthUser, id: string) {
  const builtIn = builtInByKey(id);
  if (builtIn) return builtInRecord(builtIn);
  if (!isRecordId(id)) throw notFound(LABEL);
  const row = await repo.findLabelStock(db, actor.workshopId, id);
  if (!row) throw notFound(LABEL);
  return ownRecord(row);
}

export async function createLabelStock(db: Database, actor: AuthUser, stock: LabelStock) {
  const id = await repo.insertLabelStock(db, actor.workshopId, stock);
  return getLabelStock(db, actor, id);
}

export async function updateLabelStock(
  db: Database,
  actor: AuthUser,
  id: string,
  stock: LabelStock,
) {
  if (!(await repo.updateLabelStock(db, actor.workshopId, id, stock))) throw notFound(LABEL);
  return getLabelStock(db, actor, id);
}

/** Deletes one of the workshop's own stocks and logs it. */
export async function deleteLabelStock(db: Database, actor: AuthUser, id: string) {
  await deleteLogged(db, actor, {
    subjectType: 'label_stock',
    label: LABEL,
    id,
    find: (tx) => repo.findLabelStock(tx, actor.workshopId, id),
    check: () => undefined,
    remove: (tx) => repo.deleteLabelStock(tx, actor.workshopId, id),
    detail: (row) => ({ name: row.name }),
  });
}
