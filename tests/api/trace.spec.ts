import { createHash } from 'node:crypto';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  finishedLotTraceSchema,
  ROLES,
  supplierLotTraceSchema,
  traceSearchResultSchema,
  type Role,
} from '@batchproof/shared';
import {
  customers,
  deliveries,
  deliveryLines,
  documents,
  lotConsumptions,
  productIdentities,
} from '../../apps/api/src/db/schema';
import {
  deliveriesOfFinishedLots,
  finishedLotsUsingSupplierLot,
} from '../../apps/api/src/trace/trace-repository';
import { aMaterial } from '../../fixtures/builders/material-builder';
import { startApiHarness, TEST_JWT_SECRET, type ApiHarness } from '../support/api-harness';
import { bearer } from '../support/auth-header';
import { buildFinishedLot, buildReleasedFormula } from '../support/finished-lot-builder';
import { buildLot, buildMaterial, buildSupplier, consumeFromLot } from '../support/row-builders';
import { buildWorkshop, type BuiltWorkshop } from '../support/workshop-builder';

// A hand-built graph, rows inserted straight into the database, with its answer written out:
//
//   supplier lots: CA-1, CA-2 (citric acid, from Tarnwell Acids), BS-1 (baking soda, Brackley
//   Minerals). Documents: the citric acid SDS (material), CA-1's certificate of analysis (lot),
//   an archived citric acid specification (left out everywhere).
//
//   released batches                              units   deliveries
//   B1 260110-MF-1 (Moonlit Fizz)   line 1 CA-1 2 kg    100   Harbour 40 (01-20), Market 20 (01-21),
//                                   line 2 BS-1 4 kg          Harbour 10 (01-25)
//   B2 260112-MF-1 (Moonlit Fizz)   line 1 CA-1 1.5 kg   80   Harbour 30 (01-20)
//                                   amended: CA-1 returned entirely, CA-2 1.5 kg on line 1
//                                   line 2 BS-1 3 kg
//   B3 260115-BM-1 (Test Bath Melt) line 1 CA-2 0.5 kg   50   Online 10 (01-22)
//                                   and CA-1 0.25 kg
//                                   line 2 BS-1 1 kg
//   D1 260116-MF-1 draft, with a stray CA-1 movement (drafts are never finished lots)
//   D2 260117-MF-1 draft, nothing recorded
//   A spillage adjustment of CA-1 (no batch).

let h: ApiHarness;
let w: BuiltWorkshop;
let other: BuiltWorkshop;
const ids = {} as Record<
  | 'ca1'
  | 'ca2'
  | 'bs1'
  | 'b1'
  | 'b2'
  | 'b3'
  | 'd1'
  | 'd2'
  | 'harbour'
  | 'market'
  | 'online'
  | 'tarnwell'
  | 'brackley'
  | 'sds'
  | 'coa'
  | 'citric'
  | 'soda',
  string
>;

async function addDocument(
  owner: { materialId: string } | { lotId: string },
  kind: 'sds' | 'certificate-of-analysis' | 'specification',
  title: string,
  issuedOn: string,
  archived = false,
) {
  const content = Buffer.from(`%PDF-1.4 ${title}`);
  const [row] = await h.handle.db
    .insert(documents)
    .values({
      workshopId: w.id,
      ...owner,
      kind,
      title,
      issuedOn,
      filename: `${kind}.pdf`,
      mimeType: 'application/pdf',
      sizeBytes: content.length,
      sha256: createHash('sha256').update(content).digest('hex'),
      content,
      archivedAt: archived ? new Date() : null,
    })
    .returning();
  return row!.id;
}

async function use(
  batchId: string,
  lotId: string,
  lineNumber: number,
  kg: number,
  kind: 'batch' | 'amendment' = 'batch',
) {
  await h.handle.db.insert(lotConsumptions).values({
    workshopId: w.id,
    lotId,
    batchId,
    lineNumber,
    quantity: kg,
    grams: kg * 1000,
    kind,
  });
}

async function deliver(customerId: string, deliveredOn: string, lines: [string, number][]) {
  const [delivery] = await h.handle.db
    .insert(deliveries)
    .values({ workshopId: w.id, customerId, deliveredOn })
    .returning();
  await h.handle.db.insert(deliveryLines).values(
    lines.map(([batchId, units], i) => ({
      workshopId: w.id,
      deliveryId: delivery!.id,
      position: i + 1,
      batchId,
      units,
    })),
  );
  return delivery!.id;
}

async function buildGraph() {
  const db = h.handle.db;
  ids.tarnwell = (await buildSupplier(db, w.id, { name: 'Tarnwell Acids' })).id;
  ids.brackley = (await buildSupplier(db, w.id, { name: 'Brackley Minerals' })).id;
  ids.citric = (
    await buildMaterial(
      db,
      w.id,
      aMaterial({ tradeName: 'Citric Acid Fine', inci: 'Citric Acid', supplierId: ids.tarnwell }),
    )
  ).id;
  ids.soda = (
    await buildMaterial(db, w.id, aMaterial({ tradeName: 'Baking Soda', supplierId: ids.brackley }))
  ).id;
  const lot = (materialId: string, supplierLotNumber: string) =>
    buildLot(db, w.id, materialId, {
      supplierLotNumber,
      quantity: 25,
      unit: 'kg',
      receivedOn: '2026-01-05',
      expiresOn: '2027-01-05',
    });
  ids.ca1 = (await lot(ids.citric, 'CA-2601-A')).id;
  ids.ca2 = (await lot(ids.citric, 'CA-2601-B')).id;
  ids.bs1 = (await lot(ids.soda, 'BS-2601')).id;
  ids.sds = await addDocument({ materialId: ids.citric }, 'sds', 'Citric acid SDS', '2025-11-01');
  ids.coa = await addDocument(
    { lotId: ids.ca1 },
    'certificate-of-analysis',
    'CoA CA-2601-A',
    '2026-01-02',
  );
  await addDocument({ materialId: ids.citric }, 'specification', 'Old spec', '2024-01-01', true);

  const fizz = await buildReleasedFormula(db, w.id, { name: 'Fizzer base' });
  await db.insert(productIdentities).values({
    workshopId: w.id,
    formulaId: fizz.formulaId,
    identity: { productName: 'Moonlit Fizz' } as typeof productIdentities.$inferInsert.identity,
  });
  const melt = await buildReleasedFormula(db, w.id, { name: 'Test Bath Melt' });
  const batch = (
    f: typeof fizz,
    batchCode: string,
    madeOn: string,
    unitsMade: number | null,
    state: 'draft' | 'released' = 'released',
  ) => buildFinishedLot(db, w.id, { ...f, batchCode, madeOn, unitsMade, state }).then((b) => b.id);
  ids.b1 = await batch(fizz, '260110-MF-1', '2026-01-10', 100);
  ids.b2 = await batch(fizz, '260112-MF-1', '2026-01-12', 80);
  ids.b3 = await batch(melt, '260115-BM-1', '2026-01-15', 50);
  ids.d1 = await batch(fizz, '260116-MF-1', '2026-01-16', null, 'draft');
  ids.d2 = await batch(fizz, '260117-MF-1', '2026-01-17', null, 'draft');

  await use(ids.b1, ids.ca1, 1, 2);
  await use(ids.b1, ids.bs1, 2, 4);
  await use(ids.b2, ids.ca1, 1, 1.5);
  await use(ids.b2, ids.ca1, 1, -1.5, 'amendment');
  await use(ids.b2, ids.ca2, 1, 1.5, 'amendment');
  await use(ids.b2, ids.bs1, 2, 3);
  await use(ids.b3, ids.ca2, 1, 0.5);
  await use(ids.b3, ids.ca1, 1, 0.25);
  await use(ids.b3, ids.bs1, 2, 1);
  await use(ids.d1, ids.ca1, 1, 1);
  await consumeFromLot(db, w.id, ids.ca1, 0.5);

  const customer = async (name: string, kind: 'stockist' | 'market-stall' | 'online-order') => {
    const [row] = await db
      .insert(customers)
      .values({ workshopId: w.id, name, kind, email: `${kind}@shop.example` })
      .returning();
    return row!.id;
  };
  ids.harbour = await customer('Harbour Soap Co', 'stockist');
  ids.market = await customer('Saturday Market Stall', 'market-stall');
  ids.online = await customer('Online orders', 'online-order');
  await deliver(ids.harbour, '2026-01-20', [
    [ids.b1, 40],
    [ids.b2, 30],
  ]);
  await deliver(ids.market, '2026-01-21', [[ids.b1, 20]]);
  await deliver(ids.online, '2026-01-22', [[ids.b3, 10]]);
  await deliver(ids.harbour, '2026-01-25', [[ids.b1, 10]]);
}

beforeAll(async () => {
  h = await startApiHarness();
  w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET);
  other = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
  await buildGraph();
});
afterAll(() => h.close());

const get = (path: string, role: Role = 'viewer') =>
  request(h.app).get(path).set(bearer(w.members[role]));
const forward = async (lotId: string) => {
  const res = await get(`/api/trace/supplier-lots/${lotId}`);
  expect(res.status).toBe(200);
  return supplierLotTraceSchema.parse(res.body);
};
const backward = async (batchId: string) => {
  const res = await get(`/api/trace/finished-lots/${batchId}`);
  expect(res.status).toBe(200);
  return finishedLotTraceSchema.parse(res.body);
};

describe('GET /api/trace/supplier-lots/:id (forward)', () => {
  it('CA-1 reaches B1 and B3 (B2 returned it, D1 is a draft) and three customers', async () => {
    const t = await forward(ids.ca1);
    expect(t.supplierLot).toMatchObject({
      lotNumber: 'CA-2601-A',
      materialName: 'Citric Acid Fine',
      supplierName: 'Tarnwell Acids',
      quantity: 25,
      unit: 'kg',
      receivedOn: '2026-01-05',
      expiresOn: '2027-01-05',
    });
    expect(
      t.batches.map((b) => [b.batchCode, b.productName, b.quantityUsed, b.gramsUsed, b.unitsMade]),
    ).toEqual([
      ['260110-MF-1', 'Moonlit Fizz', 2, 2000, 100],
      ['260115-BM-1', 'Test Bath Melt', 0.25, 250, 50],
    ]);
    expect(t.batches[0]!.deliveries.map((d) => [d.customerName, d.deliveredOn, d.units])).toEqual([
      ['Harbour Soap Co', '2026-01-20', 40],
      ['Harbour Soap Co', '2026-01-25', 10],
      ['Saturday Market Stall', '2026-01-21', 20],
    ]);
    expect(t.batches[1]!.deliveries.map((d) => [d.customerName, d.units])).toEqual([
      ['Online orders', 10],
    ]);
    expect(t.batches.map((b) => b.unitsDelivered)).toEqual([70, 10]);
    expect(t.totals).toEqual({ batches: 2, unitsMade: 150, unitsDelivered: 80, customers: 3 });
  });

  it('draws the graph left to right: lot → batches (quantity) → customers (units)', async () => {
    const t = await forward(ids.ca1);
    expect(t.nodes.map((n) => [n.kind, n.label])).toEqual([
      ['supplier-lot', 'CA-2601-A'],
      ['batch', '260110-MF-1'],
      ['customer', 'Harbour Soap Co'],
      ['customer', 'Saturday Market Stall'],
      ['batch', '260115-BM-1'],
      ['customer', 'Online orders'],
    ]);
    const label = (id: string) => t.nodes.find((n) => n.id === id)!.label;
    expect(t.edges.map((e) => [label(e.from), label(e.to), e.label])).toEqual([
      ['CA-2601-A', '260110-MF-1', '2 kg'],
      ['260110-MF-1', 'Harbour Soap Co', '50 units'],
      ['260110-MF-1', 'Saturday Market Stall', '20 units'],
      ['CA-2601-A', '260115-BM-1', '0.25 kg'],
      ['260115-BM-1', 'Online orders', '10 units'],
    ]);
    expect(t.nodes.find((n) => n.kind === 'customer')!.recordId).toBe(ids.harbour);
    expect(t.traceMilliseconds).toBeGreaterThanOrEqual(0);
  });

  it('CA-2 reaches B2 through its amendment and B3', async () => {
    const t = await forward(ids.ca2);
    expect(t.batches.map((b) => [b.batchCode, b.quantityUsed, b.unitsDelivered])).toEqual([
      ['260112-MF-1', 1.5, 30],
      ['260115-BM-1', 0.5, 10],
    ]);
    expect(t.totals).toEqual({ batches: 2, unitsMade: 130, unitsDelivered: 40, customers: 2 });
  });

  it('BS-1 reaches all three finished lots and every customer', async () => {
    const t = await forward(ids.bs1);
    expect(t.batches.map((b) => [b.batchCode, b.quantityUsed])).toEqual([
      ['260110-MF-1', 4],
      ['260112-MF-1', 3],
      ['260115-BM-1', 1],
    ]);
    expect(t.supplierLot.supplierName).toBe('Brackley Minerals');
    expect(t.totals).toEqual({ batches: 3, unitsMade: 230, unitsDelivered: 110, customers: 3 });
  });

  it('an unused lot answers an empty trace with its graph of one node', async () => {
    const unused = await buildLot(h.handle.db, w.id, ids.soda, { supplierLotNumber: 'BS-UNUSED' });
    const t = await forward(unused.id);
    expect(t.batches).toEqual([]);
    expect(t.totals).toEqual({ batches: 0, unitsMade: 0, unitsDelivered: 0, customers: 0 });
    expect(t.nodes).toHaveLength(1);
    expect(t.edges).toEqual([]);
  });
});

describe('GET /api/trace/finished-lots/:id (backward)', () => {
  it('B3 names both citric acid lots on line 1, the soda on line 2, suppliers and documents', async () => {
    const t = await backward(ids.b3);
    expect(t.finishedLot).toMatchObject({
      batchCode: '260115-BM-1',
      productName: 'Test Bath Melt',
      madeOn: '2026-01-15',
      unitsMade: 50,
    });
    expect(
      t.lines.map((l) => [
        l.lineNumber,
        l.supplierLot.lotNumber,
        l.supplierLot.materialName,
        l.supplierLot.supplierName,
        l.quantityUsed,
        l.documents.map((d) => [d.title, d.kind, d.issuedOn, d.belongsTo]),
      ]),
    ).toEqual([
      [
        1,
        'CA-2601-A',
        'Citric Acid Fine',
        'Tarnwell Acids',
        0.25,
        [
          ['CoA CA-2601-A', 'certificate-of-analysis', '2026-01-02', 'lot'],
          ['Citric acid SDS', 'sds', '2025-11-01', 'material'],
        ],
      ],
      [
        1,
        'CA-2601-B',
        'Citric Acid Fine',
        'Tarnwell Acids',
        0.5,
        [['Citric acid SDS', 'sds', '2025-11-01', 'material']],
      ],
      [2, 'BS-2601', 'Baking Soda', 'Brackley Minerals', 1, []],
    ]);
    expect(t.deliveries.map((d) => [d.customerName, d.deliveredOn, d.units])).toEqual([
      ['Online orders', '2026-01-22', 10],
    ]);
    expect(t.totals).toEqual({ supplierLots: 3, suppliers: 2, unitsDelivered: 10, customers: 1 });
  });

  it('B2 leaves out CA-1, which its amendment returned entirely', async () => {
    const t = await backward(ids.b2);
    expect(t.lines.map((l) => [l.lineNumber, l.supplierLot.lotNumber, l.quantityUsed])).toEqual([
      [1, 'CA-2601-B', 1.5],
      [2, 'BS-2601', 3],
    ]);
    expect(t.deliveries.map((d) => [d.customerName, d.units])).toEqual([['Harbour Soap Co', 30]]);
    expect(t.nodes.some((n) => n.recordId === ids.ca1)).toBe(false);
  });

  it('draws suppliers and documents → supplier lots → batch → customers', async () => {
    const t = await backward(ids.b1);
    const label = (id: string) => t.nodes.find((n) => n.id === id)!.label;
    expect(t.edges.map((e) => [label(e.from), label(e.to), e.label])).toEqual([
      ['CA-2601-A', '260110-MF-1', '2 kg'],
      ['Tarnwell Acids', 'CA-2601-A', 'supplied'],
      ['CoA CA-2601-A', 'CA-2601-A', 'for this lot'],
      ['Citric acid SDS', 'CA-2601-A', 'for the material'],
      ['BS-2601', '260110-MF-1', '4 kg'],
      ['Brackley Minerals', 'BS-2601', 'supplied'],
      ['260110-MF-1', 'Harbour Soap Co', '50 units'],
      ['260110-MF-1', 'Saturday Market Stall', '20 units'],
    ]);
    expect(t.nodes.filter((n) => n.kind === 'document').map((n) => n.recordId)).toEqual([
      ids.coa,
      ids.sds,
    ]);
    expect(t.totals).toEqual({ supplierLots: 2, suppliers: 2, unitsDelivered: 70, customers: 2 });
  });

  it('a draft batch is not a finished lot: 404 saying so', async () => {
    for (const id of [ids.d1, ids.d2]) {
      const res = await get(`/api/trace/finished-lots/${id}`);
      expect(res.status).toBe(404);
      expect(res.body.error.message).toMatch(/not released yet/);
    }
  });
});

describe('the repository helpers recalls use', () => {
  it('finishedLotsUsingSupplierLot lists released batches net of amendments, oldest first', async () => {
    const lots = await finishedLotsUsingSupplierLot(h.handle.db, w.id, ids.ca1);
    expect(lots).toEqual([
      {
        batchId: ids.b1,
        batchCode: '260110-MF-1',
        formulaId: expect.any(String),
        productName: 'Moonlit Fizz',
        madeOn: '2026-01-10',
        unitsMade: 100,
      },
      {
        batchId: ids.b3,
        batchCode: '260115-BM-1',
        formulaId: expect.any(String),
        productName: 'Test Bath Melt',
        madeOn: '2026-01-15',
        unitsMade: 50,
      },
    ]);
    expect(await finishedLotsUsingSupplierLot(h.handle.db, other.id, ids.ca1)).toEqual([]);
  });

  it('deliveriesOfFinishedLots lists lines by customer then day with contact details', async () => {
    const rows = await deliveriesOfFinishedLots(h.handle.db, w.id, [ids.b2, ids.b3, 'not-a-uuid']);
    expect(rows.map((r) => [r.customerName, r.deliveredOn, r.batchCode, r.units, r.email])).toEqual(
      [
        ['Harbour Soap Co', '2026-01-20', '260112-MF-1', 30, 'stockist@shop.example'],
        ['Online orders', '2026-01-22', '260115-BM-1', 10, 'online-order@shop.example'],
      ],
    );
    expect(await deliveriesOfFinishedLots(h.handle.db, w.id, [])).toEqual([]);
    expect(await deliveriesOfFinishedLots(h.handle.db, other.id, [ids.b2])).toEqual([]);
  });
});

describe('GET /api/trace/search', () => {
  it('finds supplier lots by lot number or material, finished lots by code or product', async () => {
    const search = async (q: string) => {
      const res = await get(`/api/trace/search?q=${encodeURIComponent(q)}`, 'production');
      expect(res.status).toBe(200);
      return traceSearchResultSchema.parse(res.body);
    };
    const byNumber = await search('ca-2601');
    expect(byNumber.supplierLots.map((l) => l.lotNumber).sort()).toEqual([
      'CA-2601-A',
      'CA-2601-B',
    ]);
    expect((await search('citric acid')).supplierLots).toHaveLength(2);
    // Released batches only, newest first: the drafts D1 and D2 are no finished lots.
    expect((await search('moonlit')).finishedLots.map((b) => b.batchCode)).toEqual([
      '260112-MF-1',
      '260110-MF-1',
    ]);
    expect((await search('Bath Melt')).finishedLots.map((b) => b.batchCode)).toEqual([
      '260115-BM-1',
    ]);
    expect((await search('260115')).finishedLots.map((b) => b.productName)).toEqual([
      'Test Bath Melt',
    ]);
  });

  it('an empty search is 400 with a field error', async () => {
    const res = await get('/api/trace/search?q=%20');
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.q).toBeDefined();
  });
});

describe('who may trace', () => {
  const paths = () => [
    `/api/trace/supplier-lots/${ids.ca1}`,
    `/api/trace/finished-lots/${ids.b1}`,
    '/api/trace/search?q=CA',
  ];

  it.each(ROLES)('%s', async (role) => {
    for (const path of paths()) {
      const res = await get(path, role);
      expect(res.status, path).toBe(role === 'assessor' ? 403 : 200);
    }
  });

  it('another workshop gets 404 on both traces and finds nothing in a search', async () => {
    for (const path of paths().slice(0, 2)) {
      const res = await request(h.app).get(path).set(bearer(other.members.owner));
      expect(res.status, path).toBe(404);
    }
    const res = await request(h.app)
      .get('/api/trace/search?q=CA-2601')
      .set(bearer(other.members.owner));
    expect(res.body).toEqual({ supplierLots: [], finishedLots: [] });
  });

  it('anonymous is 401', async () => {
    for (const path of paths()) expect((await request(h.app).get(path)).status, path).toBe(401);
  });

  it('a malformed or unknown id is 404, never a 400 or 500', async () => {
    for (const path of [
      '/api/trace/supplier-lots/not-a-uuid',
      '/api/trace/finished-lots/12',
      `/api/trace/supplier-lots/${ids.b1}`,
      `/api/trace/finished-lots/${ids.ca1}`,
    ]) {
      expect((await get(path)).status, path).toBe(404);
    }
  });
});
