import { HttpClient, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { firstValueFrom } from 'rxjs';
import type { Session as SessionBody } from '@batchproof/shared';
import { authInterceptor } from './auth-interceptor';
import { Session } from './session';

const session = (accessToken: string): SessionBody => ({
  accessToken,
  expiresIn: 900,
  user: {
    id: 'u1',
    name: 'Ada Marsh',
    email: 'ada@example.com',
    role: 'owner',
    workshop: { id: 'w1', name: 'Hollowmere Bathworks' },
    memberships: [{ workshopId: 'w1', workshopName: 'Hollowmere Bathworks', role: 'owner' }],
  },
});
const unauthenticated = {
  error: { code: 'unauthenticated', message: 'Your session has ended. Sign in again.' },
};

describe('authInterceptor', () => {
  let http: HttpClient;
  let backend: HttpTestingController;

  beforeEach(async () => {
    localStorage.clear();
    TestBed.configureTestingModule({
      providers: [
        provideZonelessChangeDetection(),
        provideHttpClient(withInterceptors([authInterceptor])),
        provideHttpClientTesting(),
      ],
    });
    http = TestBed.inject(HttpClient);
    backend = TestBed.inject(HttpTestingController);
    const signingIn = firstValueFrom(
      TestBed.inject(Session).signIn({ email: 'ada@example.com', password: 'x' }),
    );
    backend.expectOne('/api/auth/sign-in').flush(session('token-1'));
    await signingIn;
  });

  afterEach(() => backend.verify());

  it('adds the bearer token to API calls', async () => {
    const me = firstValueFrom(http.get('/api/me'));
    const req = backend.expectOne('/api/me');
    expect(req.request.headers.get('Authorization')).toBe('Bearer token-1');
    req.flush({ ok: true });
    expect(await me).toEqual({ ok: true });
  });

  it('leaves the auth routes alone, so a refused sign-in never triggers a refresh', async () => {
    const signIn = firstValueFrom(http.post('/api/auth/sign-in', {}));
    const req = backend.expectOne('/api/auth/sign-in');
    expect(req.request.headers.has('Authorization')).toBe(false);
    req.flush(unauthenticated, { status: 401, statusText: 'Unauthorized' });
    await expect(signIn).rejects.toMatchObject({ status: 401 });
    backend.expectNone('/api/auth/refresh');
  });

  it('adds the bearer token to the auth routes that act for the signed-in person', async () => {
    for (const url of ['/api/auth/workshop', '/api/auth/sign-out-everywhere']) {
      const call = firstValueFrom(http.post(url, {}));
      const req = backend.expectOne(url);
      expect(req.request.headers.get('Authorization')).toBe('Bearer token-1');
      req.flush({ ok: true });
      await call;
    }
  });

  it('on 401 refreshes once and retries the call with the new token', async () => {
    const me = firstValueFrom(http.get('/api/me'));
    backend
      .expectOne('/api/me')
      .flush(unauthenticated, { status: 401, statusText: 'Unauthorized' });

    backend.expectOne({ method: 'POST', url: '/api/auth/refresh' }).flush(session('token-2'));
    const retry = backend.expectOne('/api/me');
    expect(retry.request.headers.get('Authorization')).toBe('Bearer token-2');
    retry.flush({ ok: true });

    expect(await me).toEqual({ ok: true });
    expect(TestBed.inject(Session).accessToken()).toBe('token-2');
  });

  it('shares one refresh between calls that fail together', async () => {
    const first = firstValueFrom(http.get('/api/members'));
    const second = firstValueFrom(http.get('/api/me'));
    backend
      .expectOne('/api/members')
      .flush(unauthenticated, { status: 401, statusText: 'Unauthorized' });
    backend
      .expectOne('/api/me')
      .flush(unauthenticated, { status: 401, statusText: 'Unauthorized' });

    backend.expectOne('/api/auth/refresh').flush(session('token-2'));
    backend.expectOne('/api/members').flush({ items: [] });
    backend.expectOne('/api/me').flush({ ok: true });

    expect(await first).toEqual({ items: [] });
    expect(await second).toEqual({ ok: true });
  });

  it('when the refresh is refused too, passes the 401 on and ends the session here', async () => {
    const me = firstValueFrom(http.get('/api/me'));
    backend
      .expectOne('/api/me')
      .flush(unauthenticated, { status: 401, statusText: 'Unauthorized' });
    backend
      .expectOne('/api/auth/refresh')
      .flush(unauthenticated, { status: 401, statusText: 'Unauthorized' });

    await expect(me).rejects.toMatchObject({ status: 401 });
    backend.expectNone('/api/me');
    expect(TestBed.inject(Session).signedIn()).toBe(false);
  });

  it('does not refresh again when the retried call is refused', async () => {
    const me = firstValueFrom(http.get('/api/me'));
    backend
      .expectOne('/api/me')
      .flush(unauthenticated, { status: 401, statusText: 'Unauthorized' });
    backend.expectOne('/api/auth/refresh').flush(session('token-2'));
    backend
      .expectOne('/api/me')
      .flush(unauthenticated, { status: 401, statusText: 'Unauthorized' });

    await expect(me).rejects.toMatchObject({ status: 401 });
    backend.expectNone('/api/auth/refresh');
  });
});
