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
import { ROLE_DESCRIPTIONS } from '@batchproof/shared';
import { Session } from '../session';
import { errorInterceptor } from '../../http/error-interceptor';
import AcceptInvitePage from './accept-invite-page';

@Component({ template: '' })
class Elsewhere {}

const TOKEN = 'a-token-long-enough-to-pass-the-schema';

async function openInvitation() {
  TestBed.configureTestingModule({
    providers: [
      provideZonelessChangeDetection(),
      provideRouter(
        [
          { path: 'accept-invite/:token', component: AcceptInvitePage },
          { path: '**', component: Elsewhere },
        ],
        withComponentInputBinding(),
      ),
      provideHttpClient(withInterceptors([errorInterceptor])),
      provideHttpClientTesting(),
    ],
  });
  const harness = await RouterTestingHarness.create();
  await harness.navigateByUrl(`/accept-invite/${TOKEN}`, AcceptInvitePage);
  const backend = TestBed.inject(HttpTestingController);
  const preview = backend.expectOne(`/api/auth/invitations/${TOKEN}`);
  return { harness, backend, preview, loader: TestbedHarnessEnvironment.loader(harness.fixture) };
}

describe('AcceptInvitePage', () => {
  beforeEach(() => localStorage.clear());

  it('shows the workshop, the role with what it may do, and who sent the invitation', async () => {
    const page = await openInvitation();
    page.preview.flush({
      email: 'tomas@example.com',
      role: 'formulator',
      workshopName: 'Hollowmere Bathworks',
      invitedBy: 'Ada Marsh',
    });
    await page.harness.fixture.whenStable();

    const text = page.harness.routeNativeElement!.textContent!;
    expect(text).toContain('Ada Marsh invited you to Hollowmere Bathworks');
    expect(text).toContain('formulator');
    expect(text).toContain(ROLE_DESCRIPTIONS.formulator);
    expect(text).toContain('tomas@example.com');
  });

  it('says so plainly when the link has expired or was used', async () => {
    const page = await openInvitation();
    page.preview.flush(
      { error: { code: 'not_found', message: 'That invitation was not found.' } },
      { status: 404, statusText: 'Not Found' },
    );
    await page.harness.fixture.whenStable();

    expect(page.harness.routeNativeElement!.querySelector('[role=alert]')?.textContent).toContain(
      'This invitation has expired or has already been used.',
    );
  });

  it('accepts with the token, a name and a password, then lands signed in at home', async () => {
    const page = await openInvitation();
    page.preview.flush({
      email: 'tomas@example.com',
      role: 'formulator',
      workshopName: 'Hollowmere Bathworks',
      invitedBy: 'Ada Marsh',
    });
    await page.harness.fixture.whenStable();

    const fill = async (label: string, value: string) => {
      const field = await page.loader.getHarness(
        MatFormFieldHarness.with({ floatingLabelText: label }),
      );
      await ((await field.getControl()) as MatInputHarness).setValue(value);
    };
    await fill('Your name', 'Tomas Reed');
    await fill('Choose a password', 'a-long-enough-password');
    await (await page.loader.getHarness(MatButtonHarness.with({ text: /^Join/ }))).click();

    const req = page.backend.expectOne('/api/auth/invitations/accept');
    expect(req.request.body).toEqual({
      token: TOKEN,
      name: 'Tomas Reed',
      password: 'a-long-enough-password',
    });
    req.flush(
      {
        accessToken: 't',
        expiresIn: 900,
        user: {
          id: 'u2',
          name: 'Tomas Reed',
          email: 'tomas@example.com',
          role: 'formulator',
          workshop: { id: 'w1', name: 'Hollowmere Bathworks' },
        },
      },
      { status: 201, statusText: 'Created' },
    );
    await page.harness.fixture.whenStable();

    expect(TestBed.inject(Router).url).toBe('/');
    expect(TestBed.inject(Session).role()).toBe('formulator');
  });
});
