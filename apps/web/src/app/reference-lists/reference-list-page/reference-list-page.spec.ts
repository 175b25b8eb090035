import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatSortHarness } from '@angular/material/sort/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { provideRouter, Router, withComponentInputBinding } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import type { ReferenceRowsPage } from '@batchproof/shared';
import ReferenceListPage from './reference-list-page';

const PAGE: ReferenceRowsPage = {
  list: {
    key: 'eu-annex-iii-allergens',
    title: 'Labelled fragrance allergens',
    description: 'Annex III entries named above the threshold.',
    rowCount: 2,
    syncedAt: '2026-12-01T00:00:00.000Z',
  },
  items: [
    {
      rowId: 'coumarin',
      label: 'Coumarin',
      source: 'Regulation (EC) No 1223/2009, Annex III, entry 77',
      status: 'C',
      effectiveFrom: null,
      effectiveTo: null,
      note: null,
      data: { cas: '91-64-5', annexRef: '77' },
    },
    {
      rowId: 'made-up',
      label: 'Example Ketone',
      source: 'Commission Regulation (EU) 2023/1545',
      status: 'M',
      effectiveFrom: '2023-08-16',
      effectiveTo: null,
      note: 'Label name not yet confirmed.',
      data: {},
    },
  ],
  total: 2,
  page: 1,
  pageSize: 25,
};

async function open(url: string) {
  TestBed.configureTestingModule({
    providers: [
      provideZonelessChangeDetection(),
      provideRouter(
        [{ path: 'reference/:key', component: ReferenceListPage }],
        withComponentInputBinding(),
      ),
      provideHttpClient(),
      provideHttpClientTesting(),
    ],
  });
  const backend = TestBed.inject(HttpTestingController);
  const harness = await RouterTestingHarness.create();
  await harness.navigateByUrl(url, ReferenceListPage);
  return { harness, backend, loader: TestbedHarnessEnvironment.loader(harness.fixture) };
}

describe('ReferenceListPage', () => {
  it('asks the server for the page named in the URL and shows each row with its source and certainty', async () => {
    const { harness, backend, loader } = await open(
      '/reference/eu-annex-iii-allergens?q=coum&sort=label&dir=desc',
    );
    const req = backend.expectOne((r) => r.url === '/api/reference/eu-annex-iii-allergens');
    expect(req.request.params.get('q')).toBe('coum');
    expect(req.request.params.get('sort')).toBe('label');
    expect(req.request.params.get('dir')).toBe('desc');
    req.flush(PAGE);
    await harness.fixture.whenStable();

    const table = await loader.getHarness(MatTableHarness);
    const rows = await table.getCellTextByColumnName();
    expect(rows['label']!.text[0]).toContain('Coumarin');
    expect(rows['details']!.text[0]).toContain('91-64-5');
    expect(rows['source']!.text[0]).toContain('Annex III');
    // "How sure" explains itself: what each level rests on, and that an unconfirmed rule warns.
    expect(rows['status']!.text[0]).toContain("Confirmed in the regulation's text");
    expect(rows['status']!.text[1]).toContain('Not yet confirmed: warns, never blocks');
    expect(harness.routeNativeElement!.querySelector('h1')!.textContent).toContain(
      'Labelled fragrance allergens',
    );
  });

  it('sorting by a column puts the sort in the URL, which asks the server again', async () => {
    const { harness, backend, loader } = await open('/reference/eu-annex-iii-allergens');
    backend.expectOne((r) => r.url === '/api/reference/eu-annex-iii-allergens').flush(PAGE);
    await harness.fixture.whenStable();

    const sort = await loader.getHarness(MatSortHarness);
    const [sourceHeader] = await sort.getSortHeaders({ label: 'Source' });
    const clicked = sourceHeader!.click();
    // The click navigates, and the new URL makes the resource ask the server again; answer it
    // as soon as it is sent, since the fixture is not stable while it is pending.
    const again = await vi.waitFor(() =>
      backend.expectOne((r) => r.url === '/api/reference/eu-annex-iii-allergens'),
    );
    expect(again.request.params.get('sort')).toBe('source');
    expect(TestBed.inject(Router).url).toContain('sort=source');
    again.flush(PAGE);
    await clicked;
  });
});
