import Papa from 'papaparse';
import {
  checkDeliveryCsv,
  duplicateKey,
  readDeliveryCsv,
  type DeliveryImportResult,
} from '@batchproof/shared';
import type { AuthUser } from '../auth/authenticate';
import { AppError } from '../core/app-error';
import type { Database } from '../db/database';
import { customersByNames } from './customers-repository';
import { finishedLotsLeft, insertLogged } from './deliveries-domain';

/**
 * Reads and checks a deliveries CSV against the workshop: customers by name (case and spaces
 * folded; the oldest of a shared name), finished lots by code (released batches, locked when
 * `db` is a transaction) and the units each has left. `deliveries` is empty unless every row is
 * fine.
 */
export async function checkDeliveriesCsv(db: Database, actor: AuthUser, text: string) {
  const read = readDeliveryCsv(text, Papa);
  const customerIds = new Map<string, string>();
  for (const c of await customersByNames(db, actor.workshopId, read.names.customers)) {
    if (!customerIds.has(duplicateKey(c.name))) customerIds.set(duplicateKey(c.name), c.id);
  }
  const lots = await finishedLotsLeft(db, actor.workshopId, read.names.lotCodes);
  const leftById = new Map([...lots.values()].map((l) => [l.id, l.left]));
  const checked = checkDeliveryCsv(read, {
    customerId: (name) => customerIds.get(duplicateKey(name)) ?? null,
    finishedLotId: (code) => lots.get(code)?.id ?? null,
    unitsLeft: (id) => leftById.get(id) ?? null,
  });
  return { ...checked, lotIds: new Map([...lots].map(([code, lot]) => [code, lot.id])) };
}

/**
 * Imports a deliveries CSV all or nothing, in one transaction: any problem with the file or a row
 * answers 400 with each problem under `file` or `rows.<line>.<column>`, and nothing is saved.
 * Each delivery is logged as created by an import.
 */
export async function importDeliveriesCsv(
  db: Database,
  actor: AuthUser,
  text: string,
): Promise<DeliveryImportResult> {
  return db.transaction(async (tx) => {
    const { preview, deliveries, lotIds } = await checkDeliveriesCsv(tx, actor, text);
    if (!preview.commitable) {
      const fieldErrors: Record<string, string[]> = {};
      if (preview.fileErrors.length > 0) fieldErrors['file'] = preview.fileErrors;
      for (const row of preview.rows) {
        for (const [column, messages] of Object.entries(row.errors))
          fieldErrors[`rows.${row.line}.${column}`] = messages;
      }
      throw new AppError(
        400,
        'validation_failed',
        preview.errorCount > 0
          ? `${preview.errorCount} ${preview.errorCount === 1 ? 'row needs' : 'rows need'} attention; nothing was imported.`
          : 'The file cannot be imported as it stands; nothing was imported.',
        fieldErrors,
      );
    }
    const ids: string[] = [];
    for (const input of deliveries) {
      const values = {
        customerId: input.customerId,
        deliveredOn: input.deliveredOn,
        reference: input.reference,
        notes: input.notes,
        lines: input.lines.map((l) => ({ batchId: lotIds.get(l.lotCode)!, units: l.units })),
      };
      ids.push(await insertLogged(tx, actor, values, input, 'import'));
    }
    return { imported: ids.length, ids };
  });
}
