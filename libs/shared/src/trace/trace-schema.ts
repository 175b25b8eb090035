import * as z from 'zod';
import { documentKindSchema } from '../documents/document-schema';
import { lotUnitSchema } from '../lots/lot-schema';
import { textField } from '../records/record-fields';

/**
 * The trace contract: forward from a supplier lot (`GET /api/trace/supplier-lots/:id`) to the
 * finished lots that used it and the customers who received them, and backward from a finished
 * lot (`GET /api/trace/finished-lots/:id`) to every supplier lot, its supplier and its documents.
 * A finished lot is a released batch: its id is the batch id, its lot code the batch code, its
 * quantity the units made.
 */

/** What a node of the trace graph stands for. */
export const TRACE_NODE_KINDS = [
  'supplier-lot',
  'batch',
  'customer',
  'supplier',
  'document',
] as const;
export type TraceNodeKind = (typeof TRACE_NODE_KINDS)[number];

/**
 * One node of the trace graph. `id` is unique in the graph (`<kind>:<recordId>`); `recordId` is
 * the record's own id, for a link to its page.
 */
export const traceNodeSchema = z.object({
  id: z.string(),
  kind: z.enum(TRACE_NODE_KINDS),
  recordId: z.string(),
  label: z.string(),
  detail: z.string().nullable(),
});
export type TraceNode = z.infer<typeof traceNodeSchema>;

/** A directed edge, drawn left to right: supplier → lot → batch → customer. */
export const traceEdgeSchema = z.object({
  from: z.string(),
  to: z.string(),
  label: z.string(),
});
export type TraceEdge = z.infer<typeof traceEdgeSchema>;

/** The graph form both traces carry, with how long the trace took on the server. */
const traceGraphFields = {
  nodes: z.array(traceNodeSchema),
  edges: z.array(traceEdgeSchema),
  /** Milliseconds the server spent on the trace's queries (for recall drills). */
  traceMilliseconds: z.number(),
};

/** A finished lot's delivery to one customer on one day (units summed over its lines). */
export const traceDeliverySchema = z.object({
  deliveryId: z.string(),
  deliveredOn: z.string(),
  reference: z.string().nullable(),
  customerId: z.string(),
  customerName: z.string(),
  units: z.number().int(),
});
export type TraceDelivery = z.infer<typeof traceDeliverySchema>;

/** A supplier lot as a trace shows it. */
export const traceSupplierLotSchema = z.object({
  id: z.string(),
  lotNumber: z.string(),
  materialId: z.string(),
  materialName: z.string(),
  supplierId: z.string().nullable(),
  supplierName: z.string().nullable(),
  /** Quantity received, in `unit`. */
  quantity: z.number(),
  unit: lotUnitSchema,
  receivedOn: z.string(),
  expiresOn: z.string().nullable(),
});
export type TraceSupplierLot = z.infer<typeof traceSupplierLotSchema>;

/** A finished lot (a released batch) as a trace shows it. */
export const traceFinishedLotSchema = z.object({
  batchId: z.string(),
  batchCode: z.string(),
  formulaId: z.string(),
  productName: z.string(),
  versionNumber: z.number().int(),
  madeOn: z.string(),
  /** The lot's quantity after amendments; null when not counted. */
  unitsMade: z.number().int().nullable(),
  expiresOn: z.string().nullable(),
  bestBeforeMonth: z.string().nullable(),
});
export type TraceFinishedLot = z.infer<typeof traceFinishedLotSchema>;

/** Forward: a batch that used the supplier lot, how much, and where its finished lot went. */
export const supplierLotTraceBatchSchema = z.object({
  batchId: z.string(),
  batchCode: z.string(),
  formulaId: z.string(),
  productName: z.string(),
  madeOn: z.string(),
  unitsMade: z.number().int().nullable(),
  /** Net of amendments, in the supplier lot's unit. */
  quantityUsed: z.number(),
  /** Net of amendments, as weighed; null when no gram weight was recorded. */
  gramsUsed: z.number().nullable(),
  unitsDelivered: z.number().int(),
  deliveries: z.array(traceDeliverySchema),
});
export type SupplierLotTraceBatch = z.infer<typeof supplierLotTraceBatchSchema>;

/** `GET /api/trace/supplier-lots/:id`: forward from a supplier lot. */
export const supplierLotTraceSchema = z.object({
  supplierLot: traceSupplierLotSchema,
  /** Released batches that used the lot (net of amendments), oldest first. */
  batches: z.array(supplierLotTraceBatchSchema),
  totals: z.object({
    batches: z.number().int(),
    /** Units made across those batches (uncounted batches add nothing). */
    unitsMade: z.number().int(),
    unitsDelivered: z.number().int(),
    /** Distinct customers who received any of them. */
    customers: z.number().int(),
  }),
  ...traceGraphFields,
});
export type SupplierLotTrace = z.infer<typeof supplierLotTraceSchema>;

/** A supplier document of a lot or of its material, as a trace lists it. */
export const traceDocumentSchema = z.object({
  id: z.string(),
  kind: documentKindSchema,
  title: z.string(),
  issuedOn: z.string(),
  /** Whether the document belongs to the lot itself or to its material. */
  belongsTo: z.enum(['lot', 'material']),
});
export type TraceDocument = z.infer<typeof traceDocumentSchema>;

/** Backward: one supplier lot a line of the batch drew on (net of amendments). */
export const finishedLotTraceLineSchema = z.object({
  /** The batch's line (1-based); null for a movement recorded without one. */
  lineNumber: z.number().int().nullable(),
  supplierLot: traceSupplierLotSchema,
  /** Net of amendments, in the supplier lot's unit. */
  quantityUsed: z.number(),
  gramsUsed: z.number().nullable(),
  documents: z.array(traceDocumentSchema),
});
export type FinishedLotTraceLine = z.infer<typeof finishedLotTraceLineSchema>;

/** `GET /api/trace/finished-lots/:id`: backward from a finished lot. */
export const finishedLotTraceSchema = z.object({
  finishedLot: traceFinishedLotSchema,
  /** Every supplier lot used, by line then lot number. */
  lines: z.array(finishedLotTraceLineSchema),
  /** Deliveries of this lot, by customer then day. */
  deliveries: z.array(traceDeliverySchema),
  totals: z.object({
    supplierLots: z.number().int(),
    suppliers: z.number().int(),
    unitsDelivered: z.number().int(),
    customers: z.number().int(),
  }),
  ...traceGraphFields,
});
export type FinishedLotTrace = z.infer<typeof finishedLotTraceSchema>;

/** Query of `GET /api/trace/search`: a lot number, material, batch code or product. */
export const traceSearchQuerySchema = z.object({
  q: textField('The search')
    .trim()
    .min(1, { error: 'Enter a lot number, material, batch code or product' })
    .max(100, { error: 'Keep the search under 100 characters' }),
});
export type TraceSearchQuery = z.output<typeof traceSearchQuerySchema>;

/** The most supplier lots and finished lots a trace search answers (each). */
export const TRACE_SEARCH_LIMIT = 10;

/** Answer of `GET /api/trace/search`: up to {@link TRACE_SEARCH_LIMIT} of each, newest first. */
export const traceSearchResultSchema = z.object({
  supplierLots: z.array(
    z.object({
      id: z.string(),
      lotNumber: z.string(),
      materialName: z.string(),
      receivedOn: z.string(),
    }),
  ),
  finishedLots: z.array(
    z.object({
      batchId: z.string(),
      batchCode: z.string(),
      productName: z.string(),
      madeOn: z.string(),
    }),
  ),
});
export type TraceSearchResult = z.infer<typeof traceSearchResultSchema>;
