import { HttpClient, httpResource } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { map, type Observable } from 'rxjs';
import {
  type AssessmentDetail,
  assessmentListSchema,
  type AssessmentSign,
  type AssessmentUpdate,
  memberListSchema,
  type SafetyNotes,
  type SafetyNotesRecord,
  safetyNotesRecordSchema,
  type ShareRecord,
  shareListSchema,
  shareRecordSchema,
} from '@batchproof/shared';
import { idempotencyHeaders } from '../http/submission-key';

const assessmentUrl = (id: string) => `/api/assessments/${encodeURIComponent(id)}`;
const notesUrl = (formulaId: string, n: number) =>
  `/api/formulas/${encodeURIComponent(formulaId)}/versions/${n}/safety-notes`;

/**
 * Safety assessments: shares of formula versions with an assessor, the assessments written from
 * them (with their packet) and the maker's safety notes. Reads are resources.
 */
@Injectable({ providedIn: 'root' })
export class AssessmentsApi {
  private readonly http = inject(HttpClient);

  /** The assessments the caller may see and the shares waiting for one. */
  assessments() {
    return httpResource(() => '/api/assessments', {
      parse: (body) => assessmentListSchema.parse(body),
    });
  }

  /** Live shares (the owner's list to unshare from), read only while `enabled`. */
  shares(enabled: () => boolean) {
    return httpResource(() => (enabled() ? '/api/assessment-shares' : undefined), {
      parse: (body) => shareListSchema.parse(body).items,
    });
  }

  /** One assessment with its packet, read while `id` gives one. */
  assessment(id: () => string | undefined) {
    // AssessmentDetail is an interface of the contract (no schema): the packet is the API's own.
    return httpResource<AssessmentDetail>(() => (id() ? assessmentUrl(id()!) : undefined));
  }

  /** The workshop's members with the assessor role, read only while `enabled`. */
  assessors(enabled: () => boolean) {
    return httpResource(
      () => (enabled() ? { url: '/api/members', params: { sort: 'name', dir: 'asc' } } : undefined),
      {
        parse: (body) => memberListSchema.parse(body).items.filter((m) => m.role === 'assessor'),
      },
    );
  }

  /** The maker's notes (Part A items 2–5) of one version, read while `at` gives one. */
  safetyNotes(at: () => { formulaId: string; n: number } | undefined) {
    return httpResource(() => (at() ? notesUrl(at()!.formulaId, at()!.n) : undefined), {
      parse: (body) => safetyNotesRecordSchema.parse(body),
    });
  }

  /** Starts the assessment of a share (the assessor); `key` keeps a retry from starting two. */
  start(shareId: string, key?: string): Observable<AssessmentDetail> {
    return this.http.post<AssessmentDetail>(
      '/api/assessments',
      { shareId },
      { headers: idempotencyHeaders(key) },
    );
  }

  /** Saves the assessor's draft. */
  update(id: string, input: AssessmentUpdate): Observable<AssessmentDetail> {
    return this.http.put<AssessmentDetail>(assessmentUrl(id), input);
  }

  /** Signs the assessment over the packet hash the assessor read. */
  sign(id: string, input: AssessmentSign): Observable<AssessmentDetail> {
    return this.http.post<AssessmentDetail>(`${assessmentUrl(id)}/sign`, input);
  }

  /** The packet as a PDF (the signed one, or the live draft marked as such). */
  packetPdf(id: string): Observable<Blob> {
    return this.http.get(`${assessmentUrl(id)}/packet.pdf`, { responseType: 'blob' });
  }

  /** Shares a version with an assessor member (the owner). */
  share(versionId: string, assessorId: string, key?: string): Observable<ShareRecord> {
    return this.http
      .post<unknown>(
        '/api/assessment-shares',
        { versionId, assessorId },
        { headers: idempotencyHeaders(key) },
      )
      .pipe(map((body) => shareRecordSchema.parse(body)));
  }

  /** Takes a share back: the assessor no longer sees the version. */
  unshare(shareId: string): Observable<void> {
    return this.http
      .delete(`/api/assessment-shares/${encodeURIComponent(shareId)}`)
      .pipe(map(() => undefined));
  }

  /** Replaces a version's safety notes (writers). */
  saveSafetyNotes(formulaId: string, n: number, notes: SafetyNotes): Observable<SafetyNotesRecord> {
    return this.http
      .put<unknown>(notesUrl(formulaId, n), notes)
      .pipe(map((body) => safetyNotesRecordSchema.parse(body)));
  }
}
