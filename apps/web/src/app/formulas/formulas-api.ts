import { HttpClient, httpResource } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { map, type Observable } from 'rxjs';
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
  type ReleaseRequest,
  type ScaleRequest,
  scaledVersionSchema,
  type ScaledVersion,
  versionComparisonSchema,
} from '@batchproof/shared';
import { idempotencyHeaders } from '../http/submission-key';

const enc = encodeURIComponent;
const formulaUrl = (id: string) => `/api/formulas/${enc(id)}`;
const versionUrl = (id: string, n: number) => `${formulaUrl(id)}/versions/${n}`;

/**
 * The workshop's formulas and their versions. Reads are resources; call them in a field. The
 * materials their lines name are read through `MaterialsApi`, the app's one read model of them.
 */
@Injectable({ providedIn: 'root' })
export class FormulasApi {
  private readonly http = inject(HttpClient);

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
        if (q.includeArchived) params['includeArchived'] = 'true';
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
