import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { map, type Observable } from 'rxjs';

/** The records that can be archived and deleted, by their API path. */
export type ArchivableKind = 'materials' | 'suppliers' | 'formulas' | 'documents' | 'customers';

/** What archiving answers of any record: its id and when it was archived (null once back). */
export interface ArchiveState {
  id: string;
  archivedAt: string | null;
}

/** Archive, unarchive and delete for any record kind (the routes are the same for every kind). */
@Injectable({ providedIn: 'root' })
export class HousekeepingApi {
  private readonly http = inject(HttpClient);

  /** Archives (`true`) or brings back (`false`) a record; answers its new state. */
  setArchived(kind: ArchivableKind, id: string, archived: boolean): Observable<ArchiveState> {
    const action = archived ? 'archive' : 'unarchive';
    return this.http
      .post<{ id: string; archivedAt?: string | null }>(
        `/api/${kind}/${encodeURIComponent(id)}/${action}`,
        {},
      )
      .pipe(map((body) => ({ id: body.id, archivedAt: body.archivedAt ?? null })));
  }

  /** Deletes a record; the API refuses (409, with the reason) while anything refers to it. */
  delete(kind: ArchivableKind, id: string): Observable<void> {
    return this.http.delete(`/api/${kind}/${encodeURIComponent(id)}`).pipe(map(() => undefined));
  }
}
