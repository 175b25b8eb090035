import { HttpClient, httpResource } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { map, type Observable } from 'rxjs';
import {
  type ProductionSettings,
  type ProductionSettingsInput,
  productionSettingsSchema,
} from '@batchproof/shared';

const URL = '/api/workshop/production';

/** The workshop's production settings: members read them, the owner changes them. */
@Injectable({ providedIn: 'root' })
export class ProductionSettingsApi {
  private readonly http = inject(HttpClient);

  settings() {
    return httpResource(() => URL, { parse: (body) => productionSettingsSchema.parse(body) });
  }

  save(input: ProductionSettingsInput): Observable<ProductionSettings> {
    return this.http
      .put<unknown>(URL, input)
      .pipe(map((body) => productionSettingsSchema.parse(body)));
  }
}
