import { HttpClient, httpResource } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { map, type Observable } from 'rxjs';
import * as z from 'zod';
import {
  type ProductIdentityInput,
  type ProductIdentityRecord,
  productIdentityRecordSchema,
  type WorkshopLabelDetails,
  workshopLabelDetailsSchema,
} from '@batchproof/shared';

const identityUrl = (formulaId: string) =>
  `/api/formulas/${encodeURIComponent(formulaId)}/identity`;
const WORKSHOP_DETAILS = '/api/workshop/label-details';

/**
 * The workshop's label details as read: the address may not be entered yet, which the save's
 * schema (`workshopLabelDetailsSchema`) would refuse.
 */
const workshopDetailsReadSchema = z.object({
  name: z.string(),
  address: z.string().nullable(),
});
export type WorkshopDetailsRead = z.infer<typeof workshopDetailsReadSchema>;

/** What labels carry beyond the engine's texts: a formula's product identity, the workshop's address. */
@Injectable({ providedIn: 'root' })
export class LabelDetailsApi {
  private readonly http = inject(HttpClient);

  /** A formula's product identity (null until entered), read while `formulaId()` gives one. */
  identity(formulaId: () => string | undefined) {
    return httpResource(() => (formulaId() ? identityUrl(formulaId()!) : undefined), {
      parse: (body) => productIdentityRecordSchema.parse(body),
    });
  }

  saveIdentity(formulaId: string, input: ProductIdentityInput): Observable<ProductIdentityRecord> {
    return this.http
      .put<unknown>(identityUrl(formulaId), input)
      .pipe(map((body) => productIdentityRecordSchema.parse(body)));
  }

  /** The workshop's name and address as labels print them. */
  workshopDetails() {
    return httpResource(() => WORKSHOP_DETAILS, {
      parse: (body) => workshopDetailsReadSchema.parse(body),
    });
  }

  saveWorkshopDetails(input: WorkshopLabelDetails): Observable<WorkshopLabelDetails> {
    return this.http
      .put<unknown>(WORKSHOP_DETAILS, input)
      .pipe(map((body) => workshopLabelDetailsSchema.parse(body)));
  }
}
