import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { TestRequest } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatSnackBarHarness } from '@angular/material/snack-bar/testing';
import { MatSortHarness } from '@angular/material/sort/testing';
import { MatRowHarness, MatTableHarness } from '@angular/material/table/testing';
import { Router } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import type { Member, ProductionSettings, Role } from '@batchproof/shared';
import { signedInAs } from '../../auth/signed-in-as';
import MembersPage from './members-page';

const MEMBERS: Member[] = [
  {
    id: 'u1',
    name: 'Ada Marsh',
    email: 'ada@example.com',
    role: 'owner',
    joinedAt: '2026-01-05T10:00:00.000Z',
  },
  {
    id: 'u2',
    name: 'Tomas Reed',
    email: 'tomas@example.com',
    role: 'formulator',
    joinedAt: '2026-02-11T10:00:00.000Z',
  },
];

const isMembersList = (req: { url: string }) => req.url === '/api/members';

/** The workshop's production settings, as `GET /api/workshop/production` answers them. */
const PRODUCTION: ProductionSettings = {
  weighingTolerancePercent: 2.5,
  batchCodePattern: '{YYMMDD}-{CODE}-{SEQ}',
  smallBusiness: true,
};

async function openMembersAs(role: Role, url = '/workshop') {
  const backend = await signedInAs(role, [{ path: 'workshop', component: MembersPage }]);
  const harness = await RouterTestingHarness.create();
  await harness.navigateByUrl(url, MembersPage);
  const loader = TestbedHarnessEnvironment.loader(harness.fixture);
  return { harness, loader, backend };
}

type Page = Awaited<ReturnType<typeof openMembersAs>>;

/**
 * Answers the members read (and, for owners, the invitations read), the label details and the
 * production settings the page's cards read, and waits for the page to settle; resource reads
 * count as pending work, so all of them are answered before waiting.
 */
async function flushReads(page: Page, invitations?: unknown[]): Promise<TestRequest> {
  const req = page.backend.expectOne(isMembersList);
  req.flush({ items: MEMBERS });
  if (invitations) page.backend.expectOne('/api/members/invitations').flush({ items: invitations });
  // The name and address on labels, read by their own section of the page.
  for (const details of page.backend.match('/api/workshop/label-details')) {
    details.flush({ name: 'Hollowmere Bathworks', address: '4 Mill Lane, Hollowmere' });
  }
  // The production settings card's read, once per page.
  page.backend.expectOne({ method: 'GET', url: '/api/workshop/production' }).flush(PRODUCTION);
  await page.harness.fixture.whenStable();
  return req;
}

/** The production settings card's weighing tolerance field and its input. */
async function toleranceField(page: Page) {
  const field = await page.loader.getHarness(
    MatFormFieldHarness.with({ floatingLabelText: 'Weighing tolerance' }),
  );
  return { field, input: (await field.getControl()) as MatInputHarness };
}

/** Types an e-mail into the invite form and sends it. */
async function sendInvitation(page: Page, address: string) {
  const email = await page.loader.getHarness(
    MatFormFieldHarness.with({ floatingLabelText: 'E-mail' }),
  );
  await ((await email.getControl()) as MatInputHarness).setValue(address);
  await (await page.loader.getHarness(MatButtonHarness.with({ text: /Send invitation/ }))).click();
  return email;
}

async function cellTexts(rows: MatRowHarness[]) {
  return Promise.all(rows.map((row) => row.getCellTextByColumnName()));
}

describe('MembersPage', () => {
  beforeEach(() => localStorage.clear());

  it('shows a row per member from the API with name, e-mail and role', async () => {
    const page = await openMembersAs('viewer');
    await flushReads(page);

    const rows = await (await page.loader.getHarness(MatTableHarness)).getRows();
    const cells = await cellTexts(rows);
    expect(cells.map((c) => [c['name'], c['email'], c['role']])).toEqual([
      ['Ada Marsh', 'ada@example.com', 'owner'],
      ['Tomas Reed', 'tomas@example.com', 'formulator'],
    ]);
  });

  it('asks the server for the sort given in the query parameters', async () => {
    const page = await openMembersAs('viewer', '/workshop?sort=email&dir=desc');

    const req = await flushReads(page);
    expect(req.request.params.get('sort')).toBe('email');
    expect(req.request.params.get('dir')).toBe('desc');
  });

  it('falls back to sorting by name when the query parameters are not a known sort', async () => {
    const page = await openMembersAs('viewer', '/workshop?sort=shoeSize&dir=up');

    const req = await flushReads(page);
    expect(req.request.params.get('sort')).toBe('name');
    expect(req.request.params.get('dir')).toBe('asc');
  });

  it('sorts on the server when a column header is clicked, and keeps the sort in the URL', async () => {
    const page = await openMembersAs('viewer');
    await flushReads(page);

    const sort = await page.loader.getHarness(MatSortHarness);
    expect(await (await sort.getActiveHeader())?.getLabel()).toBe('Name');
    const [joined] = await sort.getSortHeaders({ label: 'Joined' });
    // The harness waits for the page to settle after the click, which the new read prevents
    // until it is answered: answer it while the click is pending.
    const clicked = joined!.click();
    const req = await vi.waitFor(() => page.backend.expectOne(isMembersList));
    expect(req.request.params.get('sort')).toBe('joinedAt');
    expect(req.request.params.get('dir')).toBe('asc');
    req.flush({ items: MEMBERS });
    await clicked;
    expect(TestBed.inject(Router).url).toBe('/workshop?sort=joinedAt&dir=asc');
  });

  it('gives the owner the invite form, a role picker per member and the pending invitations', async () => {
    const page = await openMembersAs('owner');
    await flushReads(page, [
      {
        id: 'i1',
        email: 'new@example.com',
        role: 'production',
        createdAt: '2026-03-01T10:00:00.000Z',
        expiresAt: '2026-03-08T10:00:00.000Z',
      },
    ]);

    const el = page.harness.routeNativeElement!;
    expect(el.querySelector('bp-invite-form')).not.toBeNull();
    expect(
      await page.loader.getAllHarnesses(MatSelectHarness.with({ selector: '.role-select' })),
    ).toHaveLength(2);
    expect(el.querySelector('bp-invitation-list')?.textContent).toContain('new@example.com');
    expect(el.querySelector('a[href="/audit-log"]')?.textContent).toContain('Audit log');
    // The production settings as read, for the owner to change, with today's example code.
    const tolerance = await toleranceField(page);
    expect(await tolerance.input.getValue()).toBe('2.5');
    expect(await tolerance.field.isDisabled()).toBe(false);
    const settings = el.querySelector('bp-production-settings')!;
    expect(settings.querySelector('.example')?.textContent).toMatch(/\d{6}-SGF-007/);
    expect(settings.querySelector('button[type="submit"]')?.textContent).toContain('Save');
  });

  it('shows everyone else the table read-only, without the invite form or invitations', async () => {
    const page = await openMembersAs('formulator');
    await flushReads(page);

    const el = page.harness.routeNativeElement!;
    expect(el.querySelector('bp-invite-form')).toBeNull();
    expect(el.querySelector('bp-invitation-list')).toBeNull();
    expect(await page.loader.getAllHarnesses(MatSelectHarness)).toHaveLength(0);
    expect(
      await page.loader.getAllHarnesses(
        MatButtonHarness.with({ selector: '[aria-label^="Remove"]' }),
      ),
    ).toHaveLength(0);
    page.backend.expectNone('/api/members/invitations');
    expect(el.querySelector('a[href="/audit-log"]')).toBeNull();
    // The production settings are shown to read, not to change.
    const tolerance = await toleranceField(page);
    expect(await tolerance.input.getValue()).toBe('2.5');
    expect(await tolerance.field.isDisabled()).toBe(true);
    expect(el.querySelector('bp-production-settings')?.textContent).toContain(
      "The workshop's owner changes these.",
    );
  });

  it('says the earlier link stopped working when an invitation replaces a pending one', async () => {
    const page = await openMembersAs('owner');
    await flushReads(page, []);

    await sendInvitation(page, 'wren@example.com');
    page.backend.expectOne({ method: 'POST', url: '/api/members/invitations' }).flush(
      {
        id: 'i2',
        email: 'wren@example.com',
        role: 'formulator',
        createdAt: '2026-03-01T10:00:00.000Z',
        expiresAt: '2026-03-08T10:00:00.000Z',
        replaced: 1,
      },
      { status: 201, statusText: 'Created' },
    );
    const reload = await vi.waitFor(() => page.backend.expectOne('/api/members/invitations'));
    reload.flush({ items: [] });

    const snack = await TestbedHarnessEnvironment.documentRootLoader(
      page.harness.fixture,
    ).getHarness(MatSnackBarHarness);
    expect(await snack.getMessage()).toBe(
      'Invitation sent to wren@example.com. It replaces the earlier invitation, whose link no longer works.',
    );
  });

  it("puts the server's message beside the e-mail when an invitation is refused", async () => {
    const page = await openMembersAs('owner');
    await flushReads(page, []);

    const email = await sendInvitation(page, 'tomas@example.com');

    const req = page.backend.expectOne({ method: 'POST', url: '/api/members/invitations' });
    expect(req.request.body).toEqual({ email: 'tomas@example.com', role: 'formulator' });
    // An address with an account elsewhere is welcome; one already in this workshop is refused.
    req.flush(
      {
        error: {
          code: 'conflict',
          message: 'This e-mail already belongs to a member of this workshop.',
          fieldErrors: { email: ['This e-mail already belongs to a member of this workshop.'] },
        },
      },
      { status: 409, statusText: 'Conflict' },
    );
    await page.harness.fixture.whenStable();

    expect(await email.getTextErrors()).toEqual([
      'This e-mail already belongs to a member of this workshop.',
    ]);
  });

  it('tells the owner that someone who already uses Batchproof can be invited', async () => {
    const page = await openMembersAs('owner');
    await flushReads(page, []);
    const form = page.harness.routeNativeElement!.querySelector('bp-invite-form')!;
    expect(form.textContent).toContain(
      'Someone who already uses Batchproof joins with their own password.',
    );
    expect(form.textContent).not.toMatch(/already belongs|cannot be invited/i);
  });

  it('puts the role back and says why when the server refuses to demote the last owner', async () => {
    const page = await openMembersAs('owner');
    await flushReads(page, []);

    const [ownerRole] = await page.loader.getAllHarnesses(
      MatSelectHarness.with({ selector: '.role-select' }),
    );
    await ownerRole.open();
    await ownerRole.clickOptions({ text: 'viewer' });

    const req = page.backend.expectOne({ method: 'PATCH', url: '/api/members/u1' });
    expect(req.request.body).toEqual({ role: 'viewer' });
    req.flush(
      {
        error: {
          code: 'conflict',
          message: 'A workshop needs at least one owner. Make someone else owner first.',
          fieldErrors: { role: ['A workshop needs at least one owner.'] },
        },
      },
      { status: 409, statusText: 'Conflict' },
    );
    await page.harness.fixture.whenStable();

    expect(await ownerRole.getValueText()).toBe('owner');
    expect(document.querySelector('mat-snack-bar-container')?.textContent).toContain(
      'A workshop needs at least one owner.',
    );
  });
});
