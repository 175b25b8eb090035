import { recordAudit } from '../audit/audit-log';
import type { AuthUser } from '../auth/authenticate';
import { conflict, notFound } from '../core/app-error';
import type { Database } from '../db/database';

/** How many records of one kind refer to the record being deleted. */
export interface Reference {
  count: number;
  /** The kind's name for one and for several: `lot`, `lots`. */
  one: string;
  many: string;
}

/** "2 lots and 1 formula line" for the references that are there. */
export function referenceList(references: Reference[]): string {
  const parts = references
    .filter((r) => r.count > 0)
    .map((r) => `${r.count} ${r.count === 1 ? r.one : r.many}`);
  if (parts.length <= 1) return parts.join('');
  return `${parts.slice(0, -1).join(', ')} and ${parts.at(-1)}`;
}

/**
 * Refuses (409) to delete `record` ("this material") while anything refers to it, naming what
 * does and what to do instead. Nothing is thrown when no reference is left.
 */
export function refuseWhileReferenced(record: string, references: Reference[]): void {
  const list = referenceList(references);
  if (!list) return;
  const total = references.reduce((sum, r) => sum + r.count, 0);
  throw conflict(
    `${capitalise(record)} cannot be deleted: ${list} ${total === 1 ? 'refers' : 'refer'} to it. ` +
      'Archive it instead: it leaves the lists and pickers, and what refers to it stays readable.',
  );
}

const capitalise = (text: string) => text.charAt(0).toUpperCase() + text.slice(1);

/** How one kind of record is deleted: found, checked, removed and logged. */
export interface Deletion<R> {
  /** The audit log's subject type, e.g. `material`. */
  subjectType: string;
  /** What a 404 calls the record, e.g. `That material`. */
  label: string;
  id: string;
  find: (tx: Database) => Promise<R | undefined>;
  /** Throws (409) while something refers to the record. */
  check: (tx: Database, row: R) => Promise<void> | void;
  remove: (tx: Database) => Promise<unknown>;
  /** What the log keeps of the record once it is gone (its name). */
  detail: (row: R) => Record<string, unknown>;
}

/**
 * Deletes one record of the caller's workshop and logs it, in one transaction, after `check` let
 * it through; 404 when there is no such record.
 */
export async function deleteLogged<R>(db: Database, actor: AuthUser, what: Deletion<R>) {
  await db.transaction(async (tx) => {
    const row = await what.find(tx);
    if (!row) throw notFound(what.label);
    await what.check(tx, row);
    await what.remove(tx);
    await recordAudit(tx, actor, {
      action: 'delete',
      subjectType: what.subjectType,
      subjectId: what.id,
      detail: what.detail(row),
    });
  });
}
