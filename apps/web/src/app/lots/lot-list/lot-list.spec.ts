import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatSortHarness } from '@angular/material/sort/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { Router } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import type { Lot, LotPage, Role } from '@batchproof/shared';
import { signedInAs } from '../../auth/signed-in-as';
import { aMaterial, answerMaterialsRead } from '../../materials/materials-testing';
import { addDays } from '../lot-expiry';
import LotList from './lot-list';

const SHEA = '0b4c7a52-2c1e-4a55-9d5e-6f1f3b2a9c01';
/** Shea butter's full record, as the one material read model reads it. */
const SHEA_MATERIAL = aMaterial(SHEA, {
  tradeName: 'Shea butter, refined',
  inci: 'Butyrospermum Parkii Butter',
  category: 'butter',
});

function lot(overrides: Partial<Lot>): Lot {
  return {
    id: 'l1',
    createdAt: '2026-03-01T10:00:00.000Z',
    updatedAt: '2026-03-01T10:00:00.000Z',
    materialId: SHEA,
    materialName: 'Shea butter, refined',
    supplierName: 'Larkfield Supplies',
    supplierLotNumber: 'SB-2231',
    quantity: 5000,
    unit: 'g',
    receivedOn: '2026-03-01',
    expiresOn: '2099-03-01',
    unitCost: 0.012,
    notes: null,
    stockOnHand: 3250.5,
    ...overrides,
  };
}

const PAGE: LotPage = {
  items: [
    lot({}),
    lot({
      id: 'l2',
      materialName: 'Citric acid, fine',
      supplierName: null,
      supplierLotNumber: 'CA-77',
      quantity: 2,
      unit: 'kg',
      stockOnHand: 2,
      expiresOn: '2020-01-31',
      unitCost: null,
    }),
  ],
  total: 2,
  page: 1,
  pageSize: 25,
};

const isLots = (r: { url: string }) => r.url === '/api/lots';

async function openAs(role: Role, url = '/lots') {
  const backend = await signedInAs(role, [
    { path: 'lots', component: LotList },
    { path: 'lots/:id', children: [] },
  ]);
  const harness = await RouterTestingHarness.create();
  await harness.navigateByUrl(url, LotList);
  return { harness, backend, loader: TestbedHarnessEnvironment.loader(harness.fixture) };
}

/** Answers the next lots read, after it is sent, and returns it. */
async function answerLots(backend: HttpTestingController, page: LotPage = PAGE) {
  const req = await vi.waitFor(() => backend.expectOne(isLots));
  req.flush(page);
  return req;
}

describe('LotList', () => {
  beforeEach(() => localStorage.clear());

  it('sends the filter, sort and page from the URL to the server', async () => {
    const { harness, backend } = await openAs(
      'formulator',
      `/lots?q=SB-&materialId=${SHEA}&expiry=30&sort=expiresOn&dir=desc&page=2&pageSize=50`,
    );
    const req = backend.expectOne(isLots);
    // The material filter shows the chosen material's name, read by its id.
    await answerMaterialsRead(backend, [SHEA_MATERIAL]);
    req.flush({ ...PAGE, page: 2, pageSize: 50, total: 52 });
    await harness.fixture.whenStable();

    const params = req.request.params;
    expect(params.get('q')).toBe('SB-');
    expect(params.get('materialId')).toBe(SHEA);
    expect(params.get('expiresBefore')).toBe(addDays(new Date(), 30));
    expect(params.get('sort')).toBe('expiresOn');
    expect(params.get('dir')).toBe('desc');
    expect(params.get('page')).toBe('2');
    expect(params.get('pageSize')).toBe('50');
    const el = harness.routeNativeElement as HTMLElement;
    const inputs = Array.from(el.querySelectorAll('input')).map((i) => i.value);
    expect(inputs).toEqual(['SB-', 'Shea butter, refined']);
    expect(el.querySelector('mat-paginator')!.textContent).toContain('51 – 52 of 52');
  });

  it('shows received quantity and stock on hand with their units, and flags an expired lot in words', async () => {
    const { harness, backend, loader } = await openAs('viewer');
    await answerLots(backend);
    await harness.fixture.whenStable();

    const table = await loader.getHarness(MatTableHarness);
    const cells = await table.getCellTextByColumnName();
    expect(cells['materialName']!.text).toEqual(['Shea butter, refined', 'Citric acid, fine']);
    expect(cells['supplierName']!.text).toEqual(['Larkfield Supplies', 'not recorded']);
    expect(cells['quantity']!.text).toEqual(['5,000 g', '2 kg']);
    expect(cells['stockOnHand']!.text).toEqual(['3,250.5 g', '2 kg']);
    expect(cells['unitCost']!.text).toEqual(['0.012 / g', '—']);
    expect(cells['expiresOn']!.text[0]).not.toMatch(/Expire/);
    expect(cells['expiresOn']!.text[1]).toContain('Expired');
  });

  it('sorting by a column puts the sort in the URL, which asks the server again', async () => {
    const { harness, backend, loader } = await openAs('viewer');
    await answerLots(backend);
    await harness.fixture.whenStable();

    const sort = await loader.getHarness(MatSortHarness);
    const [header] = await sort.getSortHeaders({ label: 'Supplier lot' });
    const clicked = header!.click();
    const again = await answerLots(backend);
    expect(again.request.params.get('sort')).toBe('supplierLotNumber');
    expect(again.request.params.get('dir')).toBe('asc');
    expect(TestBed.inject(Router).url).toContain('sort=supplierLotNumber');
    await clicked;
  });

  it('offers "Record goods-in" to a formulator, and says what to do when there are no lots', async () => {
    const { harness, backend } = await openAs('formulator');
    await answerLots(backend, { items: [], total: 0, page: 1, pageSize: 25 });
    await harness.fixture.whenStable();

    const el = harness.routeNativeElement as HTMLElement;
    const links = Array.from(el.querySelectorAll('a')).map((a) => a.textContent!.trim());
    expect(links).toContain('add Record goods-in');
    expect(el.textContent).toContain('No goods-in recorded yet. When a delivery arrives');
  });

  it('offers production "Record goods-in": production receives deliveries', async () => {
    const { harness, backend } = await openAs('production');
    await answerLots(backend);
    await harness.fixture.whenStable();

    const el = harness.routeNativeElement as HTMLElement;
    expect(el.querySelector('a[href="/lots/new"]')?.textContent).toContain('Record goods-in');
  });

  it('shows a viewer no write actions', async () => {
    const { harness, backend } = await openAs('viewer');
    await answerLots(backend);
    await harness.fixture.whenStable();

    const el = harness.routeNativeElement as HTMLElement;
    expect(el.textContent).not.toContain('Record goods-in');
    expect(el.querySelector('a[href="/lots/new"]')).toBeNull();
    // Each lot still opens, read-only.
    expect(el.querySelector('a[href="/lots/l1"]')).not.toBeNull();
  });
});
