import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter, type Routes, withComponentInputBinding } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import type { Membership, Role } from '@batchproof/shared';
import { errorInterceptor } from '../http/error-interceptor';
import { authInterceptor } from './auth-interceptor';
import { Session } from './session';

/* Test-only helpers for component specs; app code never imports this file. */

/**
 * Configures the TestBed as the app runs (zoneless, the router on `routes` with component input
 * binding, HttpClient with the app's interceptors, answered by the testing backend), then signs a
 * member of `role` in through the real {@link Session}, active in Hollowmere Bathworks (w1).
 * `otherMemberships` are the workshops they also belong to (none unless given). Returns the
 * testing backend.
 */
export async function signedInAs(
  role: Role,
  routes: Routes = [],
  otherMemberships: readonly Membership[] = [],
): Promise<HttpTestingController> {
  TestBed.configureTestingModule({
    providers: [
      provideZonelessChangeDetection(),
      provideRouter(routes, withComponentInputBinding()),
      provideHttpClient(withInterceptors([errorInterceptor, authInterceptor])),
      provideHttpClientTesting(),
    ],
  });
  const backend = TestBed.inject(HttpTestingController);
  const signingIn = firstValueFrom(
    TestBed.inject(Session).signIn({ email: 'me@example.com', password: 'x' }),
  );
  backend.expectOne('/api/auth/sign-in').flush({
    accessToken: 'token-1',
    expiresIn: 900,
    user: {
      id: 'u1',
      name: 'Ada Marsh',
      email: 'me@example.com',
      role,
      workshop: { id: 'w1', name: 'Hollowmere Bathworks' },
      memberships: [
        { workshopId: 'w1', workshopName: 'Hollowmere Bathworks', role },
        ...otherMemberships,
      ],
    },
  });
  await signingIn;
  return backend;
}
