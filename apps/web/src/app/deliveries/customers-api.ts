import { HttpClient, httpResource } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { map, type Observable } from 'rxjs';
import {
  MAX_PAGE_SIZE,
  type Customer,
  type CustomerCreate,
  type CustomerListQuery,
  customerPageSchema,
  customerSchema,
} from '@batchproof/shared';
import { idempotencyHeaders } from '../http/submission-key';

/** The workshop's customers. Reads are resources; call them in a field. */
@Injectable({ providedIn: 'root' })
export class CustomersApi {
  private readonly http = inject(HttpClient);

  /** One page of customers, filtered, sorted and paged on the server. */
  page(query: () => CustomerListQuery) {
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
        if (q.kind) params['kind'] = q.kind;
        if (q.includeArchived) params['includeArchived'] = 'true';
        return { url: '/api/customers', params };
      },
      { parse: (body) => customerPageSchema.parse(body) },
    );
  }

  /**
   * Customers by name for a picker: the first {@link MAX_PAGE_SIZE} not archived, which covers a
   * small workshop's stockists and stalls.
   */
  options() {
    return httpResource(
      () => ({
        url: '/api/customers',
        params: { sort: 'name', dir: 'asc', page: 1, pageSize: MAX_PAGE_SIZE },
      }),
      { parse: (body) => customerPageSchema.parse(body).items },
    );
  }

  /** One customer; nothing while `id` is unset. */
  customer(id: () => string | undefined) {
    return httpResource(
      () => {
        const value = id();
        return value ? `/api/customers/${encodeURIComponent(value)}` : undefined;
      },
      { parse: (body) => customerSchema.parse(body) },
    );
  }

  /** Adds a customer; `key` is the submission's Idempotency-Key. */
  create(input: CustomerCreate, key?: string): Observable<Customer> {
    return this.http
      .post<unknown>('/api/customers', input, { headers: idempotencyHeaders(key) })
      .pipe(map((body) => customerSchema.parse(body)));
  }

  update(id: string, input: CustomerCreate): Observable<Customer> {
    return this.http
      .put<unknown>(`/api/customers/${encodeURIComponent(id)}`, input)
      .pipe(map((body) => customerSchema.parse(body)));
  }
}
