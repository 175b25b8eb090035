import { HttpClient, httpResource } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { map, type Observable } from 'rxjs';
import {
  type LabelStockCreate,
  labelStockListSchema,
  type LabelStockRecord,
  labelStockRecordSchema,
} from '@batchproof/shared';
import { idempotencyHeaders } from '../http/submission-key';

const stockUrl = (id: string) => `/api/label-stocks/${encodeURIComponent(id)}`;

/** The label stocks: the built-in ones and the workshop's own. Reads are resources. */
@Injectable({ providedIn: 'root' })
export class LabelStocksApi {
  private readonly http = inject(HttpClient);

  /** Every stock, built-in first; the workshop's archived ones too when `includeArchived()`. */
  stocks(includeArchived: () => boolean = () => false) {
    return httpResource(
      () => {
        const params: Record<string, string> = includeArchived() ? { includeArchived: 'true' } : {};
        return { url: '/api/label-stocks', params };
      },
      { parse: (body) => labelStockListSchema.parse(body).items },
    );
  }

  /** One stock, read while `id` gives one. */
  stock(id: () => string | undefined) {
    return httpResource(() => (id() ? stockUrl(id()!) : undefined), {
      parse: (body) => labelStockRecordSchema.parse(body),
    });
  }

  /** Adds a stock of the workshop's own; `key` is the submission's Idempotency-Key. */
  create(input: LabelStockCreate, key?: string): Observable<LabelStockRecord> {
    return this.http
      .post<unknown>('/api/label-stocks', input, { headers: idempotencyHeaders(key) })
      .pipe(map((body) => labelStockRecordSchema.parse(body)));
  }

  /** Replaces a stock's geometry; the API refuses a built-in one (409). */
  update(id: string, input: LabelStockCreate): Observable<LabelStockRecord> {
    return this.http
      .put<unknown>(stockUrl(id), input)
      .pipe(map((body) => labelStockRecordSchema.parse(body)));
  }

  /** Archives (`true`) or brings back (`false`) one of the workshop's stocks. */
  setArchived(id: string, archived: boolean): Observable<void> {
    return this.http
      .post(`${stockUrl(id)}/${archived ? 'archive' : 'unarchive'}`, {})
      .pipe(map(() => undefined));
  }

  /** The stock's calibration page (box outlines and rulers) as a PDF. */
  calibrationPdf(id: string): Observable<Blob> {
    return this.http.get(`${stockUrl(id)}/calibration.pdf`, { responseType: 'blob' });
  }
}
