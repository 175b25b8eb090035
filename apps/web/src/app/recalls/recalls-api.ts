import { HttpClient, httpResource } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { map, type Observable } from 'rxjs';
import {
  type Recall,
  type RecallClose,
  type RecallCreate,
  type RecallListQuery,
  type RecallNoticesSend,
  type RecallReplyCreate,
  type RecallScope,
  recallPageSchema,
  recallPreviewSchema,
  recallSchema,
} from '@batchproof/shared';
import { idempotencyHeaders } from '../http/submission-key';

const recallUrl = (id: string) => `/api/recalls/${encodeURIComponent(id)}`;
const asRecall = map((body: unknown) => recallSchema.parse(body));

/** Recalls and drills. Reads are resources; writes (owner only) answer the whole recall. */
@Injectable({ providedIn: 'root' })
export class RecallsApi {
  private readonly http = inject(HttpClient);

  /** One page of recalls, sorted and paged on the server. */
  recalls(query: () => RecallListQuery) {
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
        return { url: '/api/recalls', params };
      },
      { parse: (body) => recallPageSchema.parse(body) },
    );
  }

  /** One recall, read while `id` gives one. */
  recall(id: () => string | undefined) {
    return httpResource(() => (id() ? recallUrl(id()!) : undefined), {
      parse: (body) => recallSchema.parse(body),
    });
  }

  /** What a recall of the scope would cover, before opening it; read while there is a scope. */
  preview(scope: () => RecallScope | undefined) {
    return httpResource(
      () => {
        const s = scope();
        return s ? { url: '/api/recalls/preview', method: 'POST', body: { scope: s } } : undefined;
      },
      { parse: (body) => recallPreviewSchema.parse(body) },
    );
  }

  /** Opens a recall or a drill; `key` keeps a retried submission from opening two. */
  open(input: RecallCreate, key?: string): Observable<Recall> {
    return this.http
      .post<unknown>('/api/recalls', input, { headers: idempotencyHeaders(key) })
      .pipe(asRecall);
  }

  /** Sends the notices not yet sent (a drill writes them only). */
  sendNotices(id: string, input: RecallNoticesSend): Observable<Recall> {
    return this.http.post<unknown>(`${recallUrl(id)}/notices`, input).pipe(asRecall);
  }

  reply(id: string, input: RecallReplyCreate): Observable<Recall> {
    return this.http.post<unknown>(`${recallUrl(id)}/replies`, input).pipe(asRecall);
  }

  close(id: string, input: RecallClose): Observable<Recall> {
    return this.http.post<unknown>(`${recallUrl(id)}/close`, input).pipe(asRecall);
  }

  /** The summary PDF, as a file to save. */
  summaryPdf(id: string): Observable<Blob> {
    return this.http.get(`${recallUrl(id)}/summary.pdf`, { responseType: 'blob' });
  }
}
