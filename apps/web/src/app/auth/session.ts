import { HttpClient } from '@angular/common/http';
import { computed, inject, Injectable, signal } from '@angular/core';
import { catchError, finalize, firstValueFrom, map, type Observable, of, shareReplay } from 'rxjs';
import {
  type AcceptInvitation,
  type EmailSent,
  emailSentSchema,
  type Role,
  type Session as SessionBody,
  sessionSchema,
  type SignIn,
  type SignUp,
  type User,
} from '@batchproof/shared';

/**
 * Remembers, across page loads, that this browser had a session. The refresh cookie itself is
 * httpOnly, so without this hint every signed-out visit would start with a refused refresh.
 */
const SIGNED_IN_HINT = 'batchproof.signed-in';

/**
 * The signed-in user and their short-lived access token, kept in signals. The refresh token
 * lives in an httpOnly cookie the API sets; `refresh()` trades it for a new access token.
 */
@Injectable({ providedIn: 'root' })
export class Session {
  private readonly http = inject(HttpClient);
  private readonly current = signal<SessionBody | null>(null);
  private refreshing: Observable<string | null> | null = null;
  private restoring: Promise<void> | null = null;

  /** The signed-in user with their workshop and role, or null. */
  readonly user = computed<User | null>(() => this.current()?.user ?? null);
  /** The bearer token for API calls, or null. */
  readonly accessToken = computed(() => this.current()?.accessToken ?? null);
  /** Whether someone is signed in. */
  readonly signedIn = computed(() => this.current() !== null);
  /** The signed-in user's role in their workshop, or null. */
  readonly role = computed<Role | null>(() => this.user()?.role ?? null);

  /** Signs in with e-mail and password. */
  signIn(input: SignIn): Observable<User> {
    return this.start(this.http.post<unknown>('/api/auth/sign-in', input));
  }

  /**
   * Asks for a new workshop. The API e-mails a confirmation link and answers the same whether or
   * not the address already has an account; the workshop exists once the link is opened.
   */
  signUp(input: SignUp): Observable<EmailSent> {
    return this.http
      .post<unknown>('/api/auth/sign-up', input)
      .pipe(map((body) => emailSentSchema.parse(body)));
  }

  /** Opens a sign-up confirmation link: creates the workshop and signs its owner in. */
  confirmSignUp(token: string): Observable<User> {
    return this.start(this.http.post<unknown>('/api/auth/sign-up/confirm', { token }));
  }

  /** Accepts an invitation with a name and password, and signs the new member in. */
  acceptInvitation(input: AcceptInvitation): Observable<User> {
    return this.start(this.http.post<unknown>('/api/auth/invitations/accept', input));
  }

  /**
   * Trades the refresh cookie for a new access token. Emits the token, or null when the
   * session has ended (and then signs out locally). Concurrent callers share one request,
   * because the API spends each refresh token once.
   */
  refresh(): Observable<string | null> {
    this.refreshing ??= this.http.post<unknown>('/api/auth/refresh', null).pipe(
      map((body) => this.accept(body).accessToken),
      // Expected: 401 when the cookie is missing, spent or expired; any failure ends the session.
      catchError(() => {
        this.clear();
        return of(null);
      }),
      finalize(() => (this.refreshing = null)),
      shareReplay({ bufferSize: 1, refCount: false }),
    );
    return this.refreshing;
  }

  /** Restores the session from the refresh cookie, once per page load. */
  restore(): Promise<void> {
    this.restoring ??= hint()?.getItem(SIGNED_IN_HINT)
      ? firstValueFrom(this.refresh()).then(() => undefined)
      : Promise.resolve();
    return this.restoring;
  }

  /** Ends the session on the server (best effort) and here. */
  signOut(): Observable<void> {
    return this.http.post('/api/auth/sign-out', null).pipe(
      // Signing out locally must happen even when the server cannot be reached.
      catchError(() => of(null)),
      map(() => this.clear()),
    );
  }

  /** Ends every session of this user on every device (access tokens included), then here. */
  signOutEverywhere(): Observable<void> {
    return this.http.post('/api/auth/sign-out-everywhere', null).pipe(map(() => this.clear()));
  }

  /** Whether the signed-in user holds one of `roles`. */
  hasRole(roles: readonly Role[]): boolean {
    const role = this.role();
    return role !== null && roles.includes(role);
  }

  private start(request: Observable<unknown>): Observable<User> {
    return request.pipe(map((body) => this.accept(body).user));
  }

  private accept(body: unknown): SessionBody {
    const session = sessionSchema.parse(body);
    this.current.set(session);
    hint()?.setItem(SIGNED_IN_HINT, '1');
    return session;
  }

  private clear(): void {
    this.current.set(null);
    hint()?.removeItem(SIGNED_IN_HINT);
  }
}

function hint(): Storage | undefined {
  return globalThis.localStorage;
}
