import { HttpClient, httpResource } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { map, type Observable } from 'rxjs';
import {
  type Lot,
  type LotFields,
  type LotListQuery,
  lotPageSchema,
  lotSchema,
} from '@batchproof/shared';
import { idempotencyHeaders } from '../http/submission-key';

/** Goods-in: the workshop's lots. Reads are resources. */
@Injectable({ providedIn: 'root' })
export class LotsApi {
  private readonly http = inject(HttpClient);

  /** One page of lots with stock on hand, filtered, sorted and paged on the server. */
  lots(query: () => LotListQuery) {
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
        if (q.materialId) params['materialId'] = q.materialId;
        if (q.expiresBefore) params['expiresBefore'] = q.expiresBefore;
        return { url: '/api/lots', params };
      },
      { parse: (body) => lotPageSchema.parse(body) },
    );
  }

  /** One lot, read while `id` gives one. */
  lot(id: () => string | undefined) {
    return httpResource(() => (id() ? `/api/lots/${encodeURIComponent(id()!)}` : undefined), {
      parse: (body) => lotSchema.parse(body),
    });
  }

  /**
   * Records a delivery; answers with the new lot and its stock on hand. `key` is the form
   * submission's Idempotency-Key: a retry with it never records the delivery twice.
   */
  create(input: LotFields, key?: string): Observable<Lot> {
    return this.http
      .post<unknown>('/api/lots', input, { headers: idempotencyHeaders(key) })
      .pipe(map((body) => lotSchema.parse(body)));
  }

  /** Replaces a lot's fields. */
  update(id: string, input: LotFields): Observable<Lot> {
    return this.http
      .put<unknown>(`/api/lots/${encodeURIComponent(id)}`, input)
      .pipe(map((body) => lotSchema.parse(body)));
  }

  /** Deletes a lot; the API refuses (409) once a batch has drawn from it. */
  remove(id: string): Observable<void> {
    return this.http.delete(`/api/lots/${encodeURIComponent(id)}`).pipe(map(() => undefined));
  }
}
