import { HttpClient, httpResource } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { map, type Observable } from 'rxjs';
import {
  invitationPreviewSchema,
  type PasswordResetComplete,
  type PasswordResetRequest,
} from '@batchproof/shared';

/** The signed-out calls besides the session itself: invitation previews and password resets. */
@Injectable({ providedIn: 'root' })
export class AuthApi {
  private readonly http = inject(HttpClient);

  /** Who invited whom to which workshop, for an invitation link's token. Call in a constructor. */
  invitation(token: () => string | undefined) {
    return httpResource(
      () => {
        const value = token();
        return value ? `/api/auth/invitations/${encodeURIComponent(value)}` : undefined;
      },
      { parse: (body) => invitationPreviewSchema.parse(body) },
    );
  }

  /** Asks for a reset link; the API answers the same whether or not the address has an account. */
  requestPasswordReset(input: PasswordResetRequest): Observable<void> {
    return this.http.post('/api/auth/password-reset/request', input).pipe(map(() => undefined));
  }

  /** Sets a new password with the token from the reset link. */
  completePasswordReset(input: PasswordResetComplete): Observable<void> {
    return this.http.post('/api/auth/password-reset/complete', input).pipe(map(() => undefined));
  }
}
