import { httpResource } from '@angular/common/http';
import { Injectable } from '@angular/core';
import {
  referenceListIndexSchema,
  referenceRowsPageSchema,
  type ReferenceRowsQuery,
} from '@batchproof/shared';

/** The read-only reference lists the checks rest on. Reads are resources; call them in a field. */
@Injectable({ providedIn: 'root' })
export class ReferenceListsApi {
  /** Every list with its title, description and row count. */
  lists() {
    return httpResource(() => '/api/reference', {
      parse: (body) => referenceListIndexSchema.parse(body).items,
    });
  }

  /** One page of a list's rows, filtered and sorted on the server. */
  rows(key: () => string | undefined, query: () => ReferenceRowsQuery) {
    return httpResource(
      () => {
        const k = key();
        if (!k) return undefined;
        const q = query();
        const params: Record<string, string | number> = {
          sort: q.sort,
          dir: q.dir,
          page: q.page,
          pageSize: q.pageSize,
        };
        if (q.q) params['q'] = q.q;
        if (q.status) params['status'] = q.status;
        return { url: `/api/reference/${encodeURIComponent(k)}`, params };
      },
      { parse: (body) => referenceRowsPageSchema.parse(body) },
    );
  }
}
