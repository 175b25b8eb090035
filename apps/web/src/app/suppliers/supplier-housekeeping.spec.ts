import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSlideToggleHarness } from '@angular/material/slide-toggle/testing';
import { Router } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import { TestBed } from '@angular/core/testing';
import type { Supplier, SupplierPage as Page } from '@batchproof/shared';
import { signedInAs } from '../auth/signed-in-as';
import SupplierList from './supplier-list/supplier-list';
import SupplierPage from './supplier-page/supplier-page';

const SUPPLIER: Supplier = {
  id: 's2',
  name: 'alder chemicals',
  contact: null,
  email: null,
  website: null,
  notes: null,
  materialCount: 0,
  archivedAt: null,
  createdAt: '2026-12-01T09:00:00.000Z',
  updatedAt: '2026-12-01T09:00:00.000Z',
};
const WARNING = {
  field: 'name',
  message:
    'Another supplier is already called “Alder Chemicals”. Check this is not the same company entered twice.',
};

async function openAt(url: string) {
  const backend = await signedInAs('formulator', [
    { path: 'suppliers', component: SupplierList },
    { path: 'suppliers/new', component: SupplierPage },
    { path: 'suppliers/:id', component: SupplierPage },
  ]);
  const harness = await RouterTestingHarness.create();
  await harness.navigateByUrl(url);
  return { backend, harness, loader: TestbedHarnessEnvironment.loader(harness.fixture) };
}

const text = (o: Awaited<ReturnType<typeof openAt>>) =>
  (o.harness.fixture.nativeElement as HTMLElement).textContent ?? '';

describe('Suppliers: duplicate names and archived suppliers', () => {
  it('shows the API’s warning about the name beside it after creating, on the new supplier’s page', async () => {
    const o = await openAt('/suppliers/new');
    const name = await o.loader.getHarness(
      MatInputHarness.with({ selector: '[formControlName="name"]' }),
    );
    await name.setValue('alder chemicals');
    await (await o.loader.getHarness(MatButtonHarness.with({ text: /Create supplier/ }))).click();
    o.backend
      .expectOne((r) => r.method === 'POST' && r.url === '/api/suppliers')
      .flush({ ...SUPPLIER, warnings: [WARNING] }, { status: 201, statusText: 'Created' });
    await vi.waitFor(() => expect(TestBed.inject(Router).url).toBe('/suppliers/s2'));
    await vi.waitFor(() => o.backend.expectOne('/api/suppliers/s2').flush(SUPPLIER));
    await vi.waitFor(() => expect(text(o)).toContain(WARNING.message));
  });

  it('asks the server for archived suppliers only when Show archived is on, and marks them', async () => {
    const o = await openAt('/suppliers');
    const first = await vi.waitFor(() => o.backend.expectOne((r) => r.url === '/api/suppliers'));
    expect(first.request.params.has('includeArchived')).toBe(false);
    const empty: Page = { items: [], total: 0, page: 1, pageSize: 25 };
    first.flush(empty);
    const toggle = await o.loader.getHarness(
      MatSlideToggleHarness.with({ label: /Show archived/ }),
    );
    // The list's next read keeps the page busy until it is answered, so the toggle is awaited after.
    const toggling = toggle.toggle();
    const req = await vi.waitFor(() => {
      const [r] = o.backend.match((r) => r.url === '/api/suppliers');
      if (!r) throw new Error('no list request yet');
      return r;
    });
    expect(req.request.params.get('includeArchived')).toBe('true');
    expect(TestBed.inject(Router).url).toContain('includeArchived=true');
    req.flush({
      ...empty,
      items: [{ ...SUPPLIER, archivedAt: '2026-12-01T10:00:00.000Z' }],
      total: 1,
    });
    await toggling;
    await vi.waitFor(() => expect(text(o)).toMatch(/alder chemicals\s*archived/));
  });
});
