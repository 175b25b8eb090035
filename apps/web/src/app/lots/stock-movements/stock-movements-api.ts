import { HttpClient, httpResource } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { map, type Observable } from 'rxjs';
import { type StockAdjustment, type StockMovement, stockMovementSchema } from '@batchproof/shared';
import { idempotencyHeaders } from '../../http/submission-key';

const lotUrl = (id: string) => `/api/lots/${encodeURIComponent(id)}`;

/** A lot's stock movements (batch releases, adjustments, amendments) and adjustments to it. */
@Injectable({ providedIn: 'root' })
export class StockMovementsApi {
  private readonly http = inject(HttpClient);

  /** The lot's movements, newest first, read while `lotId` gives one. */
  movements(lotId: () => string | undefined) {
    return httpResource(
      () => {
        const id = lotId();
        return id ? `${lotUrl(id)}/movements` : undefined;
      },
      { parse: (body) => stockMovementSchema.array().parse(body) },
    );
  }

  /** Adjusts the lot's stock (negative takes stock away); refused 409 below zero. */
  adjust(
    lotId: string,
    input: Omit<StockAdjustment, 'lotId'>,
    key?: string,
  ): Observable<StockMovement> {
    return this.http
      .post<unknown>(`${lotUrl(lotId)}/adjustments`, input, { headers: idempotencyHeaders(key) })
      .pipe(map((body) => stockMovementSchema.parse(body)));
  }
}
