import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HttpRequest } from '@angular/common/http';
import type { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatAutocompleteHarness } from '@angular/material/autocomplete/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { Router } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import type { Lot, MaterialSummary, Role, StockMovement } from '@batchproof/shared';
import { signedInAs } from '../../auth/signed-in-as';
import { aMaterial, answerMaterialsRead } from '../../materials/materials-testing';
import LotPage from './lot-page';

const SHEA = '0b4c7a52-2c1e-4a55-9d5e-6f1f3b2a9c01';
const COCOA = '7d2e1c40-9a3b-4c8e-b1f2-3a4b5c6d7e8f';
const LOT_ID = 'c1d2e3f4-0000-4000-8000-000000000001';

function material(id: string, tradeName: string, inci: string): MaterialSummary {
  return {
    id,
    tradeName,
    inci,
    usName: null,
    cas: null,
    category: 'butter',
    supplierId: null,
    supplierName: null,
    colourIndex: null,
    functions: [],
    updatedAt: '2026-01-01T00:00:00.000Z',
  };
}

/** Shea butter's full record, as the one material read model reads it. */
const SHEA_RECORD = aMaterial(SHEA, {
  tradeName: 'Shea butter, refined',
  inci: 'Butyrospermum Parkii Butter',
  category: 'butter',
});

const LOT: Lot = {
  id: LOT_ID,
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
  notes: 'Two tubs.',
  stockOnHand: 3250.5,
};

async function openAs(role: Role, url: string) {
  const backend = await signedInAs(role, [
    { path: 'lots', children: [] },
    { path: 'lots/new', component: LotPage },
    { path: 'lots/:id', component: LotPage },
  ]);
  const harness = await RouterTestingHarness.create();
  await harness.navigateByUrl(url);
  const loader = TestbedHarnessEnvironment.loader(harness.fixture);
  const field = (label: string) =>
    loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }));
  const input = async (label: string) =>
    (await (await field(label)).getControl()) as MatInputHarness;
  return {
    harness,
    backend,
    loader,
    field,
    errors: async (label: string) => (await field(label)).getTextErrors(),
    value: async (label: string) => (await input(label)).getValue(),
    fill: async (label: string, value: string) => (await input(label)).setValue(value),
    click: async (text: string | RegExp, from: HarnessLoader = loader) =>
      (await from.getHarness(MatButtonHarness.with({ text }))).click(),
    text: () => (harness.routeNativeElement as HTMLElement).textContent ?? '',
  };
}

/** Waits until the one request matching `match` has been sent, and returns it. */
const sent = (backend: HttpTestingController, match: (r: HttpRequest<unknown>) => boolean) =>
  vi.waitFor(() => backend.expectOne(match));

/**
 * What moved LOT's stock, newest first: a spillage and a released batch's line, which take its
 * 5000 g received down to the 3250.5 g on hand (movements store stock taken out as positive).
 */
const MOVEMENTS: StockMovement[] = [
  {
    id: 'd4e5f6a7-0000-4000-8000-000000000002',
    lotId: LOT_ID,
    kind: 'adjustment',
    quantity: 249.5,
    unit: 'g',
    grams: null,
    batchId: null,
    batchCode: null,
    lineNumber: null,
    reason: 'spillage',
    note: 'Tub dropped in the store room.',
    createdAt: '2026-03-12T12:00:00.000Z',
    createdByName: 'Ada Marsh',
  },
  {
    id: 'd4e5f6a7-0000-4000-8000-000000000001',
    lotId: LOT_ID,
    kind: 'batch',
    quantity: 1500,
    unit: 'g',
    grams: 1500,
    batchId: 'e5f6a7b8-0000-4000-8000-000000000001',
    batchCode: '260310-SGF-003',
    lineNumber: 2,
    reason: null,
    note: null,
    createdAt: '2026-03-10T12:00:00.000Z',
    createdByName: 'Tomas Reed',
  },
];

/**
 * Answers the lot read, then the reads its page starts once the lot is shown: its documents and
 * its stock movements (resource reads keep the page from settling until they are answered).
 */
async function answerLot(backend: HttpTestingController, lot: Lot = LOT) {
  (await sent(backend, (r) => r.url === `/api/lots/${lot.id}`)).flush(lot);
  const docs = await sent(backend, (r) => r.url === '/api/documents');
  expect(docs.request.params.get('lotId')).toBe(lot.id);
  docs.flush({ items: [] });
  const movements = await sent(backend, (r) => r.url === `/api/lots/${lot.id}/movements`);
  expect(movements.request.method).toBe('GET');
  movements.flush(lot.id === LOT_ID ? MOVEMENTS : []);
}

describe('LotPage', () => {
  beforeEach(() => localStorage.clear());

  it("shows the server's field messages beside the fields and keeps what was typed", async () => {
    const page = await openAs('formulator', `/lots/new?materialId=${SHEA}`);
    await answerMaterialsRead(page.backend, [SHEA_RECORD]);
    await page.harness.fixture.whenStable();
    expect(await page.value('Material')).toBe('Shea butter, refined');

    await page.fill('Supplier lot number', 'SB-2231');
    await page.fill('Quantity received', '5000');
    await page.fill('Received on', '2026-03-01');
    await page.fill('Expiry date', '2027-03-01');
    await page.fill('Cost per g', '0.012');
    await page.click(/Record lot/);

    const post = await sent(page.backend, (r) => r.method === 'POST' && r.url === '/api/lots');
    expect(post.request.body).toEqual({
      materialId: SHEA,
      supplierLotNumber: 'SB-2231',
      quantity: 5000,
      unit: 'g',
      receivedOn: '2026-03-01',
      expiresOn: '2027-03-01',
      unitCost: 0.012,
      notes: null,
    });
    post.flush(
      {
        error: {
          code: 'validation_failed',
          message: 'Some fields need attention.',
          fieldErrors: {
            materialId: ['Choose one of this workshop’s materials'],
            expiresOn: ['The expiry date cannot be before the day it was received'],
          },
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await page.harness.fixture.whenStable();

    expect(await page.errors('Material')).toEqual(['Choose one of this workshop’s materials']);
    expect(await page.errors('Expiry date')).toEqual([
      'The expiry date cannot be before the day it was received',
    ]);
    expect(page.text()).toContain('Some fields need attention.');
    expect(await page.value('Material')).toBe('Shea butter, refined');
    expect(await page.value('Supplier lot number')).toBe('SB-2231');
    expect(await page.value('Quantity received')).toBe('5000');
    expect(await page.value('Expiry date')).toBe('Mar 1, 2027');
  });

  it('sends one Idempotency-Key per submission: a retry after a lost answer reuses it, a changed form gets a new one', async () => {
    const page = await openAs('formulator', `/lots/new?materialId=${SHEA}`);
    await answerMaterialsRead(page.backend, [SHEA_RECORD]);
    await page.harness.fixture.whenStable();
    await page.fill('Supplier lot number', 'SB-2231');
    await page.fill('Quantity received', '5000');
    await page.fill('Received on', '2026-03-01');
    const isPost = (r: HttpRequest<unknown>) => r.method === 'POST' && r.url === '/api/lots';
    const keyOf = (r: { request: HttpRequest<unknown> }) =>
      r.request.headers.get('Idempotency-Key');

    await page.click(/Record lot/);
    const first = await sent(page.backend, isPost);
    const key = keyOf(first);
    expect(key).toMatch(/^[0-9a-f-]{36}$/);
    first.error(new ProgressEvent('error'));
    await page.harness.fixture.whenStable();

    await page.click(/Record lot/);
    const retry = await sent(page.backend, isPost);
    expect(keyOf(retry)).toBe(key);
    retry.error(new ProgressEvent('error'));
    await page.harness.fixture.whenStable();

    await page.fill('Quantity received', '4000');
    await page.click(/Record lot/);
    const changed = await sent(page.backend, isPost);
    expect(keyOf(changed)).not.toBe(key);
  });

  it('refuses an expiry before the day received with the shared message, sending nothing', async () => {
    const page = await openAs('owner', `/lots/new?materialId=${SHEA}`);
    await answerMaterialsRead(page.backend, [SHEA_RECORD]);
    await page.harness.fixture.whenStable();

    await page.fill('Supplier lot number', 'SB-1');
    await page.fill('Quantity received', '250');
    await page.fill('Received on', '2026-03-01');
    await page.fill('Expiry date', '2026-02-01');
    await page.click(/Record lot/);

    expect(await page.errors('Expiry date')).toEqual([
      'The expiry date cannot be before the day it was received',
    ]);
    expect(await page.value('Expiry date')).toBe('2026-02-01');
    page.backend.expectNone((r) => r.method === 'POST');
  });

  it('finds a material as you type and records the lot, then opens it', async () => {
    const page = await openAs('formulator', '/lots/new');
    await page.harness.fixture.whenStable();

    const picker = await page.loader.getHarness(MatAutocompleteHarness);
    // Typing starts a search, which keeps the page busy until it is answered.
    const typing = picker.enterText('coc');
    const search = await sent(
      page.backend,
      (r) => r.url === '/api/materials' && r.params.get('q') === 'coc',
    );
    search.flush({
      items: [material(COCOA, 'Cocoa butter', 'Theobroma Cacao Seed Butter')],
      total: 1,
      page: 1,
      pageSize: 20,
    });
    // The browse-all read from focusing the field was superseded by the search (cancelled).
    page.backend.match((r) => r.url === '/api/materials');
    await typing;
    await picker.selectOption({ text: /Cocoa butter/ });
    expect(await picker.getValue()).toBe('Cocoa butter');

    await page.fill('Supplier lot number', 'CB-9');
    await page.fill('Quantity received', '1');
    await page.fill('Received on', '2026-04-02');
    await page.click(/Record lot/);
    const post = await sent(page.backend, (r) => r.method === 'POST' && r.url === '/api/lots');
    expect(post.request.body).toMatchObject({
      materialId: COCOA,
      quantity: 1,
      expiresOn: null,
      unitCost: null,
    });
    post.flush({
      ...LOT,
      materialId: COCOA,
      materialName: 'Cocoa butter',
      supplierLotNumber: 'CB-9',
    });
    await answerLot(page.backend);
    await page.harness.fixture.whenStable();
    expect(TestBed.inject(Router).url).toBe(`/lots/${LOT_ID}`);
  });

  it('shows stock on hand and lets a formulator correct the lot', async () => {
    const page = await openAs('formulator', `/lots/${LOT_ID}`);
    await answerLot(page.backend);
    await page.harness.fixture.whenStable();

    expect(page.text()).toContain('3,250.5 g');
    // Its stock movements, newest first, signed as changes to the stock on hand.
    const el = page.harness.routeNativeElement as HTMLElement;
    const rows = [...el.querySelectorAll('bp-stock-movements tbody tr')].map((tr) =>
      [...tr.querySelectorAll('td')].map((td) => td.textContent?.replace(/\s+/g, ' ').trim()),
    );
    expect(rows).toEqual([
      [
        'Mar 12, 2026',
        'Adjustment',
        '-249.5 g',
        'Spillage Tub dropped in the store room.',
        'Ada Marsh',
      ],
      ['Mar 10, 2026', 'Batch 260310-SGF-003 line 2', '-1,500 g', '', 'Tomas Reed'],
    ]);
    expect(el.querySelector('bp-stock-movements a')?.getAttribute('href')).toBe(
      `/production/${MOVEMENTS[1]!.batchId}`,
    );
    expect(el.querySelector('bp-stock-movements form')?.textContent).toContain('Adjust stock');
    expect(await page.value('Material')).toBe('Shea butter, refined');
    expect(await page.value('Quantity received')).toBe('5000');
    await page.fill('Quantity received', '1000');
    await page.click(/Save changes/);

    const put = await sent(page.backend, (r) => r.method === 'PUT');
    expect(put.request.url).toBe(`/api/lots/${LOT_ID}`);
    expect(put.request.body).toMatchObject({
      materialId: SHEA,
      quantity: 1000,
      notes: 'Two tubs.',
    });
    put.flush(
      {
        error: {
          code: 'conflict',
          message: 'Batches already used 1750 of this lot.',
          fieldErrors: { quantity: ['The quantity cannot be less than the 1750 already used'] },
        },
      },
      { status: 409, statusText: 'Conflict' },
    );
    await page.harness.fixture.whenStable();
    expect(await page.errors('Quantity received')).toEqual([
      'The quantity cannot be less than the 1750 already used',
    ]);
    expect(await page.value('Quantity received')).toBe('1000');
  });

  it('says plainly why a lot a batch has used cannot be deleted', async () => {
    const page = await openAs('owner', `/lots/${LOT_ID}`);
    await answerLot(page.backend);
    await page.harness.fixture.whenStable();

    await page.click(/Delete lot/);
    const root = TestbedHarnessEnvironment.documentRootLoader(page.harness.fixture);
    const dialog = await root.getHarness(MatDialogHarness);
    expect(await dialog.getTitleText()).toBe('Delete lot SB-2231?');
    await page.click('Delete lot', dialog);
    const del = await sent(page.backend, (r) => r.method === 'DELETE');
    del.flush(
      { error: { code: 'conflict', message: 'Batches have used this lot; it cannot be deleted.' } },
      { status: 409, statusText: 'Conflict' },
    );
    await page.harness.fixture.whenStable();
    expect(page.text()).toContain('Batches have used this lot; it cannot be deleted.');
    expect(TestBed.inject(Router).url).toBe(`/lots/${LOT_ID}`);
  });

  it('lets production correct a lot, but not delete it', async () => {
    const page = await openAs('production', `/lots/${LOT_ID}`);
    await answerLot(page.backend);
    await page.harness.fixture.whenStable();

    expect(await page.value('Quantity received')).toBe('5000');
    expect(page.text()).toContain('Save changes');
    expect(page.text()).not.toContain('Delete lot');
  });

  it('shows a viewer the lot read-only, with no write actions', async () => {
    const page = await openAs('viewer', `/lots/${LOT_ID}`);
    await answerLot(page.backend);
    await page.harness.fixture.whenStable();

    const el = page.harness.routeNativeElement as HTMLElement;
    expect(el.querySelector('form')).toBeNull();
    expect(el.querySelector('input')).toBeNull();
    expect(
      await page.loader.getAllHarnesses(MatButtonHarness.with({ selector: 'button' })),
    ).toEqual([]);
    // The one button-styled control is a link that only reads: the lot's forward trace.
    const links = await page.loader.getAllHarnesses(MatButtonHarness);
    expect(links).toHaveLength(1);
    expect(await links[0]!.getText()).toContain('Trace forward');
    expect(await (await links[0]!.host()).getAttribute('href')).toBe(
      `/trace/supplier-lots/${LOT_ID}`,
    );
    expect(page.text()).toContain('SB-2231');
    expect(page.text()).toContain('3,250.5 g');
    expect(page.text()).toContain('Two tubs.');
    expect(el.querySelector('bp-stock-movements')?.textContent).toContain('260310-SGF-003');
    expect(page.text()).not.toContain('Adjust stock');
  });

  it('refuses a received date in the future beside the field, sending nothing', async () => {
    const page = await openAs('owner', `/lots/new?materialId=${SHEA}`);
    await answerMaterialsRead(page.backend, [SHEA_RECORD]);
    await page.harness.fixture.whenStable();

    await page.fill('Supplier lot number', 'SB-1');
    await page.fill('Quantity received', '250');
    await page.fill('Received on', '2999-03-01');
    await page.click(/Record lot/);

    expect(await page.errors('Received on')).toEqual(['The received date cannot be in the future']);
    page.backend.expectNone((r) => r.method === 'POST');
  });

  it('records a lot whose number was already received, and shows the warning on its page', async () => {
    const page = await openAs('production', `/lots/new?materialId=${SHEA}`);
    await answerMaterialsRead(page.backend, [SHEA_RECORD]);
    await page.harness.fixture.whenStable();
    await page.fill('Supplier lot number', 'SB-2231');
    await page.fill('Quantity received', '5000');
    await page.fill('Received on', '2026-03-01');
    await page.click(/Record lot/);

    const warning = {
      field: 'supplierLotNumber',
      message:
        'This material already has lot SB-2231, received 2026-02-01. Check this is not the same delivery entered twice.',
    };
    const post = await sent(page.backend, (r) => r.method === 'POST' && r.url === '/api/lots');
    post.flush({ ...LOT, warnings: [warning] }, { status: 201, statusText: 'Created' });
    await vi.waitFor(() => expect(TestBed.inject(Router).url).toBe(`/lots/${LOT_ID}`));
    await answerLot(page.backend);
    await vi.waitFor(() => expect(page.text()).toContain(warning.message));
  });
});
