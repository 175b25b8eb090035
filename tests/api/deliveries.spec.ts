import request from 'supertest';
import { and, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  ROLE_SETS,
  deliveryPageSchema,
  deliverySchema,
  type DeliveryCreate,
} from '@batchproof/shared';
import { aCustomer, aDelivery } from '../../fixtures/builders/delivery-builder';
import { aProductIdentity } from '../../fixtures/builders/label-run-builder';
import { auditEvents, productIdentities } from '../../apps/api/src/db/schema';
import { buildFinishedLot, buildReleasedFormula } from '../support/finished-lot-builder';
import { CALLERS, expectStatusAs, onlyRoles, type MatrixRequest } from '../support/caller-matrix';
import { buildWorkshop, type BuiltMember, type BuiltWorkshop } from '../support/workshop-builder';
import { startApiHarness, TEST_JWT_SECRET, type ApiHarness } from '../support/api-harness';
import { bearer } from '../support/auth-header';

let h: ApiHarness;
let a: BuiltWorkshop;
let b: BuiltWorkshop;
let customerId: string;
let formula: Awaited<ReturnType<typeof buildReleasedFormula>>;
let codes = 0;

beforeAll(async () => {
  h = await startApiHarness();
  a = await buildWorkshop(h.handle.db, TEST_JWT_SECRET);
  b = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
  customerId = (await newCustomer(a.members.owner, 'Larkspur Pantry')).id;
  formula = await buildReleasedFormula(h.handle.db, a.id, { name: 'Bramble Fizzer' });
});
afterAll(() => h.close());

async function newCustomer(who: BuiltMember, name: string) {
  const res = await request(h.app)
    .post('/api/customers')
    .set(bearer(who))
    .send(aCustomer({ name }));
  expect(res.status).toBe(201);
  return res.body as { id: string };
}

/** A finished lot of workshop A with a fresh code. */
async function lot(unitsMade: number | null, options: { state?: 'draft' | 'released' } = {}) {
  const batchCode = `DL-${++codes}-${Math.random().toString(36).slice(2, 6).toUpperCase()}`;
  await buildFinishedLot(h.handle.db, a.id, { ...formula, batchCode, unitsMade, ...options });
  return batchCode;
}

const post = (body: DeliveryCreate | object, who: BuiltMember = a.members.production) =>
  request(h.app).post('/api/deliveries').set(bearer(who)).send(body);
const put = (id: string, body: DeliveryCreate | object) =>
  request(h.app).put(`/api/deliveries/${id}`).set(bearer(a.members.production)).send(body);

async function created(lines: DeliveryCreate['lines'], overrides: Partial<DeliveryCreate> = {}) {
  const res = await post(aDelivery(customerId, lines, overrides));
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return deliverySchema.parse(res.body);
}

describe('access to the delivery routes, by role and workshop', () => {
  const csv = async () =>
    `delivered_on,customer,lot_code,units\r\n2026-02-01,Larkspur Pantry,${await lot(null)},1`;
  const routes: { route: string; prepare: () => Promise<MatrixRequest>; expected: object }[] = [
    {
      route: 'GET /api/deliveries',
      prepare: async () => ({ method: 'get', path: '/api/deliveries' }),
      expected: onlyRoles(ROLE_SETS.members, 200, 200),
    },
    {
      route: 'POST /api/deliveries',
      prepare: async () => ({
        method: 'post',
        path: '/api/deliveries',
        body: aDelivery(customerId, [{ lotCode: await lot(null), units: 1 }]),
      }),
      // Workshop B has neither the customer nor the lot: its owner's delivery is refused.
      expected: onlyRoles(ROLE_SETS.goodsIn, 201, 400),
    },
    {
      route: 'GET /api/deliveries/:id',
      prepare: async () => ({
        method: 'get',
        path: `/api/deliveries/${(await created([{ lotCode: await lot(null), units: 1 }])).id}`,
      }),
      expected: onlyRoles(ROLE_SETS.members, 200),
    },
    {
      route: 'PUT /api/deliveries/:id',
      prepare: async () => {
        const lotCode = await lot(null);
        const delivery = await created([{ lotCode, units: 1 }]);
        return {
          method: 'put',
          path: `/api/deliveries/${delivery.id}`,
          body: aDelivery(customerId, [{ lotCode, units: 2 }]),
        };
      },
      expected: onlyRoles(ROLE_SETS.goodsIn, 200),
    },
    {
      route: 'DELETE /api/deliveries/:id',
      prepare: async () => ({
        method: 'delete',
        path: `/api/deliveries/${(await created([{ lotCode: await lot(null), units: 1 }])).id}`,
      }),
      expected: onlyRoles(ROLE_SETS.writers, 204),
    },
    {
      route: 'POST /api/deliveries/import/preview',
      prepare: async () => ({
        method: 'post',
        path: '/api/deliveries/import/preview',
        csv: await csv(),
      }),
      expected: onlyRoles(ROLE_SETS.goodsIn, 200, 200),
    },
    {
      route: 'POST /api/deliveries/import',
      prepare: async () => ({ method: 'post', path: '/api/deliveries/import', csv: await csv() }),
      // Workshop B has no "Larkspur Pantry" and no such lot: all or nothing refuses its file.
      expected: onlyRoles(ROLE_SETS.goodsIn, 201, 400),
    },
  ];
  for (const r of routes) {
    describe(r.route, () => {
      it.each(CALLERS)('as %s responds with the expected status', async (caller) => {
        const expected = r.expected as Record<string, number>;
        await expectStatusAs(h, { a, b }, caller, await r.prepare(), expected[caller]!);
      });
    });
  }
});

describe('POST /api/deliveries', () => {
  it('records the lines with each lot’s id, code and product, and the total units', async () => {
    const first = await lot(40);
    const second = await lot(null);
    const delivery = await created([
      { lotCode: first, units: 24 },
      { lotCode: second, units: 6 },
    ]);
    expect(delivery).toMatchObject({
      customerId,
      customerName: 'Larkspur Pantry',
      deliveredOn: '2026-02-10',
      totalUnits: 30,
      lines: [
        { lotCode: first, productName: 'Bramble Fizzer', units: 24 },
        { lotCode: second, productName: 'Bramble Fizzer', units: 6 },
      ],
    });
    expect(delivery.lines[0]!.finishedLotId).toEqual(expect.any(String));
  });

  it('names the product as its product identity does, when there is one', async () => {
    const f = await buildReleasedFormula(h.handle.db, a.id, { name: 'Internal name' });
    await h.handle.db.insert(productIdentities).values({
      workshopId: a.id,
      formulaId: f.formulaId,
      identity: { ...aProductIdentity(), productName: 'Sea Glass Bath Fizz' } as never,
    });
    await buildFinishedLot(h.handle.db, a.id, { ...f, batchCode: 'PI-NAMED-1', unitsMade: 5 });
    const delivery = await created([{ lotCode: 'PI-NAMED-1', units: 1 }]);
    expect(delivery.lines[0]!.productName).toBe('Sea Glass Bath Fizz');
  });

  it('refuses a lot code that is no released batch of this workshop, per line', async () => {
    const good = await lot(10);
    const draft = await lot(10, { state: 'draft' });
    await buildFinishedLot(h.handle.db, b.id, {
      ...(await buildReleasedFormula(h.handle.db, b.id)),
      batchCode: 'OTHER-WS-1',
      unitsMade: 10,
    });
    const res = await post(
      aDelivery(customerId, [
        { lotCode: good, units: 1 },
        { lotCode: draft, units: 1 },
        { lotCode: 'OTHER-WS-1', units: 1 },
      ]),
    );
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors).toEqual({
      'lines.1.lotCode': [`No released batch has lot code ${draft}`],
      'lines.2.lotCode': ['No released batch has lot code OTHER-WS-1'],
    });
  });

  it('never delivers more of a lot than was made, over all its deliveries', async () => {
    const code = await lot(10);
    await created([{ lotCode: code, units: 6 }]);
    const over = await post(aDelivery(customerId, [{ lotCode: code, units: 5 }]));
    expect(over.status).toBe(400);
    // 10 made − 6 delivered = 4 left.
    expect(over.body.error.fieldErrors).toEqual({
      'lines.0.units': [`Only 4 units of lot ${code} are left to deliver`],
    });
    await created([{ lotCode: code, units: 4 }]);
    const none = await post(aDelivery(customerId, [{ lotCode: code, units: 1 }]));
    expect(none.body.error.fieldErrors).toEqual({
      'lines.0.units': [`Lot ${code} has no units left to deliver`],
    });
  });

  it('does not count units when the units made are not known', async () => {
    const code = await lot(null);
    await created([{ lotCode: code, units: 5000 }]);
    await created([{ lotCode: code, units: 5000 }]);
  });

  it('of two deliveries racing for the last units of a lot, exactly one is saved', async () => {
    for (let round = 0; round < 5; round++) {
      const code = await lot(10);
      const [x, y] = await Promise.all([
        post(aDelivery(customerId, [{ lotCode: code, units: 6 }])),
        post(aDelivery(customerId, [{ lotCode: code, units: 6 }])),
      ]);
      expect([x.status, y.status].sort()).toEqual([201, 400]);
      const list = await request(h.app)
        .get(`/api/deliveries?lotCode=${code}`)
        .set(bearer(a.members.viewer));
      expect(list.body.total).toBe(1);
    }
  });

  it('refuses another workshop’s customer with a customerId field error', async () => {
    const foreign = await newCustomer(b.members.owner, 'Elsewhere Shop');
    const res = await post(aDelivery(foreign.id, [{ lotCode: await lot(5), units: 1 }]));
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors).toEqual({
      customerId: ['Choose one of this workshop’s customers'],
    });
  });

  it('bad input answers 400 with each field’s message', async () => {
    const res = await post({
      customerId: 'nobody',
      deliveredOn: '2999-01-01',
      reference: 'x'.repeat(101),
      lines: [
        { lotCode: 'A-1', units: 0 },
        { lotCode: 'HAS SPACE', units: 1.5 },
      ],
    });
    expect(res.status).toBe(400);
    const fields = res.body.error.fieldErrors;
    expect(Object.keys(fields).sort()).toEqual([
      'customerId',
      'deliveredOn',
      'lines.0.units',
      'lines.1.lotCode',
      'lines.1.units',
      'reference',
    ]);
    expect(fields.deliveredOn).toEqual(['The delivery date cannot be in the future']);
    expect(fields['lines.0.units']).toEqual(['Units must be at least 1']);
    const twice = await post(
      aDelivery(customerId, [
        { lotCode: 'A-1', units: 1 },
        { lotCode: 'A-1', units: 2 },
      ]),
    );
    expect(twice.body.error.fieldErrors).toEqual({
      'lines.1.lotCode': ['Lot A-1 is listed twice; put all its units on one line'],
    });
    expect((await post({ ...aDelivery(customerId, []) })).body.error.fieldErrors.lines).toEqual([
      'List at least one lot delivered',
    ]);
  });

  it('a retry with the same Idempotency-Key records one delivery', async () => {
    const code = await lot(10);
    const body = aDelivery(customerId, [{ lotCode: code, units: 3 }]);
    const send = () => post(body).set('Idempotency-Key', `deliv-${code}`);
    const first = await send();
    const again = await send();
    expect(first.status).toBe(201);
    expect(again.status).toBe(201);
    expect(again.body.id).toBe(first.body.id);
    const list = await request(h.app)
      .get(`/api/deliveries?lotCode=${code}`)
      .set(bearer(a.members.viewer));
    expect(list.body.total).toBe(1);
  });
});

describe('PUT and DELETE /api/deliveries/:id', () => {
  it('an update counts the lot’s other deliveries, not its own lines', async () => {
    const code = await lot(10);
    await created([{ lotCode: code, units: 2 }]);
    const mine = await created([{ lotCode: code, units: 5 }]);
    const ok = await put(mine.id, aDelivery(customerId, [{ lotCode: code, units: 8 }]));
    expect(ok.status).toBe(200);
    expect(ok.body.totalUnits).toBe(8);
    const over = await put(mine.id, aDelivery(customerId, [{ lotCode: code, units: 9 }]));
    expect(over.status).toBe(400);
    // 10 made − 2 on the other delivery = 8 left for this one.
    expect(over.body.error.fieldErrors['lines.0.units']).toEqual([
      `Only 8 units of lot ${code} are left to deliver`,
    ]);
  });

  it('logs create, update and delete in the audit log, and a deleted delivery is gone', async () => {
    const code = await lot(10);
    const delivery = await created([{ lotCode: code, units: 1 }]);
    expect(
      (await put(delivery.id, aDelivery(customerId, [{ lotCode: code, units: 2 }]))).status,
    ).toBe(200);
    const del = await request(h.app)
      .delete(`/api/deliveries/${delivery.id}`)
      .set(bearer(a.members.formulator));
    expect(del.status).toBe(204);
    const events = await h.handle.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.subjectType, 'delivery'), eq(auditEvents.subjectId, delivery.id)))
      .orderBy(auditEvents.createdAt);
    expect(events.map((e) => e.action)).toEqual(['create', 'update', 'delete']);
    expect(events[2]!.detail).toMatchObject({
      customerName: 'Larkspur Pantry',
      lines: [{ lotCode: code, units: 2 }],
    });
    const gone = await request(h.app)
      .get(`/api/deliveries/${delivery.id}`)
      .set(bearer(a.members.viewer));
    expect(gone.status).toBe(404);
  });

  it('an unknown or malformed id is not found', async () => {
    const body = aDelivery(customerId, [{ lotCode: await lot(1), units: 1 }]);
    expect((await put('00000000-0000-4000-8000-000000000000', body)).status).toBe(404);
    expect((await put('nope', body)).status).toBe(404);
  });
});

describe('GET /api/deliveries', () => {
  it('filters by customer, lot code and text, and sorts by customer name', async () => {
    const w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    const owner = w.members.owner;
    const f = await buildReleasedFormula(h.handle.db, w.id);
    for (const code of ['LST-A', 'LST-B'])
      await buildFinishedLot(h.handle.db, w.id, { ...f, batchCode: code, unitsMade: null });
    const pantry = await newCustomer(owner, 'Willow Pantry');
    const stall = await newCustomer(owner, 'Alder Stall');
    const send = (
      customer: string,
      lines: DeliveryCreate['lines'],
      reference: string,
      deliveredOn: string,
    ) => post(aDelivery(customer, lines, { reference, deliveredOn }), owner);
    expect(
      (await send(pantry.id, [{ lotCode: 'LST-A', units: 3 }], 'INV-7', '2026-01-05')).status,
    ).toBe(201);
    expect(
      (await send(stall.id, [{ lotCode: 'LST-B', units: 4 }], 'ORD-9', '2026-01-06')).status,
    ).toBe(201);
    expect(
      (
        await send(
          stall.id,
          [
            { lotCode: 'LST-A', units: 1 },
            { lotCode: 'LST-B', units: 1 },
          ],
          'ORD-10',
          '2026-01-07',
        )
      ).status,
    ).toBe(201);
    const list = async (query: string) => {
      const res = await request(h.app).get(`/api/deliveries?${query}`).set(bearer(owner));
      expect(res.status).toBe(200);
      return deliveryPageSchema.parse(res.body);
    };
    const refs = async (query: string) => (await list(query)).items.map((d) => d.reference);
    expect(await refs('')).toEqual(['INV-7', 'ORD-9', 'ORD-10']);
    expect(await refs('dir=desc')).toEqual(['ORD-10', 'ORD-9', 'INV-7']);
    expect(await refs(`customerId=${pantry.id}`)).toEqual(['INV-7']);
    expect(await refs('lotCode=LST-A')).toEqual(['INV-7', 'ORD-10']);
    expect(await refs('q=willow')).toEqual(['INV-7']);
    expect(await refs('q=ord-')).toEqual(['ORD-9', 'ORD-10']);
    expect(await refs('q=lst-b')).toEqual(['ORD-9', 'ORD-10']);
    const page = await list('pageSize=1&page=2');
    expect(page.total).toBe(3);
    expect(page.items[0]!.lines.map((l) => [l.lotCode, l.units])).toEqual([['LST-B', 4]]);
    const first = (await list('sort=customerName&dir=asc')).items.map((d) => d.customerName);
    expect(first).toEqual(['Alder Stall', 'Alder Stall', 'Willow Pantry']);
  });

  it('another workshop sees none of these deliveries', async () => {
    await created([{ lotCode: await lot(3), units: 1 }], { reference: 'ONLY-A' });
    const res = await request(h.app).get('/api/deliveries?q=ONLY-A').set(bearer(b.members.owner));
    expect(res.body.items).toEqual([]);
  });
});
