import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HttpTestingController } from '@angular/common/http/testing';
import { Component, input, type Type } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatSortHarness } from '@angular/material/sort/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { RouterTestingHarness } from '@angular/router/testing';
import type { FinishedLotTrace, Role, SupplierLotTrace, TraceNode } from '@batchproof/shared';
import { signedInAs } from '../auth/signed-in-as';
import FinishedLotTracePage from './finished-lot-trace/finished-lot-trace-page';
import SupplierLotTracePage from './supplier-lot-trace/supplier-lot-trace-page';
import { TraceGraph } from './trace-graph/trace-graph';

const LOT = '11111111-1111-4111-8111-111111111111';
const B1 = '22222222-2222-4222-8222-222222222221';
const B3 = '22222222-2222-4222-8222-222222222223';
const HARBOUR = '33333333-3333-4333-8333-333333333331';
const MARKET = '33333333-3333-4333-8333-333333333332';

/** The graph drawn in a browser; here only what it was given, since the test DOM cannot lay out SVG. */
@Component({
  selector: 'bp-trace-graph',
  template: `<figure role="group" [attr.aria-label]="summary()">
    {{ nodes().length }} nodes
  </figure>`,
})
class GraphStub {
  readonly nodes = input.required<readonly TraceNode[]>();
  readonly edges = input.required<readonly unknown[]>();
  readonly summary = input.required<string>();
}

const node = (kind: TraceNode['kind'], recordId: string, label: string): TraceNode => ({
  id: `${kind}:${recordId}`,
  kind,
  recordId,
  label,
  detail: null,
});

const FORWARD: SupplierLotTrace = {
  supplierLot: {
    id: LOT,
    lotNumber: 'CA-2601-A',
    materialId: 'm1',
    materialName: 'Citric Acid Fine',
    supplierId: 's1',
    supplierName: 'Tarnwell Acids',
    quantity: 25,
    unit: 'kg',
    receivedOn: '2026-01-05',
    expiresOn: '2027-01-05',
  },
  batches: [
    {
      batchId: B1,
      batchCode: '260110-MF-1',
      formulaId: 'f1',
      productName: 'Moonlit Fizz',
      madeOn: '2026-01-10',
      unitsMade: 100,
      quantityUsed: 2,
      gramsUsed: 2000,
      unitsDelivered: 60,
      deliveries: [
        {
          deliveryId: 'd1',
          deliveredOn: '2026-01-20',
          reference: 'INV-7',
          customerId: HARBOUR,
          customerName: 'Harbour Soap Co',
          units: 40,
        },
        {
          deliveryId: 'd2',
          deliveredOn: '2026-01-21',
          reference: null,
          customerId: MARKET,
          customerName: 'Saturday Market Stall',
          units: 20,
        },
      ],
    },
    {
      batchId: B3,
      batchCode: '260115-BM-1',
      formulaId: 'f2',
      productName: 'Bath Melt',
      madeOn: '2026-01-15',
      unitsMade: null,
      quantityUsed: 0.25,
      gramsUsed: 250,
      unitsDelivered: 0,
      deliveries: [],
    },
  ],
  totals: { batches: 2, unitsMade: 100, unitsDelivered: 60, customers: 2 },
  nodes: [
    node('supplier-lot', LOT, 'CA-2601-A'),
    node('batch', B1, '260110-MF-1'),
    node('customer', HARBOUR, 'Harbour Soap Co'),
    node('customer', MARKET, 'Saturday Market Stall'),
    node('batch', B3, '260115-BM-1'),
  ],
  edges: [],
  traceMilliseconds: 3.2,
};

const BACKWARD: FinishedLotTrace = {
  finishedLot: {
    batchId: B1,
    batchCode: '260110-MF-1',
    formulaId: 'f1',
    productName: 'Moonlit Fizz',
    versionNumber: 2,
    madeOn: '2026-01-10',
    unitsMade: 100,
    expiresOn: '2027-01-10',
    bestBeforeMonth: null,
  },
  lines: [
    {
      lineNumber: 2,
      supplierLot: {
        ...FORWARD.supplierLot,
        id: 'l2',
        lotNumber: 'BS-2601',
        materialName: 'Baking Soda',
        supplierId: null,
        supplierName: null,
        expiresOn: null,
      },
      quantityUsed: 4,
      gramsUsed: 4000,
      documents: [],
    },
    {
      lineNumber: 1,
      supplierLot: FORWARD.supplierLot,
      quantityUsed: 2,
      gramsUsed: 2000,
      documents: [
        {
          id: 'doc1',
          kind: 'sds',
          title: 'Citric acid SDS',
          issuedOn: '2025-11-01',
          belongsTo: 'material',
        },
      ],
    },
  ],
  deliveries: FORWARD.batches[0]!.deliveries,
  totals: { supplierLots: 2, suppliers: 1, unitsDelivered: 60, customers: 2 },
  nodes: [],
  edges: [],
  traceMilliseconds: 2,
};

async function open(role: Role, page: Type<unknown>, url: string) {
  TestBed.overrideComponent(page, {
    remove: { imports: [TraceGraph] },
    add: { imports: [GraphStub] },
  });
  const backend = await signedInAs(role, [
    { path: 'trace/supplier-lots/:id', component: SupplierLotTracePage },
    { path: 'trace/finished-lots/:id', component: FinishedLotTracePage },
  ]);
  const harness = await RouterTestingHarness.create();
  await harness.navigateByUrl(url);
  const element = () => harness.routeNativeElement as HTMLElement;
  return {
    harness,
    backend,
    loader: TestbedHarnessEnvironment.loader(harness.fixture),
    text: () => element().textContent ?? '',
    links: () =>
      [...element().querySelectorAll('a')].map((a) => [
        a.textContent!.trim(),
        a.getAttribute('href'),
      ]),
  };
}

async function answer(backend: HttpTestingController, url: string, body: object, status = 200) {
  const req = await vi.waitFor(() => backend.expectOne(url));
  if (status === 200) req.flush(body);
  else req.flush(body, { status, statusText: 'Not Found' });
}

/** A table's cells by column, found by its accessible name. */
async function cells(loader: ReturnType<typeof TestbedHarnessEnvironment.loader>, label: string) {
  const table = await loader.getHarness(
    MatTableHarness.with({ selector: `[aria-label="${label}"]` }),
  );
  const columns = await table.getCellTextByColumnName();
  return (key: string) => columns[key]!.text;
}

// Reading tables through their harnesses takes seconds on a busy machine: more than the default 5 s.
describe('trace pages', { timeout: 20_000 }, () => {
  beforeEach(() => localStorage.clear());

  it('forward: the batches and their deliveries as tables, with units', async () => {
    const page = await open('viewer', SupplierLotTracePage, `/trace/supplier-lots/${LOT}`);
    await answer(page.backend, `/api/trace/supplier-lots/${LOT}`, FORWARD);
    await page.harness.fixture.whenStable();

    const batches = await cells(page.loader, 'Batches that used this lot');
    expect(batches('batchCode')).toEqual(['260110-MF-1', '260115-BM-1']);
    expect(batches('quantityUsed')).toEqual(['2 kg', '0.25 kg']);
    expect(batches('unitsMade')).toEqual(['100', 'not counted']);
    expect(batches('unitsDelivered')).toEqual(['60', '0']);
    const deliveries = await cells(page.loader, 'Deliveries of the batches that used this lot');
    expect(deliveries('customerName')).toEqual(['Harbour Soap Co', 'Saturday Market Stall']);
    expect(deliveries('units')).toEqual(['40', '20']);
    expect(deliveries('reference')).toEqual(['INV-7', '']);
  });

  it('forward: links to each record, a summary for the graph, and no recall for a viewer', async () => {
    const page = await open('viewer', SupplierLotTracePage, `/trace/supplier-lots/${LOT}`);
    await answer(page.backend, `/api/trace/supplier-lots/${LOT}`, FORWARD);
    await page.harness.fixture.whenStable();

    expect(page.text()).toContain('Trace forward: lot CA-2601-A');
    expect(page.links()).toEqual(
      expect.arrayContaining([
        ['260110-MF-1', `/production/${B1}`],
        ['Harbour Soap Co', `/deliveries/customers/${HARBOUR}`],
        ['inventory_2 Open the lot', `/lots/${LOT}`],
      ]),
    );
    const figure = (page.harness.routeNativeElement as HTMLElement).querySelector('figure')!;
    expect(figure.getAttribute('aria-label')).toBe(
      'Supplier lot CA-2601-A of Citric Acid Fine went into 2 batches, delivered to 2 customers: 60 units in all.',
    );
    // Only the owner opens recalls.
    expect(page.text()).not.toContain('Open a recall');
  });

  it('sorts a table by a column, numbers as numbers, both ways', async () => {
    const page = await open('production', SupplierLotTracePage, `/trace/supplier-lots/${LOT}`);
    await answer(page.backend, `/api/trace/supplier-lots/${LOT}`, FORWARD);
    await page.harness.fixture.whenStable();

    const sort = await page.loader.getHarness(
      MatSortHarness.with({ selector: '[aria-label="Batches that used this lot"]' }),
    );
    const [used] = await sort.getSortHeaders({ label: 'Used' });
    await used!.click();
    expect((await cells(page.loader, 'Batches that used this lot'))('batchCode')).toEqual([
      '260115-BM-1',
      '260110-MF-1',
    ]);
    await used!.click();
    expect((await cells(page.loader, 'Batches that used this lot'))('batchCode')).toEqual([
      '260110-MF-1',
      '260115-BM-1',
    ]);
  });

  it('the owner opens a recall of the supplier lot from its trace', async () => {
    const page = await open('owner', SupplierLotTracePage, `/trace/supplier-lots/${LOT}`);
    await answer(page.backend, `/api/trace/supplier-lots/${LOT}`, FORWARD);
    await page.harness.fixture.whenStable();
    expect(page.links()).toContainEqual([
      'campaign Open a recall',
      `/recalls/new?supplierLot=${LOT}`,
    ]);
  });

  it('backward: every supplier lot by line with supplier and documents; a recall of this lot', async () => {
    const page = await open('owner', FinishedLotTracePage, `/trace/finished-lots/${B1}`);
    await answer(page.backend, `/api/trace/finished-lots/${B1}`, BACKWARD);
    await page.harness.fixture.whenStable();

    const lines = await cells(page.loader, 'Supplier lots used by this finished lot');
    expect(lines('lotNumber')).toEqual(['BS-2601', 'CA-2601-A']);
    expect(lines('supplier')).toEqual(['not recorded', 'Tarnwell Acids']);
    expect(lines('documents')[0]).toBe('none on file');
    expect(lines('documents')[1]).toMatch(/^SDS: Citric acid SDS \(.+\)$/);
    const sort = await page.loader.getHarness(
      MatSortHarness.with({ selector: '[aria-label="Supplier lots used by this finished lot"]' }),
    );
    const [line] = await sort.getSortHeaders({ label: 'Line' });
    await line!.click();
    expect(
      (await cells(page.loader, 'Supplier lots used by this finished lot'))('lineNumber'),
    ).toEqual(['1', '2']);

    const deliveries = await cells(page.loader, 'Deliveries of this finished lot');
    expect(deliveries('customerName')).toEqual(['Harbour Soap Co', 'Saturday Market Stall']);
    expect(page.links()).toContainEqual([
      'campaign Open a recall',
      `/recalls/new?finishedLots=${B1}`,
    ]);
    expect(page.text()).toContain('Trace back: finished lot 260110-MF-1');
  });

  it("says the server's reason when there is nothing to trace (a draft batch)", async () => {
    const page = await open('viewer', FinishedLotTracePage, `/trace/finished-lots/${B3}`);
    const message =
      'Batch 260115-BM-1 is not released yet, so it is not a finished lot and has nothing to trace.';
    await answer(
      page.backend,
      `/api/trace/finished-lots/${B3}`,
      { error: { code: 'not_found', message } },
      404,
    );
    await vi.waitFor(() => expect(page.text()).toContain(message));
  });
});
