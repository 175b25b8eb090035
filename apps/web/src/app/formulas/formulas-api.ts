import { HttpClient, httpResource } from '@angular/common/http';
import { inject, Injectable, type Signal, signal } from '@angular/core';
import { rxResource, takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { forkJoin, map, type Observable, of, shareReplay } from 'rxjs';
import {
  formulaPageSchema,
  type Formula,
  type FormulaCreate,
  type FormulaListQuery,
  formulaSchema,
  type FormulaUpdate,
  type FormulaVersion,
  type FormulaVersionInput,
  formulaVersionSchema,
  type Material,
  MAX_MATERIAL_IDS,
  materialPageSchema,
  materialsByIdSchema,
  type ReleaseRequest,
  type ScaleRequest,
  scaledVersionSchema,
  type ScaledVersion,
  versionComparisonSchema,
} from '@batchproof/shared';
import { idempotencyHeaders } from '../http/submission-key';
import { MaterialsApi } from '../materials/materials-api';

const enc = encodeURIComponent;
const formulaUrl = (id: string) => `/api/formulas/${enc(id)}`;
const versionUrl = (id: string, n: number) => `${formulaUrl(id)}/versions/${n}`;

/** The workshop's formulas and their versions. Reads are resources; call them in a field. */
@Injectable({ providedIn: 'root' })
export class FormulasApi {
  private readonly http = inject(HttpClient);
  /** Full material records already asked for, shared by every line naming them. */
  private readonly materialCache = new Map<string, Observable<Material>>();
  /** Moves on whenever a cached material is replaced, so open editors read it again. */
  private readonly cacheRevision = signal(0);

  constructor() {
    // A material saved in the materials screens replaces the cached copy: the editor's live
    // check must read what the server will read on the next save, never a stale record.
    inject(MaterialsApi)
      .saved.pipe(takeUntilDestroyed())
      .subscribe((material) => {
        if (!this.materialCache.has(material.id)) return;
        this.materialCache.set(material.id, of(material));
        this.cacheRevision.update((n) => n + 1);
      });
  }

  /** One page of formulas, filtered, sorted and paged on the server. */
  list(query: () => FormulaListQuery) {
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
        if (q.productType) params['productType'] = q.productType;
        return { url: '/api/formulas', params };
      },
      { parse: (body) => formulaPageSchema.parse(body) },
    );
  }

  /** A formula with its version history. */
  formula(id: () => string | undefined) {
    return httpResource(
      () => {
        const i = id();
        return i ? formulaUrl(i) : undefined;
      },
      { parse: (body) => formulaSchema.parse(body) },
    );
  }

  /** One version with its lines, profile and the server's stored evaluation. */
  version(key: () => { id: string; n: number } | undefined) {
    return httpResource(
      () => {
        const k = key();
        return k ? versionUrl(k.id, k.n) : undefined;
      },
      { parse: (body) => formulaVersionSchema.parse(body) },
    );
  }

  /** What changed between two versions: lines, and per market declarations and findings. */
  compare(key: () => { id: string; from: number; to: number } | undefined) {
    return httpResource(
      () => {
        const k = key();
        return k
          ? { url: `${formulaUrl(k.id)}/compare`, params: { from: k.from, to: k.to } }
          : undefined;
      },
      { parse: (body) => versionComparisonSchema.parse(body) },
    );
  }

  /** Materials whose name, INCI or CAS contains `q`, for the line picker (no request while null). */
  searchMaterials(q: () => string | null) {
    return httpResource(
      () => {
        const text = q();
        if (text === null) return undefined;
        const params: Record<string, string | number> = { pageSize: 10, sort: 'tradeName' };
        if (text.trim()) params['q'] = text.trim();
        return { url: '/api/materials', params };
      },
      { parse: (body) => materialPageSchema.parse(body).items },
    );
  }

  /**
   * The full records (blend components, certificates, weights per volume) of the materials in
   * `ids`, keyed by id: what the live check needs. The ids not cached yet are asked for in one
   * request, each once per page load, and read again from the cache when one of them is saved in
   * the materials screens.
   */
  materials(ids: Signal<readonly string[]>) {
    return rxResource({
      params: () => ({ ids: ids(), revision: this.cacheRevision() }),
      stream: ({ params }) => {
        if (params.ids.length === 0) return of(new Map<string, Material>());
        this.readUncached(params.ids);
        return forkJoin(params.ids.map((id) => this.materialCache.get(id)!)).pipe(
          map((list) => new Map(list.map((m) => [m.id, m]))),
        );
      },
    });
  }

  /** One material's full record, cached for the life of the app (a save here replaces it). */
  material(id: string): Observable<Material> {
    this.readUncached([id]);
    return this.materialCache.get(id)!;
  }

  /**
   * Caches a read of every id in `ids` not cached yet: one `GET /api/materials?ids=…` for them
   * all (in chunks of the most the API takes), in place of one request per material.
   */
  private readUncached(ids: readonly string[]) {
    const missing = [...new Set(ids)].filter((id) => !this.materialCache.has(id));
    for (let i = 0; i < missing.length; i += MAX_MATERIAL_IDS) {
      const chunk = missing.slice(i, i + MAX_MATERIAL_IDS);
      const found = this.http
        .get<unknown>('/api/materials', { params: { ids: chunk.join(',') } })
        .pipe(
          map((body) => new Map(materialsByIdSchema.parse(body).items.map((m) => [m.id, m]))),
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
        this.materialCache.set(id, one);
        // A failed or missing read is not cached, so the next look tries again.
        one.subscribe({ error: () => this.materialCache.delete(id) });
      }
    }
  }

  /** Creates a formula with its first draft; `key` makes a retried submission create it once. */
  create(input: FormulaCreate, key?: string): Observable<Formula> {
    return this.http
      .post<unknown>('/api/formulas', input, { headers: idempotencyHeaders(key) })
      .pipe(map((body) => formulaSchema.parse(body)));
  }

  update(id: string, input: FormulaUpdate): Observable<Formula> {
    return this.http
      .patch<unknown>(formulaUrl(id), input)
      .pipe(map((body) => formulaSchema.parse(body)));
  }

  /** Replaces a draft's lines, profile and notes; the server re-evaluates it. */
  saveDraft(id: string, n: number, input: FormulaVersionInput): Observable<FormulaVersion> {
    return this.http
      .put<unknown>(versionUrl(id, n), input)
      .pipe(map((body) => formulaVersionSchema.parse(body)));
  }

  /** Releases a draft; 409 when it has blocking findings and no owner's override. */
  release(id: string, n: number, request: ReleaseRequest = {}): Observable<FormulaVersion> {
    return this.http
      .post<unknown>(`${versionUrl(id, n)}/release`, request)
      .pipe(map((body) => formulaVersionSchema.parse(body)));
  }

  /** Starts a new draft copied from version `fromVersion`. */
  newDraft(id: string, fromVersion: number, key?: string): Observable<FormulaVersion> {
    return this.http
      .post<unknown>(
        `${formulaUrl(id)}/versions`,
        { fromVersion },
        { headers: idempotencyHeaders(key) },
      )
      .pipe(map((body) => formulaVersionSchema.parse(body)));
  }

  /** Grams per line for a batch of units × unit mass (or a total), plus a loss allowance. */
  scale(id: string, n: number, request: ScaleRequest): Observable<ScaledVersion> {
    return this.http
      .post<unknown>(`${versionUrl(id, n)}/scale`, request)
      .pipe(map((body) => scaledVersionSchema.parse(body)));
  }
}
