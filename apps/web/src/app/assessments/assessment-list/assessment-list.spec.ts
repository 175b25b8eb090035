import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HttpRequest } from '@angular/common/http';
import type { HttpTestingController } from '@angular/common/http/testing';
import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatSortHarness } from '@angular/material/sort/testing';
import { Router } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import type { AssessmentList as AssessmentListBody, Role, ShareRecord } from '@batchproof/shared';
import { signedInAs } from '../../auth/signed-in-as';
import { anAssessment } from '../assessments-testing';
import AssessmentList from './assessment-list';

@Component({ selector: 'bp-opened', template: '<p>Opened</p>' })
class Opened {}

const sent = (backend: HttpTestingController, match: (r: HttpRequest<unknown>) => boolean) =>
  vi.waitFor(() => backend.expectOne(match));

const SHARE: ShareRecord = {
  id: '5a000000-0000-4000-8000-000000000001',
  formulaId: 'f2',
  formulaName: 'Sea Glass Fizzer',
  versionId: 'v2',
  versionNumber: 3,
  assessorId: 'u9',
  assessorName: 'Wren Ashby',
  sharedByName: 'Ada Marsh',
  sharedAt: '2026-12-01T10:00:00.000Z',
  assessmentId: null,
  assessmentStatus: null,
};

const LIST: AssessmentListBody = {
  items: [
    {
      id: 'a1',
      formulaId: 'f1',
      formulaName: 'Everyday Body Lotion',
      versionId: 'v1',
      versionNumber: 2,
      status: 'signed',
      assessorName: 'Wren Ashby',
      signedAt: '2026-11-20T10:00:00.000Z',
      updatedAt: '2026-11-20T10:00:00.000Z',
    },
    {
      id: 'a2',
      formulaId: 'f3',
      formulaName: 'Almond Hand Cream',
      versionId: 'v3',
      versionNumber: 1,
      status: 'draft',
      assessorName: 'Bram Oakes',
      signedAt: null,
      updatedAt: '2026-11-25T10:00:00.000Z',
    },
  ],
  waiting: [SHARE],
};

async function open(role: Role) {
  const backend = await signedInAs(role, [
    { path: 'assessments', component: AssessmentList },
    { path: 'assessments/:id', component: Opened },
  ]);
  const harness = await RouterTestingHarness.create();
  await harness.navigateByUrl('/assessments');
  (await sent(backend, (r) => r.url === '/api/assessments')).flush(LIST);
  if (role === 'owner')
    (await sent(backend, (r) => r.url === '/api/assessment-shares')).flush({ items: [SHARE] });
  await harness.fixture.whenStable();
  const loader = TestbedHarnessEnvironment.loader(harness.fixture);
  const el = () => harness.routeNativeElement as HTMLElement;
  const products = () =>
    [...el().querySelectorAll('table[aria-label=Assessments] tbody tr')].map(
      (r) => r.querySelector('td')?.textContent?.trim() ?? '',
    );
  return { backend, harness, loader, el, products };
}

describe('AssessmentList', { timeout: 20_000 }, () => {
  it('lists assessments with their status in words, sorted and filtered by text and status', async () => {
    const page = await open('viewer');
    expect(page.products()).toEqual(['Almond Hand Cream', 'Everyday Body Lotion']);
    const rows = page.el().querySelectorAll('table[aria-label=Assessments] tbody tr');
    expect(rows[0]?.textContent).toContain('Draft');
    expect(rows[0]?.textContent).toContain('not signed');
    expect(rows[1]?.textContent).toContain('Signed');
    // The viewer sees what waits, but starts nothing and unshares nothing.
    expect(page.el().textContent).toContain('Waiting for an assessor');
    expect(page.el().textContent).toContain('Sea Glass Fizzer');
    expect(page.el().textContent).not.toContain('Start assessment');
    expect(page.el().textContent).not.toContain('Shared versions');

    const sort = await page.loader.getHarness(MatSortHarness);
    const [product] = await sort.getSortHeaders({ label: 'Product' });
    await product!.click(); // ascending was the default: now descending
    expect(page.products()).toEqual(['Everyday Body Lotion', 'Almond Hand Cream']);

    const status = await page.loader.getHarness(MatSelectHarness);
    await status.open();
    await status.clickOptions({ text: 'Signed' });
    expect(page.products()).toEqual(['Everyday Body Lotion']);
    await status.open();
    await status.clickOptions({ text: 'Signed or draft' });
    await (
      await page.loader.getHarness(MatInputHarness.with({ selector: '[type=search]' }))
    ).setValue('bram');
    expect(page.products()).toEqual(['Almond Hand Cream']);
    await (
      await page.loader.getHarness(MatInputHarness.with({ selector: '[type=search]' }))
    ).setValue('nothing like it');
    expect(page.el().textContent).toContain('No assessments match these filters.');
  });

  it("starts the assessor's assessment from a waiting share and opens it", async () => {
    const page = await open('assessor');
    expect(page.el().textContent).toContain('Waiting for you');
    const start = page.loader.getHarness(MatButtonHarness.with({ text: /Start assessment/ }));
    const clicking = (await start).click();
    const post = await sent(
      page.backend,
      (r) => r.url === '/api/assessments' && r.method === 'POST',
    );
    expect(post.request.body).toEqual({ shareId: SHARE.id });
    expect(post.request.headers.has('Idempotency-Key')).toBe(true);
    post.flush(anAssessment({ id: 'a9' }));
    await clicking;
    await vi.waitFor(() => expect(TestBed.inject(Router).url).toBe('/assessments/a9'));
  });

  it('lets the owner unshare a version after confirming', async () => {
    const page = await open('owner');
    expect(page.el().textContent).toContain('Shared versions');
    await (await page.loader.getHarness(MatButtonHarness.with({ text: /Unshare/ }))).click();
    const root = TestbedHarnessEnvironment.documentRootLoader(page.harness.fixture);
    const dialog = await root.getHarness(MatDialogHarness);
    expect(await dialog.getTitleText()).toBe('Stop sharing with Wren Ashby?');
    const confirming = (
      await dialog.getHarness(MatButtonHarness.with({ text: 'Unshare' }))
    ).click();
    const del = await sent(
      page.backend,
      (r) => r.url === `/api/assessment-shares/${SHARE.id}` && r.method === 'DELETE',
    );
    del.flush(null, { status: 204, statusText: 'No Content' });
    await confirming;
    // Both lists are read again.
    (await sent(page.backend, (r) => r.url === '/api/assessment-shares')).flush({ items: [] });
    (await sent(page.backend, (r) => r.url === '/api/assessments')).flush({ ...LIST, waiting: [] });
    await page.harness.fixture.whenStable();
    expect(page.el().textContent).toContain('Nothing is shared.');
  });
});
