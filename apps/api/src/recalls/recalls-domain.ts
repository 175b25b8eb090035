import { performance } from 'node:perf_hooks';
import type {
  Recall,
  RecallAffectedCustomer,
  RecallClose,
  RecallFields,
  RecallListQuery,
  RecallPage,
  RecallPreview,
  RecallReplyFields,
  RecallScope,
} from '@batchproof/shared';
import type { AuthUser } from '../auth/authenticate';
import { recordAudit } from '../audit/audit-log';
import { AppError, conflict, notFound } from '../core/app-error';
import { withIsoDates } from '../core/list-paging';
import type { Database } from '../db/database';
import {
  deliveriesOfFinishedLots,
  finishedLotsUsingSupplierLot,
  type FinishedLotDelivery,
  type FinishedLotRef,
} from '../trace/trace-repository';
import { renderRecallSummaryPdf } from './recall-summary-pdf';
import * as repo from './recalls-repository';

const invalid = (field: string, message: string) =>
  new AppError(400, 'validation_failed', 'Some fields need attention.', { [field]: [message] });

/** The finished lots a scope covers and their deliveries, and how long finding them took. */
export interface TracedScope {
  lots: FinishedLotRef[];
  deliveries: FinishedLotDelivery[];
  traceMilliseconds: number;
}

/**
 * Traces the scope to finished lots and the customers who received them. A supplier lot no
 * released batch used, or a finished lot that is not a released batch of this workshop, is a 400
 * on the field: there would be nothing to recall.
 */
export async function traceScope(
  db: Database,
  workshopId: string,
  scope: RecallScope,
): Promise<TracedScope> {
  const started = performance.now();
  let lots: FinishedLotRef[];
  if (scope.kind === 'supplier-lot') {
    if ((await repo.supplierLotLabel(db, workshopId, scope.supplierLotId)) === null) {
      throw invalid('scope.supplierLotId', 'Choose one of this workshop’s supplier lots');
    }
    lots = await finishedLotsUsingSupplierLot(db, workshopId, scope.supplierLotId);
    if (lots.length === 0) {
      throw invalid(
        'scope.supplierLotId',
        'No released batch used this supplier lot, so there is nothing to recall',
      );
    }
  } else {
    lots = await repo.releasedFinishedLots(db, workshopId, scope.finishedLotIds);
    if (lots.length !== scope.finishedLotIds.length) {
      throw invalid(
        'scope.finishedLotIds',
        'Choose released batches of this workshop; a draft batch has not left the workshop',
      );
    }
  }
  const deliveries = await deliveriesOfFinishedLots(
    db,
    workshopId,
    lots.map((l) => l.batchId),
  );
  return { lots, deliveries, traceMilliseconds: performance.now() - started };
}

/** The customers who received the lots, by name, with units per lot and in all. */
export function affectedCustomers(deliveries: readonly FinishedLotDelivery[]) {
  const byCustomer = new Map<string, RecallAffectedCustomer>();
  for (const d of deliveries) {
    let customer = byCustomer.get(d.customerId);
    if (!customer) {
      customer = {
        customerId: d.customerId,
        customerName: d.customerName,
        email: d.email,
        phone: d.phone,
        lots: [],
        unitsDelivered: 0,
      };
      byCustomer.set(d.customerId, customer);
    }
    const lot = customer.lots.find((l) => l.finishedLotId === d.batchId);
    if (lot) lot.unitsDelivered += d.units;
    else
      customer.lots.push({
        finishedLotId: d.batchId,
        lotCode: d.batchCode,
        productName: d.productName,
        unitsDelivered: d.units,
      });
    customer.unitsDelivered += d.units;
  }
  return [...byCustomer.values()].sort(
    (a, b) =>
      a.customerName.localeCompare(b.customerName) || a.customerId.localeCompare(b.customerId),
  );
}

/** What a real recall would lack, in plain words, for a drill's report. */
export function missingForRecall(traced: TracedScope, affected: readonly RecallAffectedCustomer[]) {
  const missing: string[] = [];
  for (const c of affected) {
    if (c.email) continue;
    missing.push(
      c.phone
        ? `${c.customerName} has no e-mail address: the notice would have to be phoned (${c.phone})`
        : `${c.customerName} has no e-mail address or phone number: there is no way to reach them on record`,
    );
  }
  for (const lot of traced.lots) {
    const delivered = traced.deliveries
      .filter((d) => d.batchId === lot.batchId)
      .reduce((sum, d) => sum + d.units, 0);
    if (delivered === 0) missing.push(`Lot ${lot.batchCode} has no recorded delivery`);
    if (lot.unitsMade === null) {
      missing.push(`Lot ${lot.batchCode} has no count of units made`);
    } else if (delivered > lot.unitsMade) {
      missing.push(
        `Lot ${lot.batchCode}: ${delivered} units delivered but only ${lot.unitsMade} made; a delivery or the count is wrong`,
      );
    }
  }
  return missing;
}

const distinct = (values: readonly string[]) => [...new Set(values)];

/** What opening a recall with this scope would cover, before it is opened. */
export async function previewRecall(
  db: Database,
  actor: AuthUser,
  scope: RecallScope,
): Promise<RecallPreview> {
  const traced = await traceScope(db, actor.workshopId, scope);
  const affected = affectedCustomers(traced.deliveries);
  return {
    batchCodes: traced.lots.map((l) => l.batchCode),
    products: distinct(traced.lots.map((l) => l.productName)).sort(),
    affected,
    unitsDelivered: affected.reduce((sum, c) => sum + c.unitsDelivered, 0),
    lotsWithoutDelivery: traced.lots
      .filter((l) => !traced.deliveries.some((d) => d.batchId === l.batchId))
      .map((l) => l.batchCode),
  };
}

/** A page of the workshop's recalls, open first and newest first unless sorted otherwise. */
export async function listRecalls(
  db: Database,
  actor: AuthUser,
  q: RecallListQuery,
): Promise<RecallPage> {
  const { items, total } = await repo.pageRecalls(db, actor.workshopId, q);
  return { items: items.map(withIsoDates), total, page: q.page, pageSize: q.pageSize };
}

/** One recall of the caller's workshop with its notices and replies; 404 for any other. */
export async function getRecall(db: Database, actor: AuthUser, id: string): Promise<Recall> {
  const row = await repo.findRecall(db, actor.workshopId, id);
  if (!row) throw notFound('That recall');
  return assemble(db, row);
}

async function assemble(db: Database, row: repo.RecallRow): Promise<Recall> {
  const r = row.recall;
  const [notices, replies] = await Promise.all([
    repo.noticesOf(db, r.id),
    repo.repliesOf(db, r.id),
  ]);
  return {
    id: r.id,
    createdAt: r.createdAt.toISOString(),
    updatedAt: r.updatedAt.toISOString(),
    scope: r.scope,
    batchCodes: r.batchCodes,
    reason: r.reason,
    severity: r.severity,
    drill: r.drill,
    state: r.state,
    openedAt: r.openedAt.toISOString(),
    closedAt: r.closedAt?.toISOString() ?? null,
    affected: r.affected,
    notices: notices.map((n) => ({
      id: n.id,
      customerId: n.customerId,
      to: n.to,
      subject: n.subject,
      status: n.status,
      sentAt: n.sentAt?.toISOString() ?? null,
      failure: n.failure,
    })),
    replies: replies.map((p) => ({
      id: p.id,
      customerId: p.customerId,
      repliedOn: p.repliedOn,
      unitsOnHand: p.unitsOnHand,
      unitsReturned: p.unitsReturned,
      notes: p.notes,
      createdAt: p.createdAt.toISOString(),
    })),
    unitsDelivered: r.affected.reduce((sum, c) => sum + c.unitsDelivered, 0),
    unitsReturned: row.unitsReturned,
    drillReport: r.drillReport,
    summary: r.summary,
    products: row.products,
    whatToDo: r.whatToDo,
  };
}

/**
 * Opens a recall or a drill: traces the scope and keeps the finished lots' codes and the affected
 * customers as found now, so the record shows what was known when it was opened. A drill also
 * keeps how long the trace took and what a real recall would have lacked.
 */
export async function openRecall(
  db: Database,
  actor: AuthUser,
  input: RecallFields,
): Promise<Recall> {
  return db.transaction(async (tx) => {
    const traced = await traceScope(tx, actor.workshopId, input.scope);
    const affected = affectedCustomers(traced.deliveries);
    const drillReport = input.drill
      ? {
          traceMilliseconds: Math.round(traced.traceMilliseconds * 10) / 10,
          missing: missingForRecall(traced, affected),
        }
      : null;
    const id = await repo.insertRecall(tx, actor.workshopId, {
      ...input,
      openedBy: actor.id,
      batchCodes: traced.lots.map((l) => l.batchCode),
      affected,
      drillReport,
    });
    await recordAudit(tx, actor, {
      action: input.drill ? 'recall.drill-opened' : 'recall.opened',
      subjectType: 'recall',
      subjectId: id,
      detail: { scope: input.scope, severity: input.severity, customers: affected.length },
    });
    return getRecall(tx, actor, id);
  });
}

/** Loads an open recall for a change, locking it; a closed one is a 409. */
export async function openRecallForChange(db: Database, actor: AuthUser, id: string) {
  const row = await repo.findRecall(db, actor.workshopId, id, true);
  if (!row) throw notFound('That recall');
  if (row.recall.state === 'closed') {
    throw conflict('This recall is closed; it can no longer change.');
  }
  return row;
}

/**
 * Records a customer's reply. The customer must be one the recall affects, and their returns over
 * every reply may not exceed the units they received.
 */
export async function addReply(
  db: Database,
  actor: AuthUser,
  id: string,
  input: RecallReplyFields,
): Promise<Recall> {
  return db.transaction(async (tx) => {
    const row = await openRecallForChange(tx, actor, id);
    const customer = row.recall.affected.find((c) => c.customerId === input.customerId);
    if (!customer) throw invalid('customerId', 'Choose a customer this recall affects');
    const earlier = (await repo.repliesOf(tx, id))
      .filter((p) => p.customerId === input.customerId)
      .reduce((sum, p) => sum + p.unitsReturned, 0);
    if (earlier + input.unitsReturned > customer.unitsDelivered) {
      throw invalid(
        'unitsReturned',
        `${customer.customerName} received ${customer.unitsDelivered} units` +
          (earlier > 0 ? ` and already returned ${earlier}` : '') +
          `; at most ${customer.unitsDelivered - earlier} more can come back`,
      );
    }
    await repo.insertReply(tx, actor.workshopId, id, actor.id, {
      customerId: input.customerId,
      repliedOn: input.repliedOn,
      unitsOnHand: input.unitsOnHand,
      unitsReturned: input.unitsReturned,
      notes: input.notes,
    });
    await recordAudit(tx, actor, {
      action: 'recall.reply-recorded',
      subjectType: 'recall',
      subjectId: id,
      detail: {
        customerId: input.customerId,
        unitsOnHand: input.unitsOnHand,
        unitsReturned: input.unitsReturned,
      },
    });
    return getRecall(tx, actor, id);
  });
}

/** Closes an open recall with its summary. */
export async function closeRecall(
  db: Database,
  actor: AuthUser,
  id: string,
  input: RecallClose,
): Promise<Recall> {
  return db.transaction(async (tx) => {
    await openRecallForChange(tx, actor, id);
    await repo.closeRecall(tx, actor.workshopId, id, {
      summary: input.summary,
      closedBy: actor.id,
    });
    await recordAudit(tx, actor, {
      action: 'recall.closed',
      subjectType: 'recall',
      subjectId: id,
    });
    return getRecall(tx, actor, id);
  });
}

/** The recall's summary PDF and a file name for it. */
export async function recallSummaryPdf(db: Database, actor: AuthUser, id: string) {
  const row = await repo.findRecall(db, actor.workshopId, id);
  if (!row) throw notFound('That recall');
  const recall = await assemble(db, row);
  const [workshopName, supplierLot, names] = await Promise.all([
    repo.workshopName(db, actor.workshopId),
    recall.scope.kind === 'supplier-lot'
      ? repo.supplierLotLabel(db, actor.workshopId, recall.scope.supplierLotId)
      : null,
    repo.userNames(db, actor.workshopId, [row.recall.openedBy, row.recall.closedBy]),
  ]);
  const pdf = await renderRecallSummaryPdf(recall, {
    workshopName,
    supplierLot,
    openedBy: names.get(row.recall.openedBy ?? '') ?? null,
    closedBy: names.get(row.recall.closedBy ?? '') ?? null,
  });
  const day = recall.openedAt.slice(0, 10);
  return { pdf, fileName: `${recall.drill ? 'recall-drill' : 'recall'}-${day}.pdf` };
}
