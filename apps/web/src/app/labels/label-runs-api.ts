import { HttpClient, httpResource } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { map, type Observable } from 'rxjs';
import {
  type LabelRunCreate,
  labelRunListSchema,
  type LabelRunRecord,
  labelRunRecordSchema,
} from '@batchproof/shared';
import { idempotencyHeaders } from '../http/submission-key';

const runUrl = (id: string) => `/api/label-runs/${encodeURIComponent(id)}`;

/** Print runs of labels. Reads are resources, except the polling read of one run. */
@Injectable({ providedIn: 'root' })
export class LabelRunsApi {
  private readonly http = inject(HttpClient);

  /** Recent runs, newest first; only one formula's when `formulaId()` gives one. */
  runs(formulaId: () => string | undefined = () => undefined) {
    return httpResource(
      () => {
        const id = formulaId();
        const params: Record<string, string> = id ? { formulaId: id } : {};
        return { url: '/api/label-runs', params };
      },
      { parse: (body) => labelRunListSchema.parse(body).items },
    );
  }

  /**
   * Records a print run and starts its PDF; answers 409 `label_incomplete` with what is missing,
   * or 422 `label_does_not_fit` with what cannot fit at its legal size.
   */
  create(input: LabelRunCreate, key?: string): Observable<LabelRunRecord> {
    return this.http
      .post<unknown>('/api/label-runs', input, { headers: idempotencyHeaders(key) })
      .pipe(map((body) => labelRunRecordSchema.parse(body)));
  }

  /** One run as it stands now (its status and progress while the PDF renders). */
  run(id: string): Observable<LabelRunRecord> {
    return this.http.get<unknown>(runUrl(id)).pipe(map((body) => labelRunRecordSchema.parse(body)));
  }

  /** The run's PDF; the API needs the bearer token, so it is fetched rather than linked. */
  pdf(id: string): Observable<Blob> {
    return this.http.get(`${runUrl(id)}/pdf`, { responseType: 'blob' });
  }

  /** Takes the run's public ingredients page down (owner only). */
  withdraw(id: string): Observable<LabelRunRecord> {
    return this.http
      .post<unknown>(`${runUrl(id)}/withdraw`, {})
      .pipe(map((body) => labelRunRecordSchema.parse(body)));
  }
}
