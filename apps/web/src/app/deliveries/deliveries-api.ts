import { HttpClient, httpResource } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { map, type Observable } from 'rxjs';
import {
  type Delivery,
  type DeliveryFields,
  type DeliveryImportPreview,
  type DeliveryImportResult,
  type DeliveryListQuery,
  deliveryImportPreviewSchema,
  deliveryImportResultSchema,
  deliveryPageSchema,
  deliverySchema,
} from '@batchproof/shared';
import { idempotencyHeaders } from '../http/submission-key';

/** The CSV file as the import routes take it: a multipart upload in the field `file`. */
function csvUpload(file: File): FormData {
  const body = new FormData();
  body.append('file', file, file.name);
  return body;
}

/** Deliveries of finished lots to customers, and their CSV import. Reads are resources. */
@Injectable({ providedIn: 'root' })
export class DeliveriesApi {
  private readonly http = inject(HttpClient);

  /** One page of deliveries with their lines, filtered, sorted and paged on the server. */
  page(query: () => DeliveryListQuery) {
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
        if (q.customerId) params['customerId'] = q.customerId;
        if (q.lotCode) params['lotCode'] = q.lotCode;
        return { url: '/api/deliveries', params };
      },
      { parse: (body) => deliveryPageSchema.parse(body) },
    );
  }

  /** One delivery; nothing while `id` is unset. */
  delivery(id: () => string | undefined) {
    return httpResource(
      () => {
        const value = id();
        return value ? `/api/deliveries/${encodeURIComponent(value)}` : undefined;
      },
      { parse: (body) => deliverySchema.parse(body) },
    );
  }

  /** Records a delivery; `key` is the submission's Idempotency-Key. */
  create(input: DeliveryFields, key?: string): Observable<Delivery> {
    return this.http
      .post<unknown>('/api/deliveries', input, { headers: idempotencyHeaders(key) })
      .pipe(map((body) => deliverySchema.parse(body)));
  }

  update(id: string, input: DeliveryFields): Observable<Delivery> {
    return this.http
      .put<unknown>(`/api/deliveries/${encodeURIComponent(id)}`, input)
      .pipe(map((body) => deliverySchema.parse(body)));
  }

  delete(id: string): Observable<void> {
    return this.http.delete(`/api/deliveries/${encodeURIComponent(id)}`).pipe(map(() => undefined));
  }

  /** Checks a CSV file against the workshop; nothing is saved. */
  previewImport(file: File): Observable<DeliveryImportPreview> {
    return this.http
      .post<unknown>('/api/deliveries/import/preview', csvUpload(file))
      .pipe(map((body) => deliveryImportPreviewSchema.parse(body)));
  }

  /** Imports a CSV file: every delivery in it, or none (400 with the rows' problems). */
  import(file: File, key?: string): Observable<DeliveryImportResult> {
    return this.http
      .post<unknown>('/api/deliveries/import', csvUpload(file), {
        headers: idempotencyHeaders(key),
      })
      .pipe(map((body) => deliveryImportResultSchema.parse(body)));
  }
}
