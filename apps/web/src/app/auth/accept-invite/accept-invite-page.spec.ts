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

const INVITATION = {
  email: 'tomas@example.com',
  role: 'formulator',
  workshopName: 'Hollowmere Bathworks',
  invitedBy: 'Ada Marsh',
  existingAccount: false,
};

/** The same invitation sent to an address that already has an account (in another workshop). */
const FOR_EXISTING_ACCOUNT = { ...INVITATION, existingAccount: true };

type Opened = Awaited<ReturnType<typeof openInvitation>>;

/** Fills in the name and password and presses Join. */
async function join(page: Opened, name: string) {
  const fill = async (label: string, value: string) => {
    const field = await page.loader.getHarness(
      MatFormFieldHarness.with({ floatingLabelText: label }),
    );
    await ((await field.getControl()) as MatInputHarness).setValue(value);
  };
  await fill('Your name', name);
  await fill('Choose a password', 'a-long-enough-password');
  await (await page.loader.getHarness(MatButtonHarness.with({ text: /^Join/ }))).click();
}

describe('AcceptInvitePage', () => {
  beforeEach(() => localStorage.clear());

  it('shows the workshop, the role with what it may do, and who sent the invitation', async () => {
    const page = await openInvitation();
    page.preview.flush(INVITATION);
    await page.harness.fixture.whenStable();

    const text = page.harness.routeNativeElement!.textContent!;
    expect(text).toContain('Ada Marsh invited you to Hollowmere Bathworks');
    expect(text).toContain('formulator');
    expect(text).toContain(ROLE_DESCRIPTIONS.formulator);
    expect(text).toContain('tomas@example.com');
  });

  /** Words the page shows for each refusal: the page's own, not the API's message. */
  const refusals = [
    {
      code: 'invitation_used',
      status: 410,
      heading: 'This invitation has already been used',
      advice: 'sign in with',
      link: 'Go to sign-in',
    },
    {
      code: 'invitation_expired',
      status: 410,
      heading: 'This invitation has expired',
      advice: 'Ask the workshop owner to send a new invitation',
      link: 'Go to sign-in',
    },
    {
      code: 'invitation_unknown',
      status: 404,
      heading: 'This invitation link is not valid',
      advice: 'replaced by a newer one',
      link: 'Go to sign-in',
    },
  ] as const;

  for (const r of refusals) {
    it(`says plainly why the link cannot be used (${r.code})`, async () => {
      const page = await openInvitation();
      page.preview.flush(
        { error: { code: r.code, message: 'A message the page does not show.' } },
        { status: r.status, statusText: 'Gone' },
      );
      await page.harness.fixture.whenStable();

      const alert = page.harness.routeNativeElement!.querySelector('[role=alert]')!.textContent!;
      expect(alert).toContain(r.heading);
      expect(alert).toContain(r.advice);
      expect(alert).not.toContain('A message the page does not show.');
      const others = refusals.filter((o) => o.code !== r.code).map((o) => o.heading);
      for (const other of others) expect(alert).not.toContain(other);
      expect(page.harness.routeNativeElement!.textContent).toContain(r.link);
    });
  }

  it('when the link is used up while the form is open, says so instead of the form', async () => {
    const page = await openInvitation();
    page.preview.flush(INVITATION);
    await page.harness.fixture.whenStable();
    await join(page, 'Tomas');

    page.backend
      .expectOne('/api/auth/invitations/accept')
      .flush(
        { error: { code: 'invitation_used', message: 'Used.' } },
        { status: 410, statusText: 'Gone' },
      );
    await page.harness.fixture.whenStable();

    const root = page.harness.routeNativeElement!;
    await vi.waitFor(() =>
      expect(root.querySelector('[role=alert]')?.textContent).toContain(
        'This invitation has already been used',
      ),
    );
    expect(await page.loader.getAllHarnesses(MatButtonHarness.with({ text: /^Join/ }))).toEqual([]);
  });

  it('accepts with the token, a name and a password, then lands signed in at home', async () => {
    const page = await openInvitation();
    page.preview.flush(INVITATION);
    await page.harness.fixture.whenStable();

    await join(page, 'Tomas Reed');

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
          memberships: [
            { workshopId: 'w1', workshopName: 'Hollowmere Bathworks', role: 'formulator' },
          ],
        },
      },
      { status: 201, statusText: 'Created' },
    );
    await page.harness.fixture.whenStable();

    expect(TestBed.inject(Router).url).toBe('/');
    expect(TestBed.inject(Session).role()).toBe('formulator');
  });

  describe('for an address that already has an account', () => {
    it('asks only for that account’s password and says why', async () => {
      const page = await openInvitation();
      page.preview.flush(FOR_EXISTING_ACCOUNT);
      await page.harness.fixture.whenStable();

      const text = page.harness.routeNativeElement!.textContent!.replace(/\s+/g, ' ');
      expect(text).toContain(
        'You already have a Batchproof account with tomas@example.com. Enter its password to join Hollowmere Bathworks.',
      );
      const labels = await Promise.all(
        (await page.loader.getAllHarnesses(MatFormFieldHarness)).map((f) => f.getLabel()),
      );
      expect(labels).toEqual(['Your password']);
      const password = page.harness.routeNativeElement!.querySelector('input[type=password]')!;
      expect(password.getAttribute('autocomplete')).toBe('current-password');
      expect(text).toContain('Forgot your password?');
    });

    it('says the password is required before sending anything', async () => {
      const page = await openInvitation();
      page.preview.flush(FOR_EXISTING_ACCOUNT);
      await page.harness.fixture.whenStable();
      await (await page.loader.getHarness(MatButtonHarness.with({ text: /^Join/ }))).click();

      const field = await page.loader.getHarness(
        MatFormFieldHarness.with({ floatingLabelText: 'Your password' }),
      );
      expect(await field.getTextErrors()).toEqual(['Password is required.']);
      page.backend.expectNone('/api/auth/invitations/accept');
    });

    it('joins with the token and the password, then lands in the invited workshop', async () => {
      const page = await openInvitation();
      page.preview.flush(FOR_EXISTING_ACCOUNT);
      await page.harness.fixture.whenStable();

      const field = await page.loader.getHarness(
        MatFormFieldHarness.with({ floatingLabelText: 'Your password' }),
      );
      await ((await field.getControl()) as MatInputHarness).setValue('the-old-password');
      await (await page.loader.getHarness(MatButtonHarness.with({ text: /^Join/ }))).click();

      const req = page.backend.expectOne('/api/auth/invitations/accept');
      expect(req.request.method).toBe('POST');
      expect(req.request.body).toEqual({ token: TOKEN, password: 'the-old-password' });
      req.flush({
        accessToken: 't',
        expiresIn: 900,
        user: {
          id: 'u2',
          name: 'Tomas Reed',
          email: 'tomas@example.com',
          role: 'formulator',
          workshop: { id: 'w1', name: 'Hollowmere Bathworks' },
          memberships: [
            { workshopId: 'w9', workshopName: 'Elder Lane Soaps', role: 'assessor' },
            { workshopId: 'w1', workshopName: 'Hollowmere Bathworks', role: 'formulator' },
          ],
        },
      });
      await page.harness.fixture.whenStable();

      expect(TestBed.inject(Router).url).toBe('/');
      const session = TestBed.inject(Session);
      expect(session.workshopId()).toBe('w1');
      expect(session.memberships()).toHaveLength(2);
    });

    it('puts a refused password back on the field', async () => {
      const page = await openInvitation();
      page.preview.flush(FOR_EXISTING_ACCOUNT);
      await page.harness.fixture.whenStable();

      const field = await page.loader.getHarness(
        MatFormFieldHarness.with({ floatingLabelText: 'Your password' }),
      );
      await ((await field.getControl()) as MatInputHarness).setValue('not-it');
      await (await page.loader.getHarness(MatButtonHarness.with({ text: /^Join/ }))).click();
      // As the API answers a wrong password: 401 with the message on the password field, and
      // no refresh attempted (the invitation route is a signed-out one).
      page.backend.expectOne('/api/auth/invitations/accept').flush(
        {
          error: {
            code: 'unauthenticated',
            message: 'That password does not match the invited account.',
            fieldErrors: { password: ['That password does not match the invited account.'] },
          },
        },
        { status: 401, statusText: 'Unauthorized' },
      );
      await page.harness.fixture.whenStable();

      expect(await field.getTextErrors()).toEqual([
        'That password does not match the invited account.',
      ]);
      page.backend.expectNone('/api/auth/refresh');
      expect(TestBed.inject(Session).signedIn()).toBe(false);
    });
  });
});
