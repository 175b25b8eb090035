import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Component, provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { provideRouter, Router, withComponentInputBinding } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import SignInPage from './sign-in-page';
import { errorInterceptor } from '../../http/error-interceptor';

@Component({ template: '' })
class Elsewhere {}

async function openSignIn(url = '/sign-in') {
  TestBed.configureTestingModule({
    providers: [
      provideZonelessChangeDetection(),
      provideRouter(
        [
          { path: 'sign-in', component: SignInPage },
          { path: '**', component: Elsewhere },
        ],
        withComponentInputBinding(),
      ),
      provideHttpClient(withInterceptors([errorInterceptor])),
      provideHttpClientTesting(),
    ],
  });
  const harness = await RouterTestingHarness.create();
  await harness.navigateByUrl(url, SignInPage);
  const loader = TestbedHarnessEnvironment.loader(harness.fixture);
  const field = (label: string) =>
    loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }));
  const fill = async (label: string, value: string) => {
    const control = (await (await field(label)).getControl()) as MatInputHarness;
    await control.setValue(value);
  };
  const submit = async () =>
    (await loader.getHarness(MatButtonHarness.with({ text: 'Sign in' }))).click();
  return { harness, field, fill, submit, backend: TestBed.inject(HttpTestingController) };
}

describe('SignInPage', () => {
  beforeEach(() => localStorage.clear());

  it("shows the server's field errors beside their fields", async () => {
    const page = await openSignIn();
    await page.fill('E-mail', 'ada@example.com');
    await page.fill('Password', 'whatever');
    await page.submit();

    const req = page.backend.expectOne('/api/auth/sign-in');
    expect(req.request.body).toEqual({ email: 'ada@example.com', password: 'whatever' });
    req.flush(
      {
        error: {
          code: 'validation_failed',
          message: 'Some fields need attention.',
          fieldErrors: {
            email: ['This address cannot receive mail.'],
            password: ['Password is required.'],
          },
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await page.harness.fixture.whenStable();

    expect(await (await page.field('E-mail')).getTextErrors()).toEqual([
      'This address cannot receive mail.',
    ]);
    expect(await (await page.field('Password')).getTextErrors()).toEqual(['Password is required.']);
    expect(page.harness.routeNativeElement?.querySelector('[role=alert]')?.textContent).toContain(
      'Some fields need attention.',
    );
    page.backend.verify();
  });

  it('shows a refused sign-in above the form and stays on the page', async () => {
    const page = await openSignIn();
    await page.fill('E-mail', 'ada@example.com');
    await page.fill('Password', 'wrong-password');
    await page.submit();

    page.backend.expectOne('/api/auth/sign-in').flush(
      {
        error: {
          code: 'unauthenticated',
          message: 'That e-mail and password do not match an account.',
        },
      },
      { status: 401, statusText: 'Unauthorized' },
    );
    await page.harness.fixture.whenStable();

    const alert = page.harness.routeNativeElement?.querySelector('[role=alert]');
    expect(alert?.textContent).toContain('That e-mail and password do not match an account.');
    expect(TestBed.inject(Router).url).toBe('/sign-in');
  });

  it('checks the fields with the shared schema before calling the API', async () => {
    const page = await openSignIn();
    await page.submit();

    expect(await (await page.field('E-mail')).getTextErrors()).toEqual([
      'Enter a valid e-mail address.',
    ]);
    expect(await (await page.field('Password')).getTextErrors()).toEqual(['Password is required.']);
    page.backend.expectNone('/api/auth/sign-in');
  });

  it('on success goes to the page that asked for sign-in', async () => {
    const page = await openSignIn('/sign-in?next=%2Fworkshop');
    await page.fill('E-mail', 'ada@example.com');
    await page.fill('Password', 'right-password');
    await page.submit();

    page.backend.expectOne('/api/auth/sign-in').flush({
      accessToken: 'token-1',
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
    await page.harness.fixture.whenStable();

    expect(TestBed.inject(Router).url).toBe('/workshop');
  });
});
