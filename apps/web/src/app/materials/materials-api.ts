import { HttpClient, httpResource } from '@angular/common/http';
import { effect, inject, Injectable, type Signal, signal, untracked } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { forkJoin, map, type Observable, of, shareReplay, tap } from 'rxjs';
import {
  type Material,
  type MaterialCreate,
  materialImportPreviewSchema,
  type MaterialImportPreview,
  materialImportResultSchema,
  type MaterialImportResult,
  type MaterialListQuery,
  MAX_MATERIAL_IDS,
  materialPageSchema,
  materialSchema,
  materialsByIdSchema,
} from '@batchproof/shared';
import { Session } from '../auth/session';

/** How many materials a picker offers at once; typing narrows them. */
const PICKER_OPTIONS = 20;

/**
 * The workshop's materials, and the app's one read model of them: full records are read through
 * one cache (many ids in one `GET /api/materials?ids=`), which every save and deletion made here
 * replaces, so the formula editor's live check and the pickers never show a stale record. Reads are
 * resources; call them in a field.
 */
@Injectable({ providedIn: 'root' })
export class MaterialsApi {
  private readonly http = inject(HttpClient);
  /** Reads of full records by id, each shared by every screen that asks; a failed one is dropped. */
  private readonly reads = new Map<string, Observable<Material>>();
  /** The full records read or saved so far, by id, for screens that only peek (a picker's name). */
  private readonly records = signal<ReadonlyMap<string, Material>>(new Map());
  /** Moves on whenever a record is replaced or removed, so open resources read it again. */
  private readonly revision = signal(0);

  constructor() {
    // The records belong to the active workshop: switching workshop (or signing out) drops them.
    const session = inject(Session);
    let workshopId = untracked(session.workshopId);
    effect(() => {
      const now = session.workshopId();
      if (now === workshopId) return;
      workshopId = now;
      untracked(() => this.forgetAll());
    });
  }

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
        if (q.includeArchived) params['includeArchived'] = 'true';
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

  /**
   * Materials whose trade name, INCI, US name, CAS or blend component contains `q` (all of them
   * for blank `q`), those matching on their own names first, for a picker. Nothing is read while
   * `q` is undefined.
   */
  search(q: () => string | undefined) {
    return httpResource(
      () => {
        const text = q();
        if (text === undefined) return undefined;
        const params: Record<string, string | number> = {
          sort: 'tradeName',
          pageSize: PICKER_OPTIONS,
        };
        if (text.trim()) params['q'] = text.trim();
        return { url: '/api/materials', params };
      },
      { parse: (body) => materialPageSchema.parse(body).items },
    );
  }

  /**
   * The full records (blend components, certificates, weights per volume) of the materials in
   * `ids`, keyed by id: what the live check needs. The ids not cached yet are read in one request,
   * each once per page load, and read again from the cache when one of them is saved.
   */
  materials(ids: Signal<readonly string[]>) {
    return rxResource({
      params: () => ({ ids: ids(), revision: this.revision() }),
      stream: ({ params }) => {
        if (params.ids.length === 0) return of(new Map<string, Material>());
        this.readUncached(params.ids);
        return forkJoin(params.ids.map((id) => this.reads.get(id)!)).pipe(
          map((list) => new Map(list.map((m) => [m.id, m]))),
        );
      },
    });
  }

  /** One material's full record, from the cache (read once, replaced on save). */
  record(id: string): Observable<Material> {
    this.readUncached([id]);
    return this.reads.get(id)!;
  }

  /**
   * The cached record of `id`, or undefined when it has not been read: a peek that never sends a
   * request. A signal read, so a caller's `computed` follows saves and deletions.
   */
  cached(id: string): Material | undefined {
    return this.records().get(id);
  }

  create(input: MaterialCreate): Observable<Material> {
    return this.http.post<unknown>('/api/materials', input).pipe(
      map((body) => materialSchema.parse(body)),
      tap((material) => this.remember(material)),
    );
  }

  update(id: string, input: MaterialCreate): Observable<Material> {
    return this.http.put<unknown>(`/api/materials/${encodeURIComponent(id)}`, input).pipe(
      map((body) => materialSchema.parse(body)),
      tap((material) => this.remember(material)),
    );
  }

  /** Deletes a material; the API refuses (409) while a lot, formula line or document uses it. */
  remove(id: string): Observable<void> {
    return this.http.delete(`/api/materials/${encodeURIComponent(id)}`).pipe(
      map(() => undefined),
      tap(() => this.forget(id)),
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

  /**
   * Imports a CSV file; the API writes every row or none. `existing: 'update'` updates the
   * materials on file that rows match, in place of adding copies. Cached records are read again.
   */
  import(file: File, existing: 'create' | 'update' = 'create'): Observable<MaterialImportResult> {
    const url =
      existing === 'update' ? '/api/materials/import?existing=update' : '/api/materials/import';
    return this.http.post<unknown>(url, csvBody(file)).pipe(
      map((body) => materialImportResultSchema.parse(body)),
      tap(() => this.forgetAll()),
    );
  }

  /** Replaces the cached copy of a material the API has just answered with. */
  private remember(material: Material): void {
    this.reads.set(material.id, of(material));
    this.store([material]);
    this.revision.update((n) => n + 1);
  }

  /** Drops a deleted material, so a later read asks the server (which answers it is gone). */
  private forget(id: string): void {
    this.reads.delete(id);
    this.records.update((records) => {
      const next = new Map(records);
      next.delete(id);
      return next;
    });
    this.revision.update((n) => n + 1);
  }

  /** Drops every cached record (an import may have changed any of them). */
  private forgetAll(): void {
    this.reads.clear();
    this.records.set(new Map());
    this.revision.update((n) => n + 1);
  }

  private store(materials: readonly Material[]): void {
    this.records.update((records) => {
      const next = new Map(records);
      for (const m of materials) next.set(m.id, m);
      return next;
    });
  }

  /**
   * Caches a read of every id in `ids` not cached yet: one `GET /api/materials?ids=…` for them
   * all (in chunks of the most the API takes), in place of one request per material.
   */
  private readUncached(ids: readonly string[]): void {
    const missing = [...new Set(ids)].filter((id) => !this.reads.has(id));
    for (let i = 0; i < missing.length; i += MAX_MATERIAL_IDS) {
      const chunk = missing.slice(i, i + MAX_MATERIAL_IDS);
      const found = this.http
        .get<unknown>('/api/materials', { params: { ids: chunk.join(',') } })
        .pipe(
          map((body) => materialsByIdSchema.parse(body).items),
          tap((items) => this.store(items)),
          map((items) => new Map(items.map((m) => [m.id, m]))),
          shareReplay({ bufferSize: 1, refCount: false }),
        );
      for (const id of chunk) {
        const one = found.pipe(
          map((byId) => {
            const material = byId.get(id);
            if (!material) throw new Error('That material is not in this workshop.');
            return material;
          }),
          shareReplay({ bufferSize: 1, refCount: false }),
        );
        this.reads.set(id, one);
        // A failed or missing read is not cached, so the next look tries again.
        one.subscribe({ error: () => this.reads.delete(id) });
      }
    }
  }
}

function csvBody(file: File): FormData {
  const body = new FormData();
  body.append('file', file, file.name);
  return body;
}
