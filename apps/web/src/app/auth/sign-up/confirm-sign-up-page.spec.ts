import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Component, provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { provideRouter, Router } from '@angular/router';
import { errorInterceptor } from '../../http/error-interceptor';
import ConfirmSignUpPage from './confirm-sign-up-page';

@Component({ template: '' })
class Elsewhere {}

async function openConfirm(token: string) {
  TestBed.configureTestingModule({
    providers: [
      provideZonelessChangeDetection(),
      provideRouter([{ path: '**', component: Elsewhere }]),
      provideHttpClient(withInterceptors([errorInterceptor])),
      provideHttpClientTesting(),
    ],
  });
  const fixture = TestBed.createComponent(ConfirmSignUpPage);
  fixture.componentRef.setInput('token', token);
  await fixture.whenStable();
  const loader = TestbedHarnessEnvironment.loader(fixture);
  return {
    fixture,
    open: async () =>
      (await loader.getHarness(MatButtonHarness.with({ text: 'Open my workshop' }))).click(),
    backend: TestBed.inject(HttpTestingController),
  };
}

describe('ConfirmSignUpPage', () => {
  beforeEach(() => localStorage.clear());

  it('creates nothing on load; the click sends the token and goes home signed in', async () => {
    const page = await openConfirm('a-token-from-the-link-0123456789');
    page.backend.expectNone('/api/auth/sign-up/confirm');
    await page.open();

    const req = page.backend.expectOne('/api/auth/sign-up/confirm');
    expect(req.request.body).toEqual({ token: 'a-token-from-the-link-0123456789' });
    req.flush(
      {
        accessToken: 't',
        expiresIn: 900,
        user: {
          id: 'u1',
          name: 'Ada Marsh',
          email: 'ada@example.com',
          role: 'owner',
          workshop: { id: 'w1', name: 'Hollowmere Bathworks' },
          memberships: [{ workshopId: 'w1', workshopName: 'Hollowmere Bathworks', role: 'owner' }],
        },
      },
      { status: 201, statusText: 'Created' },
    );
    await page.fixture.whenStable();
    expect(TestBed.inject(Router).url).toBe('/');
  });

  it('shows the API message when the link was already used', async () => {
    const page = await openConfirm('a-spent-token-0123456789abcdef');
    await page.open();
    page.backend.expectOne('/api/auth/sign-up/confirm').flush(
      {
        error: {
          code: 'validation_failed',
          message: 'This sign-up link has expired or was already used.',
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await page.fixture.whenStable();
    const alert = page.fixture.nativeElement.querySelector('[role=alert]') as HTMLElement;
    expect(alert.textContent).toContain('already used');
  });
});
