import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { TestRequest } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatPaginatorHarness } from '@angular/material/paginator/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatSortHarness } from '@angular/material/sort/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { Router } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import type { MaterialPage, Role } from '@batchproof/shared';
import { signedInAs } from '../../auth/signed-in-as';
import MaterialList from './material-list';

const PAGE: MaterialPage = {
  items: [
    {
      id: 'm1',
      tradeName: 'Sea Glass Mica',
      inci: 'Mica, Titanium Dioxide, Chromium Oxide Greens',
      usName: null,
      cas: '12001-26-2',
      category: 'colourant',
      supplierId: 's1',
      supplierName: 'Wrenfield Supply',
      colourIndex: 'CI 77019',
      functions: ['colourant'],
      updatedAt: '2026-03-01T10:00:00.000Z',
    },
  ],
  total: 60,
  page: 1,
  pageSize: 25,
};

const isList = (r: { url: string }) => r.url === '/api/materials';

async function openList(url: string, role: Role = 'formulator') {
  const backend = await signedInAs(role, [{ path: 'materials', component: MaterialList }]);
  const harness = await RouterTestingHarness.create();
  await harness.navigateByUrl(url, MaterialList);
  return { harness, backend, loader: TestbedHarnessEnvironment.loader(harness.fixture) };
}

type Opened = Awaited<ReturnType<typeof openList>>;

/** Waits for the next list request; a pending resource keeps the fixture unstable. */
async function nextListRequest(o: Opened): Promise<TestRequest> {
  return vi.waitFor(() => {
    const [req] = o.backend.match(isList);
    if (!req) throw new Error('no list request yet');
    return req;
  });
}

describe('MaterialList', () => {
  beforeEach(() => localStorage.clear());

  it('asks the server for the filter, category, sort and page given in the URL', async () => {
    const o = await openList(
      '/materials?q=mica&category=colourant&sort=updatedAt&dir=desc&page=2&pageSize=50',
    );
    const req = o.backend.expectOne(isList);
    const params = req.request.params;
    expect(params.get('q')).toBe('mica');
    expect(params.get('category')).toBe('colourant');
    expect(params.get('sort')).toBe('updatedAt');
    expect(params.get('dir')).toBe('desc');
    expect(params.get('page')).toBe('2');
    expect(params.get('pageSize')).toBe('50');
    req.flush({ ...PAGE, page: 2, pageSize: 50 });
    await o.harness.fixture.whenStable();

    const cells = await (await o.loader.getHarness(MatTableHarness)).getCellTextByColumnName();
    expect(cells['tradeName']!.text).toEqual(['Sea Glass Mica']);
    expect(cells['category']!.text).toEqual(['Colourant']);
    expect(cells['supplier']!.text).toEqual(['Wrenfield Supply']);
    expect(cells['numbers']!.text).toEqual(['CI 77019']);
  });

  it('sorts on the server when a column header is clicked, keeping the sort in the URL', async () => {
    const o = await openList('/materials');
    o.backend.expectOne(isList).flush(PAGE);
    await o.harness.fixture.whenStable();

    const sort = await o.loader.getHarness(MatSortHarness);
    const [header] = await sort.getSortHeaders({ label: 'INCI name' });
    // The harness waits for the page to settle after the click, which the new read prevents
    // until it is answered: answer it while the click is pending.
    const clicked = header!.click();
    const req = await nextListRequest(o);
    expect(req.request.params.get('sort')).toBe('inci');
    expect(req.request.params.get('dir')).toBe('asc');
    expect(TestBed.inject(Router).url).toBe('/materials?sort=inci&dir=asc');
    req.flush(PAGE);
    await clicked;
  });

  it('filters by category on the server, starting again from the first page', async () => {
    const o = await openList('/materials?page=2');
    o.backend.expectOne(isList).flush({ ...PAGE, page: 2 });
    await o.harness.fixture.whenStable();

    const select = await o.loader.getHarness(MatSelectHarness);
    await select.open();
    const choosing = select.clickOptions({ text: 'Fragrance' });
    const req = await nextListRequest(o);
    expect(req.request.params.get('category')).toBe('fragrance');
    expect(req.request.params.get('page')).toBe('1');
    req.flush({ ...PAGE, items: [] });
    await choosing;
    expect(TestBed.inject(Router).url).toBe('/materials?category=fragrance');
  });

  it('asks the server for the next page when the paginator moves on', async () => {
    const o = await openList('/materials');
    o.backend.expectOne(isList).flush(PAGE);
    await o.harness.fixture.whenStable();

    const paging = (await o.loader.getHarness(MatPaginatorHarness)).goToNextPage();
    const req = await nextListRequest(o);
    expect(req.request.params.get('page')).toBe('2');
    expect(req.request.params.get('pageSize')).toBe('25');
    req.flush({ ...PAGE, page: 2 });
    await paging;
  });

  it('offers New material and Import CSV to writers only, and says what to do when empty', async () => {
    const writer = await openList('/materials');
    writer.backend.expectOne(isList).flush({ ...PAGE, items: [], total: 0 });
    await writer.harness.fixture.whenStable();
    const el = writer.harness.routeNativeElement!;
    expect(el.textContent).toContain('New material');
    expect(el.textContent).toContain('Import CSV');
    expect(el.textContent).toContain('No materials yet. Add your first with New material');

    TestBed.resetTestingModule();
    const viewer = await openList('/materials', 'viewer');
    viewer.backend.expectOne(isList).flush({ ...PAGE, items: [], total: 0 });
    await viewer.harness.fixture.whenStable();
    const text = viewer.harness.routeNativeElement!.textContent;
    expect(text).not.toContain('New material');
    expect(text).not.toContain('Import CSV');
    expect(text).toContain('Export CSV');
  });
});
