import { HttpClient } from '@angular/common/http';
import { inject, Injectable, signal, type Signal } from '@angular/core';
import { type Lot, lotPageSchema, MAX_PAGE_SIZE } from '@batchproof/shared';

/**
 * The lots a batch line may be weighed from, read per material when the maker first asks for
 * them (adding a lot, opening a lot's list), first-expiring first, and kept for the page's life.
 */
@Injectable()
export class LotChoices {
  private readonly http = inject(HttpClient);
  private readonly byMaterial = new Map<string, ReturnType<typeof signal<Lot[] | null>>>();

  /** The material's lots with stock, once read (null while reading); starts the read if needed. */
  lotsOf(materialId: string): Signal<Lot[] | null> {
    let lots = this.byMaterial.get(materialId);
    if (!lots) {
      lots = signal<Lot[] | null>(null);
      this.byMaterial.set(materialId, lots);
      const target = lots;
      this.http
        .get<unknown>('/api/lots', {
          params: { materialId, sort: 'expiresOn', dir: 'asc', page: 1, pageSize: MAX_PAGE_SIZE },
        })
        .subscribe({
          next: (body) =>
            target.set(lotPageSchema.parse(body).items.filter((l) => l.stockOnHand > 0)),
          // A failed read offers no lots beyond the suggestions; the next ask tries again.
          error: () => {
            target.set([]);
            this.byMaterial.delete(materialId);
          },
        });
    }
    return lots;
  }
}
