import { HttpClient, httpResource } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { map, type Observable } from 'rxjs';
import {
  MAX_PAGE_SIZE,
  type Supplier,
  type SupplierCreate,
  type SupplierListQuery,
  supplierPageSchema,
  supplierSchema,
} from '@batchproof/shared';

/** The workshop's suppliers. Reads are resources; call them in a field. */
@Injectable({ providedIn: 'root' })
export class SuppliersApi {
  private readonly http = inject(HttpClient);

  /** One page of suppliers, filtered, sorted and paged on the server. */
  page(query: () => SupplierListQuery) {
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
        if (q.includeArchived) params['includeArchived'] = 'true';
        return { url: '/api/suppliers', params };
      },
      { parse: (body) => supplierPageSchema.parse(body) },
    );
  }

  /**
   * Suppliers by name for a picker: the first {@link MAX_PAGE_SIZE}, which covers a small
   * workshop; a bigger one would want a search-as-you-type picker instead.
   */
  options() {
    return httpResource(
      () => ({
        url: '/api/suppliers',
        params: { sort: 'name', dir: 'asc', page: 1, pageSize: MAX_PAGE_SIZE },
      }),
      { parse: (body) => supplierPageSchema.parse(body).items },
    );
  }

  /** One supplier; nothing while `id` is unset. */
  supplier(id: () => string | undefined) {
    return httpResource(
      () => {
        const value = id();
        return value ? `/api/suppliers/${encodeURIComponent(value)}` : undefined;
      },
      { parse: (body) => supplierSchema.parse(body) },
    );
  }

  create(input: SupplierCreate): Observable<Supplier> {
    return this.http
      .post<unknown>('/api/suppliers', input)
      .pipe(map((body) => supplierSchema.parse(body)));
  }

  update(id: string, input: SupplierCreate): Observable<Supplier> {
    return this.http
      .put<unknown>(`/api/suppliers/${encodeURIComponent(id)}`, input)
      .pipe(map((body) => supplierSchema.parse(body)));
  }
}
