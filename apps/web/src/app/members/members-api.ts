import { HttpClient, httpResource } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { map, type Observable } from 'rxjs';
import {
  type Invitation,
  type InvitationCreate,
  invitationListSchema,
  invitationSchema,
  type Member,
  type MemberListQuery,
  memberListSchema,
  memberSchema,
  type Role,
} from '@batchproof/shared';

/** The workshop's members and invitations. Reads are resources; call them in a constructor. */
@Injectable({ providedIn: 'root' })
export class MembersApi {
  private readonly http = inject(HttpClient);

  /** The members, sorted on the server by `query`. */
  members(query: () => MemberListQuery) {
    return httpResource(() => ({ url: '/api/members', params: { ...query() } }), {
      parse: (body) => memberListSchema.parse(body).items,
    });
  }

  /** Pending invitations, read only while `enabled` (the API lets owners alone see them). */
  invitations(enabled: () => boolean) {
    return httpResource(() => (enabled() ? '/api/members/invitations' : undefined), {
      parse: (body) => invitationListSchema.parse(body).items,
    });
  }

  /** Invites someone by e-mail; the API sends the link. */
  invite(input: InvitationCreate): Observable<Invitation> {
    return this.http
      .post<unknown>('/api/members/invitations', input)
      .pipe(map((body) => invitationSchema.parse(body)));
  }

  revokeInvitation(id: string): Observable<void> {
    return this.http
      .delete(`/api/members/invitations/${encodeURIComponent(id)}`)
      .pipe(map(() => undefined));
  }

  changeRole(id: string, role: Role): Observable<Member> {
    return this.http
      .patch<unknown>(`/api/members/${encodeURIComponent(id)}`, { role })
      .pipe(map((body) => memberSchema.parse(body)));
  }

  remove(id: string): Observable<void> {
    return this.http.delete(`/api/members/${encodeURIComponent(id)}`).pipe(map(() => undefined));
  }
}
