import { httpResource } from '@angular/common/http';
import { Injectable } from '@angular/core';
import {
  finishedLotTraceSchema,
  supplierLotTraceSchema,
  traceSearchResultSchema,
} from '@batchproof/shared';

const path = (base: string, id: string | undefined) =>
  id ? `/api/trace/${base}/${encodeURIComponent(id)}` : undefined;

/** Two-way tracing: forward from a supplier lot, backward from a finished lot, and the picker. */
@Injectable({ providedIn: 'root' })
export class TraceApi {
  /** Forward: the batches that used the supplier lot and the customers who received them. */
  supplierLot(id: () => string | undefined) {
    return httpResource(() => path('supplier-lots', id()), {
      parse: (body) => supplierLotTraceSchema.parse(body),
    });
  }

  /** Backward: every supplier lot the finished lot used, with suppliers, documents, deliveries. */
  finishedLot(id: () => string | undefined) {
    return httpResource(() => path('finished-lots', id()), {
      parse: (body) => finishedLotTraceSchema.parse(body),
    });
  }

  /** Supplier lots and finished lots matching the search; nothing is asked while it is empty. */
  search(q: () => string) {
    return httpResource(
      () => (q().trim() ? { url: '/api/trace/search', params: { q: q().trim() } } : undefined),
      { parse: (body) => traceSearchResultSchema.parse(body) },
    );
  }
}
