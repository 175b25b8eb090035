import { HttpClient, httpResource } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { map, type Observable } from 'rxjs';
import {
  type Batch,
  type BatchAmendment,
  type BatchCreate,
  type BatchListQuery,
  batchPageSchema,
  type BatchRecordInput,
  batchSchema,
} from '@batchproof/shared';
import { idempotencyHeaders } from '../http/submission-key';

const batchUrl = (id: string) => `/api/batches/${encodeURIComponent(id)}`;

/**
 * Production: the workshop's batch records. Reads are resources (call them in a field); writes
 * answer the batch as the API stored it.
 */
@Injectable({ providedIn: 'root' })
export class BatchesApi {
  private readonly http = inject(HttpClient);

  /** One page of batches, filtered, sorted and paged on the server. */
  list(query: () => BatchListQuery) {
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
        if (q.state) params['state'] = q.state;
        if (q.formulaId) params['formulaId'] = q.formulaId;
        return { url: '/api/batches', params };
      },
      { parse: (body) => batchPageSchema.parse(body) },
    );
  }

  /** One batch record, read while `id` gives one. */
  batch(id: () => string | undefined) {
    return httpResource(
      () => {
        const i = id();
        return i ? batchUrl(i) : undefined;
      },
      { parse: (body) => batchSchema.parse(body) },
    );
  }

  /** Starts a batch from a released version; `key` makes a retried submission start it once. */
  create(input: BatchCreate, key?: string): Observable<Batch> {
    return this.http
      .post<unknown>('/api/batches', input, { headers: idempotencyHeaders(key) })
      .pipe(map((body) => batchSchema.parse(body)));
  }

  /** Replaces what was recorded on a draft. */
  record(id: string, input: BatchRecordInput): Observable<Batch> {
    return this.http.put<unknown>(batchUrl(id), input).pipe(map((body) => batchSchema.parse(body)));
  }

  /** Deletes a draft; a released batch is refused (409 record_released). */
  remove(id: string): Observable<void> {
    return this.http.delete(batchUrl(id)).pipe(map(() => undefined));
  }

  /** Releases a draft: 409 batch_not_ready or stock_short name the lines to put right. */
  release(id: string): Observable<Batch> {
    return this.http
      .post<unknown>(`${batchUrl(id)}/release`, {})
      .pipe(map((body) => batchSchema.parse(body)));
  }

  /** Corrects one field of a released batch, with the reason. */
  amend(id: string, input: BatchAmendment): Observable<Batch> {
    return this.http
      .post<unknown>(`${batchUrl(id)}/amendments`, input)
      .pipe(map((body) => batchSchema.parse(body)));
  }

  /** The weigh sheet PDF, as a file to save. */
  weighSheet(id: string): Observable<Blob> {
    return this.http.get(`${batchUrl(id)}/weigh-sheet.pdf`, { responseType: 'blob' });
  }
}
