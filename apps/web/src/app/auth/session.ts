import { HttpClient } from '@angular/common/http';
import { computed, inject, Injectable, signal } from '@angular/core';
import { Router } from '@angular/router';
import {
  catchError,
  defer,
  finalize,
  firstValueFrom,
  from,
  map,
  type Observable,
  of,
  shareReplay,
  switchMap,
} from 'rxjs';
import {
  type AcceptInvitation,
  type AcceptInvitationExisting,
  type EmailSent,
  emailSentSchema,
  type Membership,
  type Role,
  type Session as SessionBody,
  sessionSchema,
  type SignIn,
  type SignUp,
  type SwitchWorkshop,
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
  private readonly router = inject(Router);
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
  /**
   * The active workshop's id, or null. Anything kept per workshop (a cache, a page's reads) follows
   * this signal: it changes only when the person switches workshop or signs out.
   */
  readonly workshopId = computed<string | null>(() => this.user()?.workshop.id ?? null);
  /** Every workshop the signed-in person belongs to, with their role there (sorted by name). */
  readonly memberships = computed<readonly Membership[]>(() => this.user()?.memberships ?? []);

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
   * Accepts an invitation with the password of the account the invited address already has; the
   * invitation adds a membership, and the session opens in the invited workshop.
   */
  acceptInvitationExisting(input: AcceptInvitationExisting): Observable<User> {
    return this.start(this.http.post<unknown>('/api/auth/invitations/accept', input));
  }

  /**
   * Moves to another of the person's workshops. First goes Home, so a page with unsaved changes
   * can still ask (and the member can stay: then nothing is switched and the result is null), and
   * so no page of the workshop left stays open; then `POST /api/auth/workshop` answers a new
   * session (access token, refresh cookie, user) for that workshop, which replaces this one.
   * Everything kept per workshop follows {@link workshopId}; the shell rebuilds the page and says
   * "Now working in …" (not this service: the snack bar would join the initial bundle). A refusal
   * (not one of their workshops) errors as ApiError.
   */
  switchWorkshop(workshopId: string): Observable<User | null> {
    // Nothing happens until subscribed, like every other call here.
    const home = defer(() => (this.atHome() ? of(true) : from(this.router.navigateByUrl('/'))));
    return home.pipe(
      switchMap((left) => {
        if (!left) return of(null);
        const body: SwitchWorkshop = { workshopId };
        return this.start(
          // The refresh cookie (path /api/auth, same origin) comes along as it does for refresh:
          // the API revokes it and sets a new one for the new workshop.
          this.http.post<unknown>('/api/auth/workshop', body),
        );
      }),
    );
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

  /** Whether the page open is Home (whatever its query or fragment). */
  private atHome(): boolean {
    return this.router.parseUrl(this.router.url).root.children['primary'] === undefined;
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
