import { HttpClient, httpResource } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { map, type Observable } from 'rxjs';
import {
  type MarketRecord,
  type MarketRecordInput,
  type MarketRecordKind,
  marketRecordSchema,
  readinessListSchema,
} from '@batchproof/shared';

/** Market readiness: the list per product and market, and the references the maker records. */
@Injectable({ providedIn: 'root' })
export class ReadinessApi {
  private readonly http = inject(HttpClient);

  /** Every product with a released version, with what each of its markets still needs. */
  readiness() {
    return httpResource(() => '/api/readiness', {
      parse: (body) => readinessListSchema.parse(body),
    });
  }

  /** Records (or replaces) one notification or listing reference of a product. */
  saveRecord(
    formulaId: string,
    kind: MarketRecordKind,
    input: MarketRecordInput,
  ): Observable<MarketRecord> {
    return this.http
      .put<unknown>(
        `/api/readiness/${encodeURIComponent(formulaId)}/records/${encodeURIComponent(kind)}`,
        input,
      )
      .pipe(map((body) => marketRecordSchema.parse(body)));
  }
}
