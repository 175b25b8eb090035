import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import { firstValueFrom } from 'rxjs';
import type { Membership, Session as SessionBody } from '@batchproof/shared';
import { ApiError } from '../http/api-error';
import { Session } from './session';
import { signedInAs } from './signed-in-as';

@Component({ template: '' })
class Page {}

const ELDER: Membership = { workshopId: 'w2', workshopName: 'Elder Lane Soaps', role: 'assessor' };

/** What the API answers for a switch to Elder Lane Soaps: a new token and the user there. */
const elderSession: SessionBody = {
  accessToken: 'token-elder',
  expiresIn: 900,
  user: {
    id: 'u1',
    name: 'Ada Marsh',
    email: 'me@example.com',
    role: 'assessor',
    workshop: { id: 'w2', name: 'Elder Lane Soaps' },
    memberships: [
      { workshopId: 'w2', workshopName: 'Elder Lane Soaps', role: 'assessor' },
      { workshopId: 'w1', workshopName: 'Hollowmere Bathworks', role: 'owner' },
    ],
  },
};

/** An owner of Hollowmere Bathworks (w1) who is also an assessor at Elder Lane Soaps (w2). */
async function inTwoWorkshops(url: string, canLeave = true) {
  const backend = await signedInAs(
    'owner',
    [
      { path: '', component: Page },
      { path: 'formulas/:id', component: Page, canDeactivate: [() => canLeave] },
    ],
    [ELDER],
  );
  const harness = await RouterTestingHarness.create(url);
  const snack = vi.spyOn(TestBed.inject(MatSnackBar), 'open');
  return { backend, harness, snack, session: TestBed.inject(Session) };
}

describe('Session.switchWorkshop', () => {
  beforeEach(() => localStorage.clear());
  afterEach(() => vi.restoreAllMocks());

  it('knows every workshop of the person and the active one', async () => {
    const { session } = await inTwoWorkshops('/');
    expect(session.workshopId()).toBe('w1');
    expect(session.memberships().map((m) => m.workshopName)).toEqual([
      'Hollowmere Bathworks',
      'Elder Lane Soaps',
    ]);
  });

  it('goes Home, then replaces the token and the user with the other workshop’s', async () => {
    const { backend, harness, snack, session } = await inTwoWorkshops('/formulas/f1');
    const switching = firstValueFrom(session.switchWorkshop('w2'));

    await vi.waitFor(() => expect(TestBed.inject(Router).url).toBe('/'));
    const req = backend.expectOne('/api/auth/workshop');
    expect(req.request.method).toBe('POST');
    expect(req.request.body).toEqual({ workshopId: 'w2' });
    // Switching acts for the signed-in person, so it carries the current access token.
    expect(req.request.headers.get('Authorization')).toBe('Bearer token-1');
    req.flush(elderSession);

    const user = await switching;
    expect(user?.workshop.name).toBe('Elder Lane Soaps');
    expect(session.accessToken()).toBe('token-elder');
    expect(session.user()).toEqual(elderSession.user);
    expect(session.role()).toBe('assessor');
    expect(session.workshopId()).toBe('w2');
    // The shell says "Now working in …" (shell.spec): the snack bar stays out of the initial bundle.
    expect(snack).not.toHaveBeenCalled();
    await harness.fixture.whenStable();
    expect(TestBed.inject(Router).url).toBe('/');
  });

  it('switches without navigating when Home is already open', async () => {
    const { backend, session } = await inTwoWorkshops('/');
    const navigate = vi.spyOn(TestBed.inject(Router), 'navigateByUrl');
    const switching = firstValueFrom(session.switchWorkshop('w2'));
    await vi.waitFor(() => backend.expectOne('/api/auth/workshop').flush(elderSession));
    await switching;
    expect(navigate).not.toHaveBeenCalled();
    expect(session.workshopId()).toBe('w2');
  });

  it('switches nothing when the open page keeps the member (unsaved changes)', async () => {
    const { backend, session, snack } = await inTwoWorkshops('/formulas/f1', false);
    expect(await firstValueFrom(session.switchWorkshop('w2'))).toBeNull();
    backend.expectNone('/api/auth/workshop');
    expect(session.workshopId()).toBe('w1');
    expect(session.accessToken()).toBe('token-1');
    expect(snack).not.toHaveBeenCalled();
    expect(TestBed.inject(Router).url).toBe('/formulas/f1');
  });

  it('keeps the session as it was when the API refuses the workshop', async () => {
    const { backend, session } = await inTwoWorkshops('/');
    const switching = firstValueFrom(session.switchWorkshop('w9'));
    await vi.waitFor(() =>
      backend.expectOne('/api/auth/workshop').flush(
        {
          error: {
            code: 'validation_failed',
            message: 'Check the highlighted fields.',
            fieldErrors: { workshopId: ['Choose one of your workshops.'] },
          },
        },
        { status: 400, statusText: 'Bad Request' },
      ),
    );
    await expect(switching).rejects.toBeInstanceOf(ApiError);
    expect(session.workshopId()).toBe('w1');
    expect(session.accessToken()).toBe('token-1');
  });
});
