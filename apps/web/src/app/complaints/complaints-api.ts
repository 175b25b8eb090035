import { HttpClient, httpResource } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { map, type Observable } from 'rxjs';
import {
  batchPageSchema,
  type Complaint,
  type ComplaintFields,
  type ComplaintListQuery,
  complaintPageSchema,
  complaintSchema,
  formulaPageSchema,
} from '@batchproof/shared';
import { idempotencyHeaders } from '../http/submission-key';

/** Complaints and adverse events. Reads are resources. */
@Injectable({ providedIn: 'root' })
export class ComplaintsApi {
  private readonly http = inject(HttpClient);

  /** One page of complaints, filtered, sorted and paged on the server. */
  complaints(query: () => ComplaintListQuery) {
    return httpResource(
      () => {
        const q = query();
        const params: Record<string, string | number> = {
          sort: q.sort,
          dir: q.dir,
          page: q.page,
          pageSize: q.pageSize,
        };
        if (q.q) params['q'] = q.q;
        if (q.formulaId) params['formulaId'] = q.formulaId;
        if (q.status) params['status'] = q.status;
        if (q.serious !== undefined) params['serious'] = String(q.serious);
        return { url: '/api/complaints', params };
      },
      { parse: (body) => complaintPageSchema.parse(body) },
    );
  }

  /** One complaint, read while `id` gives one. */
  complaint(id: () => string | undefined) {
    return httpResource(() => (id() ? `/api/complaints/${encodeURIComponent(id()!)}` : undefined), {
      parse: (body) => complaintSchema.parse(body),
    });
  }

  /** The workshop's products (formulas) by name, for the product picker. */
  products() {
    return httpResource(() => ({ url: '/api/formulas', params: { sort: 'name', pageSize: 100 } }), {
      parse: (body) => formulaPageSchema.parse(body),
    });
  }

  /** The batches of a product, newest first, for the batch picker. */
  batchesOf(formulaId: () => string | undefined) {
    return httpResource(
      () =>
        formulaId()
          ? {
              url: '/api/batches',
              params: { formulaId: formulaId()!, sort: 'madeOn', dir: 'desc', pageSize: 100 },
            }
          : undefined,
      { parse: (body) => batchPageSchema.parse(body) },
    );
  }

  /** Logs a complaint; `key` keeps a retried submission from logging it twice. */
  create(input: ComplaintFields, key?: string): Observable<Complaint> {
    return this.http
      .post<unknown>('/api/complaints', input, { headers: idempotencyHeaders(key) })
      .pipe(map((body) => complaintSchema.parse(body)));
  }

  /** Replaces a complaint's fields. */
  update(id: string, input: ComplaintFields): Observable<Complaint> {
    return this.http
      .put<unknown>(`/api/complaints/${encodeURIComponent(id)}`, input)
      .pipe(map((body) => complaintSchema.parse(body)));
  }
}
