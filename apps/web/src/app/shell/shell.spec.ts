import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { Component, inject } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatMenuHarness } from '@angular/material/menu/testing';
import { Router } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import type { Membership, Session as SessionBody } from '@batchproof/shared';
import { Session } from '../auth/session';
import { signedInAs } from '../auth/signed-in-as';
import Shell from './shell';

/** Stands in for a page: remembers which workshop it was made for. */
@Component({ template: '<p class="page">page of {{ madeFor }}</p>' })
class Page {
  readonly madeFor = inject(Session).workshopId();
}

@Component({ template: '' })
class SignIn {}

const ROUTES = [
  { path: 'sign-in', component: SignIn },
  {
    path: '',
    component: Shell,
    children: [
      { path: '', component: Page },
      { path: 'formulas', component: Page },
    ],
  },
];

const ELDER: Membership = { workshopId: 'w2', workshopName: 'Elder Lane Soaps', role: 'assessor' };

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

async function openShell(others: Membership[], url = '/') {
  const backend = await signedInAs('owner', ROUTES, others);
  const harness = await RouterTestingHarness.create(url);
  await harness.fixture.whenStable();
  const root = harness.fixture.nativeElement as HTMLElement;
  const loader = TestbedHarnessEnvironment.loader(harness.fixture);
  return { backend, harness, root, loader };
}

const switcher = (root: HTMLElement) =>
  root.querySelector<HTMLButtonElement>('button[aria-label^="Switch workshop"]');

describe('Shell workshop switcher', () => {
  beforeEach(() => localStorage.clear());

  it('with one workshop shows its name as plain text and no switcher', async () => {
    const { root, loader } = await openShell([]);
    expect(switcher(root)).toBeNull();
    expect(root.querySelector('.workshop')?.textContent?.trim()).toBe('Hollowmere Bathworks');
    // Only the account menu is there.
    expect(await loader.getAllHarnesses(MatMenuHarness)).toHaveLength(1);
  });

  it('with several lists every workshop with the role there, the active one marked', async () => {
    const { root, loader } = await openShell([ELDER]);
    const button = switcher(root)!;
    expect(button.getAttribute('aria-label')).toBe('Switch workshop: Hollowmere Bathworks');
    expect(button.textContent).toContain('Hollowmere Bathworks');
    expect(root.querySelector('.workshop')).toBeNull();

    const menu = await loader.getHarness(MatMenuHarness.with({ selector: '.workshop-switch' }));
    await menu.open();
    expect(await menu.getItems()).toHaveLength(2);
    expect(document.querySelector('[role=menu]')?.getAttribute('aria-label')).toBe(
      'Your workshops',
    );
    const options = Array.from(document.querySelectorAll('.workshop-option'));
    const line = (o: Element, part: string) =>
      o.querySelector(part)?.textContent?.replace(/\s+/g, ' ').trim();
    expect(options.map((o) => [line(o, '.option-name'), line(o, '.option-role')])).toEqual([
      ['Hollowmere Bathworks', 'owner · working here now'],
      ['Elder Lane Soaps', 'assessor'],
    ]);
    expect(options.map((o) => line(o, 'mat-icon'))).toEqual(['check', '']);
    expect(options.map((o) => o.getAttribute('aria-current'))).toEqual(['true', null]);
    expect(options.map((o) => o.getAttribute('role'))).toEqual(['menuitem', 'menuitem']);
    await menu.close();
  });

  it('switches from the menu: goes Home, rebuilds the page for the new workshop and names it', async () => {
    const { root, loader, backend, harness } = await openShell([ELDER], '/formulas');
    expect(root.querySelector('.page')?.textContent).toBe('page of w1');

    const menu = await loader.getHarness(MatMenuHarness.with({ selector: '.workshop-switch' }));
    await menu.clickItem({ text: /Elder Lane Soaps/ });
    const req = await vi.waitFor(() => backend.expectOne('/api/auth/workshop'));
    expect(req.request.body).toEqual({ workshopId: 'w2' });
    expect(TestBed.inject(Router).url).toBe('/');
    req.flush(elderSession);
    await harness.fixture.whenStable();

    // The page on screen was made for the new workshop, not kept from the old one.
    expect(root.querySelector('.page')?.textContent).toBe('page of w2');
    expect(switcher(root)?.getAttribute('aria-label')).toBe('Switch workshop: Elder Lane Soaps');
    expect(document.querySelector('mat-snack-bar-container')?.textContent).toContain(
      'Now working in Elder Lane Soaps.',
    );
  });

  it('choosing the workshop already open sends nothing', async () => {
    const { loader, backend } = await openShell([ELDER]);
    const menu = await loader.getHarness(MatMenuHarness.with({ selector: '.workshop-switch' }));
    await menu.clickItem({ text: /Hollowmere Bathworks/ });
    backend.expectNone('/api/auth/workshop');
  });
});

describe('Shell navigation', () => {
  it('has no "Coming soon" heading once every entry has its page', async () => {
    const { root } = await openShell([]);
    expect(root.querySelector('nav a[href="/assessments"]')).not.toBeNull();
    expect(root.querySelector('#soon-heading')).toBeNull();
  });
});
