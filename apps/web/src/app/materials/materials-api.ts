import { HttpClient, httpResource } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { map, type Observable, Subject, tap } from 'rxjs';
import {
  type Material,
  type MaterialCreate,
  materialImportPreviewSchema,
  type MaterialImportPreview,
  materialImportResultSchema,
  type MaterialImportResult,
  type MaterialListQuery,
  materialPageSchema,
  materialSchema,
} from '@batchproof/shared';

/** The workshop's materials. Reads are resources; call them in a field. */
@Injectable({ providedIn: 'root' })
export class MaterialsApi {
  private readonly http = inject(HttpClient);
  private readonly savedMaterials = new Subject<Material>();
  /**
   * Every material this app saves, as the API stored it, so screens holding a copy (the formula
   * editor's live check) replace theirs. An event stream rather than a signal: two saves in a row
   * must both arrive, where a signal would only keep the last.
   */
  readonly saved: Observable<Material> = this.savedMaterials.asObservable();

  /** One page of materials, filtered, sorted and paged on the server. */
  page(query: () => MaterialListQuery) {
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
        if (q.category) params['category'] = q.category;
        if (q.supplierId) params['supplierId'] = q.supplierId;
        return { url: '/api/materials', params };
      },
      { parse: (body) => materialPageSchema.parse(body) },
    );
  }

  /** One material with its certificate data and calibration summary; nothing while `id` is unset. */
  material(id: () => string | undefined) {
    return httpResource(
      () => {
        const value = id();
        return value ? `/api/materials/${encodeURIComponent(value)}` : undefined;
      },
      { parse: (body) => materialSchema.parse(body) },
    );
  }

  create(input: MaterialCreate): Observable<Material> {
    return this.http.post<unknown>('/api/materials', input).pipe(
      map((body) => materialSchema.parse(body)),
      tap((material) => this.savedMaterials.next(material)),
    );
  }

  update(id: string, input: MaterialCreate): Observable<Material> {
    return this.http.put<unknown>(`/api/materials/${encodeURIComponent(id)}`, input).pipe(
      map((body) => materialSchema.parse(body)),
      tap((material) => this.savedMaterials.next(material)),
    );
  }

  /** Every material as CSV text, in the columns the import reads back. */
  exportCsv(): Observable<Blob> {
    return this.http.get('/api/materials/export.csv', { responseType: 'blob' });
  }

  /** Checks a CSV file row by row; nothing is written. */
  previewImport(file: File): Observable<MaterialImportPreview> {
    return this.http
      .post<unknown>('/api/materials/import/preview', csvBody(file))
      .pipe(map((body) => materialImportPreviewSchema.parse(body)));
  }

  /** Imports a CSV file; the API writes every row or none. */
  import(file: File): Observable<MaterialImportResult> {
    return this.http
      .post<unknown>('/api/materials/import', csvBody(file))
      .pipe(map((body) => materialImportResultSchema.parse(body)));
  }
}

function csvBody(file: File): FormData {
  const body = new FormData();
  body.append('file', file, file.name);
  return body;
}
