import { HttpClient, type HttpEvent, httpResource } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { map, type Observable } from 'rxjs';
import { documentListSchema, documentStatusSchema, type DocumentUpload } from '@batchproof/shared';
import { idempotencyHeaders } from '../http/submission-key';

/** Whose documents: exactly one material or one lot. */
export interface DocumentOwner {
  materialId?: string;
  lotId?: string;
  /** Whether archived documents are listed too. */
  includeArchived?: boolean;
}

/** Supplier documents on materials and lots. Reads are resources; call them in a field. */
@Injectable({ providedIn: 'root' })
export class DocumentsApi {
  private readonly http = inject(HttpClient);

  /** The documents of one material or lot, newest first as the API sends them. */
  list(owner: () => DocumentOwner | undefined) {
    return httpResource(
      () => {
        const o = owner();
        if (!o?.materialId && !o?.lotId) return undefined;
        const params: Record<string, string> = o.materialId
          ? { materialId: o.materialId }
          : { lotId: o.lotId! };
        if (o.includeArchived) params['includeArchived'] = 'true';
        return { url: '/api/documents', params };
      },
      { parse: (body) => documentListSchema.parse(body).items },
    );
  }

  /** Which of a material's expected documents are missing or older than a year. */
  status(materialId: () => string | undefined) {
    return httpResource(
      () => {
        const id = materialId();
        return id ? `/api/materials/${encodeURIComponent(id)}/document-status` : undefined;
      },
      { parse: (body) => documentStatusSchema.parse(body) },
    );
  }

  /**
   * Uploads a file with its metadata as multipart form data. Emits the request's events so the
   * caller can show progress; the last one is the response with the stored document. `key` is
   * the submission's Idempotency-Key, so a retried upload stores the file once.
   */
  upload(fields: DocumentUpload, file: File, key?: string): Observable<HttpEvent<unknown>> {
    const body = new FormData();
    for (const [key, value] of Object.entries(fields)) {
      if (value !== undefined && value !== null) body.append(key, String(value));
    }
    body.append('file', file, file.name);
    return this.http.post<unknown>('/api/documents', body, {
      headers: idempotencyHeaders(key),
      reportProgress: true,
      observe: 'events',
    });
  }

  /** The stored file, for saving or opening; the API needs the bearer token, so no plain link. */
  content(id: string): Observable<Blob> {
    return this.http.get(`/api/documents/${encodeURIComponent(id)}/content`, {
      responseType: 'blob',
    });
  }

  remove(id: string): Observable<void> {
    return this.http.delete(`/api/documents/${encodeURIComponent(id)}`).pipe(map(() => undefined));
  }
}
