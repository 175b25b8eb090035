import {
  TRACE_SEARCH_LIMIT,
  type FinishedLotTrace,
  type SupplierLotTrace,
  type TraceDelivery,
  type TraceDocument,
  type TraceEdge,
  type TraceNode,
  type TraceNodeKind,
  type TraceSearchQuery,
  type TraceSearchResult,
} from '@batchproof/shared';
import type { AuthUser } from '../auth/authenticate';
import { AppError, notFound } from '../core/app-error';
import type { Database } from '../db/database';
import * as repo from './trace-repository';

/** Nodes and edges of a trace graph, each node once. */
class TraceGraph {
  readonly nodes: TraceNode[] = [];
  readonly edges: TraceEdge[] = [];
  private readonly seen = new Set<string>();

  /** Adds the node unless it is there; answers its graph id. */
  node(kind: TraceNodeKind, recordId: string, label: string, detail: string | null): string {
    const id = `${kind}:${recordId}`;
    if (!this.seen.has(id)) {
      this.seen.add(id);
      this.nodes.push({ id, kind, recordId, label, detail });
    }
    return id;
  }

  edge(from: string, to: string, label: string) {
    this.edges.push({ from, to, label });
  }
}

const amount = (quantity: number, unit: string) => `${Number(quantity.toFixed(4))} ${unit}`;
const units = (n: number) => `${n} ${n === 1 ? 'unit' : 'units'}`;
const since = (start: number) => Math.round((performance.now() - start) * 10) / 10;

function toDelivery(row: repo.FinishedLotDelivery): TraceDelivery {
  return {
    deliveryId: row.deliveryId,
    deliveredOn: row.deliveredOn,
    reference: row.reference,
    customerId: row.customerId,
    customerName: row.customerName,
    units: row.units,
  };
}

/** Units per customer of these deliveries, in the order customers first appear. */
function unitsByCustomer(deliveries: readonly repo.FinishedLotDelivery[]) {
  const byCustomer = new Map<string, { name: string; units: number }>();
  for (const d of deliveries) {
    const entry = byCustomer.get(d.customerId) ?? { name: d.customerName, units: 0 };
    entry.units += d.units;
    byCustomer.set(d.customerId, entry);
  }
  return byCustomer;
}

/** Adds each customer of a finished lot's deliveries with an edge from the batch's node. */
function addCustomers(
  graph: TraceGraph,
  batchNode: string,
  deliveries: readonly repo.FinishedLotDelivery[],
) {
  for (const [customerId, { name, units: n }] of unitsByCustomer(deliveries)) {
    graph.edge(batchNode, graph.node('customer', customerId, name, null), units(n));
  }
}

const sum = (values: readonly number[]) => values.reduce((a, b) => a + b, 0);

/**
 * Forward from a supplier lot: the released batches that used it (net of amendments), and the
 * customers who received their finished lots, with quantities. Three indexed queries.
 */
export async function traceSupplierLot(
  db: Database,
  actor: AuthUser,
  lotId: string,
): Promise<SupplierLotTrace> {
  const start = performance.now();
  const [lot, uses] = await Promise.all([
    repo.findTraceLot(db, actor.workshopId, lotId),
    repo.supplierLotUses(db, actor.workshopId, lotId),
  ]);
  if (!lot) throw notFound('That lot');
  const deliveries = await repo.deliveriesOfFinishedLots(
    db,
    actor.workshopId,
    uses.map((u) => u.batchId),
  );
  const traceMilliseconds = since(start);

  const byBatch = new Map<string, repo.FinishedLotDelivery[]>();
  for (const d of deliveries) byBatch.set(d.batchId, [...(byBatch.get(d.batchId) ?? []), d]);
  const graph = new TraceGraph();
  const lotNode = graph.node('supplier-lot', lot.id, lot.lotNumber, lot.materialName);
  const batches = uses.map((use) => {
    const lotDeliveries = byBatch.get(use.batchId) ?? [];
    const batchNode = graph.node('batch', use.batchId, use.batchCode, use.productName);
    graph.edge(lotNode, batchNode, amount(use.quantity, lot.unit));
    addCustomers(graph, batchNode, lotDeliveries);
    return {
      batchId: use.batchId,
      batchCode: use.batchCode,
      formulaId: use.formulaId,
      productName: use.productName,
      madeOn: use.madeOn,
      unitsMade: use.unitsMade,
      quantityUsed: use.quantity,
      gramsUsed: use.grams,
      unitsDelivered: sum(lotDeliveries.map((d) => d.units)),
      deliveries: lotDeliveries.map(toDelivery),
    };
  });
  return {
    supplierLot: lot,
    batches,
    totals: {
      batches: batches.length,
      unitsMade: sum(batches.map((b) => b.unitsMade ?? 0)),
      unitsDelivered: sum(batches.map((b) => b.unitsDelivered)),
      customers: new Set(deliveries.map((d) => d.customerId)).size,
    },
    nodes: graph.nodes,
    edges: graph.edges,
    traceMilliseconds,
  };
}

/** A draft batch is not a finished lot yet: said plainly, as a 404 (there is no finished lot). */
const notReleased = (batchCode: string) =>
  new AppError(
    404,
    'not_found',
    `Batch ${batchCode} is not released yet, so it is not a finished lot and has nothing to trace.`,
  );

/**
 * Backward from a finished lot: every supplier lot each line used (net of amendments) with its
 * supplier and the documents on file for the lot and its material, and the lot's deliveries.
 * Four indexed queries.
 */
export async function traceFinishedLot(
  db: Database,
  actor: AuthUser,
  batchId: string,
): Promise<FinishedLotTrace> {
  const start = performance.now();
  const [batch, used, deliveries] = await Promise.all([
    repo.findTraceBatch(db, actor.workshopId, batchId),
    repo.lotsUsedByBatch(db, actor.workshopId, batchId),
    repo.deliveriesOfFinishedLots(db, actor.workshopId, [batchId]),
  ]);
  if (!batch) throw notFound('That finished lot');
  if (batch.state !== 'released') throw notReleased(batch.batchCode);
  const documents = await repo.documentsOfLotsAndMaterials(
    db,
    actor.workshopId,
    used.map((u) => u.id),
    used.map((u) => u.materialId),
  );
  const traceMilliseconds = since(start);

  const graph = new TraceGraph();
  const batchNode = graph.node('batch', batch.batchId, batch.batchCode, batch.productName);
  const lines = used.map(({ lineNumber, quantityUsed, gramsUsed, ...lot }) => {
    const lotDocuments: TraceDocument[] = documents
      .filter((d) => d.lotId === lot.id || d.materialId === lot.materialId)
      .map((d) => ({
        id: d.id,
        kind: d.kind as TraceDocument['kind'],
        title: d.title,
        issuedOn: d.issuedOn,
        belongsTo: d.lotId === lot.id ? 'lot' : 'material',
      }));
    const lotNode = graph.node('supplier-lot', lot.id, lot.lotNumber, lot.materialName);
    graph.edge(lotNode, batchNode, amount(quantityUsed, lot.unit));
    if (lot.supplierId && lot.supplierName) {
      graph.edge(
        graph.node('supplier', lot.supplierId, lot.supplierName, null),
        lotNode,
        'supplied',
      );
    }
    for (const d of lotDocuments) {
      const edgeLabel = d.belongsTo === 'lot' ? 'for this lot' : 'for the material';
      graph.edge(graph.node('document', d.id, d.title, d.kind), lotNode, edgeLabel);
    }
    return { lineNumber, supplierLot: lot, quantityUsed, gramsUsed, documents: lotDocuments };
  });
  addCustomers(graph, batchNode, deliveries);
  const { state, ...finishedLot } = batch;
  void state;
  return {
    finishedLot,
    lines,
    deliveries: deliveries.map(toDelivery),
    totals: {
      supplierLots: new Set(used.map((u) => u.id)).size,
      suppliers: new Set(used.flatMap((u) => (u.supplierId ? [u.supplierId] : []))).size,
      unitsDelivered: sum(deliveries.map((d) => d.units)),
      customers: new Set(deliveries.map((d) => d.customerId)).size,
    },
    nodes: graph.nodes,
    edges: graph.edges,
    traceMilliseconds,
  };
}

/** The trace page's picker: supplier lots and finished lots matching the search. */
export async function searchTrace(
  db: Database,
  actor: AuthUser,
  query: TraceSearchQuery,
): Promise<TraceSearchResult> {
  return repo.searchTrace(db, actor.workshopId, query.q, TRACE_SEARCH_LIMIT);
}
