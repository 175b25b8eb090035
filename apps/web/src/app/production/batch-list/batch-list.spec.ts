import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatSortHarness } from '@angular/material/sort/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { Router } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import type { BatchPage, Role } from '@batchproof/shared';
import { signedInAs } from '../../auth/signed-in-as';
import { aBatchListItem } from '../production-testing';
import BatchList from './batch-list';

const PAGE: BatchPage = {
  items: [
    aBatchListItem({ outOfTolerance: 2 }),
    aBatchListItem({
      id: 'b2',
      batchCode: '261120-SGF-004',
      madeOn: '2026-11-20',
      state: 'released',
      readyOn: '2026-12-18',
      unitsMade: 24,
    }),
  ],
  total: 2,
  page: 1,
  pageSize: 25,
};

const isBatches = (r: { url: string }) => r.url === '/api/batches';

async function openAs(role: Role, url = '/production') {
  const backend = await signedInAs(role, [
    { path: 'production', component: BatchList },
    { path: 'production/:id', children: [] },
  ]);
  const harness = await RouterTestingHarness.create();
  await harness.navigateByUrl(url, BatchList);
  return { harness, backend, loader: TestbedHarnessEnvironment.loader(harness.fixture) };
}

async function answerBatches(backend: HttpTestingController, page: BatchPage = PAGE) {
  const req = await vi.waitFor(() => backend.expectOne(isBatches));
  req.flush(page);
  return req;
}

describe('BatchList', () => {
  beforeEach(() => localStorage.clear());

  it('asks for the latest batches first, and shows state, units and out-of-tolerance lines in words', async () => {
    const { harness, backend, loader } = await openAs('viewer');
    const req = await answerBatches(backend);
    await harness.fixture.whenStable();

    expect(req.request.params.get('sort')).toBe('madeOn');
    expect(req.request.params.get('dir')).toBe('desc');
    const table = await loader.getHarness(MatTableHarness);
    const cells = await table.getCellTextByColumnName();
    expect(cells['batchCode']!.text).toEqual(['261202-SGF-001', '261120-SGF-004']);
    expect(cells['state']!.text).toEqual(['edit_noteDraft', 'verifiedReleased']);
    expect(cells['unitsMade']!.text).toEqual(['—', '24']);
    expect(cells['outOfTolerance']!.text).toEqual(['warning2 lines', 'none']);
    // A viewer reads; only those who record batches start one.
    expect((harness.routeNativeElement as HTMLElement).textContent).not.toContain('Start a batch');
  });

  it('sorting by a column puts the sort in the URL, which asks the server again', async () => {
    const { harness, backend, loader } = await openAs('production');
    await answerBatches(backend);
    await harness.fixture.whenStable();

    const sort = await loader.getHarness(MatSortHarness);
    const [header] = await sort.getSortHeaders({ label: 'Batch code' });
    const clicked = header!.click();
    const again = await answerBatches(backend);
    expect(again.request.params.get('sort')).toBe('batchCode');
    expect(again.request.params.get('dir')).toBe('asc');
    expect(TestBed.inject(Router).url).toContain('sort=batchCode');
    await clicked;
  });

  it('sends the state filter from the URL and offers to clear it when nothing matches', async () => {
    const { harness, backend } = await openAs('production', '/production?state=released&q=SGF');
    const req = await answerBatches(backend, { items: [], total: 0, page: 1, pageSize: 25 });
    await harness.fixture.whenStable();

    expect(req.request.params.get('state')).toBe('released');
    expect(req.request.params.get('q')).toBe('SGF');
    const el = harness.routeNativeElement as HTMLElement;
    expect(el.textContent).toContain('No batches match these filters.');
    expect(el.textContent).toContain('Start a batch');
  });
});
