import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ROLE_SETS, customerPageSchema, customerSchema } from '@batchproof/shared';
import { aCustomer, aDelivery } from '../../fixtures/builders/delivery-builder';
import { auditEvents } from '../../apps/api/src/db/schema';
import { and, eq } from 'drizzle-orm';
import { buildFinishedLot, buildReleasedFormula } from '../support/finished-lot-builder';
import { CALLERS, expectStatusAs, onlyRoles, type MatrixRequest } from '../support/caller-matrix';
import { buildWorkshop, type BuiltWorkshop } from '../support/workshop-builder';
import { startApiHarness, TEST_JWT_SECRET, type ApiHarness } from '../support/api-harness';
import { bearer } from '../support/auth-header';

let h: ApiHarness;
let a: BuiltWorkshop;
let b: BuiltWorkshop;
beforeAll(async () => {
  h = await startApiHarness();
  a = await buildWorkshop(h.handle.db, TEST_JWT_SECRET);
  b = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
});
afterAll(() => h.close());

const post = (body: object, who = a.members.production) =>
  request(h.app).post('/api/customers').set(bearer(who)).send(body);
const create = async (overrides: Parameters<typeof aCustomer>[0] = {}) => {
  const res = await post(aCustomer(overrides));
  expect(res.status).toBe(201);
  return customerSchema.parse(res.body);
};

describe('access to the customer routes, by role and workshop', () => {
  const routes: { route: string; prepare: () => Promise<MatrixRequest>; expected: object }[] = [
    {
      route: 'GET /api/customers',
      prepare: async () => ({ method: 'get', path: '/api/customers' }),
      expected: onlyRoles(ROLE_SETS.members, 200, 200),
    },
    {
      route: 'POST /api/customers',
      prepare: async () => ({ method: 'post', path: '/api/customers', body: aCustomer() }),
      expected: onlyRoles(ROLE_SETS.goodsIn, 201, 201),
    },
    {
      route: 'GET /api/customers/:id',
      prepare: async () => ({ method: 'get', path: `/api/customers/${(await create()).id}` }),
      expected: onlyRoles(ROLE_SETS.members, 200),
    },
    {
      route: 'PUT /api/customers/:id',
      prepare: async () => ({
        method: 'put',
        path: `/api/customers/${(await create()).id}`,
        body: aCustomer({ name: 'Renamed Stall' }),
      }),
      expected: onlyRoles(ROLE_SETS.goodsIn, 200),
    },
    {
      route: 'POST /api/customers/:id/archive',
      prepare: async () => ({
        method: 'post',
        path: `/api/customers/${(await create()).id}/archive`,
      }),
      expected: onlyRoles(ROLE_SETS.goodsIn, 200),
    },
    {
      route: 'POST /api/customers/:id/unarchive',
      prepare: async () => ({
        method: 'post',
        path: `/api/customers/${(await create()).id}/unarchive`,
      }),
      expected: onlyRoles(ROLE_SETS.goodsIn, 200),
    },
    {
      route: 'DELETE /api/customers/:id',
      prepare: async () => ({ method: 'delete', path: `/api/customers/${(await create()).id}` }),
      expected: onlyRoles(ROLE_SETS.writers, 204),
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

describe('POST /api/customers', () => {
  it('adds a customer and answers 201 with its fields and no deliveries', async () => {
    const customer = await create({
      kind: 'market-stall',
      name: 'Tidewell Market Stall',
      contact: null,
      email: 'stall@tidewell.test',
      phone: '01632 960 456',
      address: null,
    });
    expect(customer).toMatchObject({
      kind: 'market-stall',
      name: 'Tidewell Market Stall',
      contact: null,
      email: 'stall@tidewell.test',
      phone: '01632 960 456',
      deliveryCount: 0,
      archivedAt: null,
    });
  });

  it('warns, without refusing, when another customer has the same name (case and spaces folded)', async () => {
    await create({ name: 'Larkspur Pantry' });
    const res = await post(aCustomer({ name: '  larkspur   PANTRY ' }));
    expect(res.status).toBe(201);
    expect(res.body.warnings).toEqual([
      {
        field: 'name',
        message:
          'Another customer is already called “Larkspur Pantry”. Check this is not the same customer entered twice.',
      },
    ]);
  });

  it('refuses bad input with 400 naming each field', async () => {
    const res = await post({
      kind: 'wholesaler',
      name: '',
      email: 'not-an-address',
      phone: 'call me',
    });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fieldErrors)).toEqual(
      expect.arrayContaining(['kind', 'name', 'email', 'phone']),
    );
  });

  it('logs the creation in the audit log', async () => {
    const customer = await create({ name: 'Audited Corner Shop' });
    const events = await h.handle.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.subjectId, customer.id), eq(auditEvents.action, 'create')));
    expect(events).toHaveLength(1);
    expect(events[0]).toMatchObject({ subjectType: 'customer', actorId: a.members.production.id });
  });
});

describe('GET /api/customers', () => {
  it('filters by text and kind, leaves archived ones out unless asked, and counts deliveries', async () => {
    const w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    const as = (body: object) =>
      request(h.app).post('/api/customers').set(bearer(w.members.owner)).send(body);
    const shop = (await as(aCustomer({ name: 'Quayside Soaps', kind: 'stockist' }))).body;
    await as(aCustomer({ name: 'Quayside Online', kind: 'online-order' }));
    const gone = (await as(aCustomer({ name: 'Quayside Closed', kind: 'stockist' }))).body;
    await request(h.app).post(`/api/customers/${gone.id}/archive`).set(bearer(w.members.owner));
    const f = await buildReleasedFormula(h.handle.db, w.id);
    await buildFinishedLot(h.handle.db, w.id, { ...f, batchCode: 'CNT-1', unitsMade: 10 });
    for (const units of [2, 3]) {
      const res = await request(h.app)
        .post('/api/deliveries')
        .set(bearer(w.members.owner))
        .send(aDelivery(shop.id, [{ lotCode: 'CNT-1', units }]));
      expect(res.status).toBe(201);
    }
    const list = async (query: string) => {
      const res = await request(h.app).get(`/api/customers?${query}`).set(bearer(w.members.owner));
      expect(res.status).toBe(200);
      return customerPageSchema.parse(res.body);
    };
    const stockists = await list('kind=stockist');
    expect(stockists.items.map((c) => [c.name, c.deliveryCount])).toEqual([['Quayside Soaps', 2]]);
    expect((await list('q=online')).items.map((c) => c.name)).toEqual(['Quayside Online']);
    const all = await list('includeArchived=true&sort=name&dir=asc');
    expect(all.items.map((c) => c.name)).toEqual([
      'Quayside Closed',
      'Quayside Online',
      'Quayside Soaps',
    ]);
    expect(all.total).toBe(3);
  });

  it('another workshop sees none of these customers', async () => {
    await create({ name: 'Private To A' });
    const res = await request(h.app).get('/api/customers?q=Private').set(bearer(b.members.owner));
    expect(res.body.items).toEqual([]);
  });

  it('a malformed query answers 400 with the field', async () => {
    const res = await request(h.app)
      .get('/api/customers?kind=wholesaler')
      .set(bearer(a.members.viewer));
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.kind).toBeDefined();
  });
});

describe('PUT and DELETE /api/customers/:id', () => {
  it('replaces the fields', async () => {
    const customer = await create();
    const res = await request(h.app)
      .put(`/api/customers/${customer.id}`)
      .set(bearer(a.members.formulator))
      .send(aCustomer({ name: 'Harbour Gift Co', kind: 'other', email: null }));
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ name: 'Harbour Gift Co', kind: 'other', email: null });
  });

  it('refuses to delete a customer a delivery names (409) and keeps it', async () => {
    const customer = await create({ name: 'Delivered To Shop' });
    const f = await buildReleasedFormula(h.handle.db, a.id);
    await buildFinishedLot(h.handle.db, a.id, { ...f, batchCode: 'DEL-REF-1', unitsMade: 5 });
    const delivered = await request(h.app)
      .post('/api/deliveries')
      .set(bearer(a.members.production))
      .send(aDelivery(customer.id, [{ lotCode: 'DEL-REF-1', units: 1 }]));
    expect(delivered.status).toBe(201);
    const res = await request(h.app)
      .delete(`/api/customers/${customer.id}`)
      .set(bearer(a.members.owner));
    expect(res.status).toBe(409);
    expect(res.body.error.message).toContain('1 delivery refers to it');
    const still = await request(h.app)
      .get(`/api/customers/${customer.id}`)
      .set(bearer(a.members.viewer));
    expect(still.status).toBe(200);
  });

  it('a malformed id is simply not found', async () => {
    const res = await request(h.app).get('/api/customers/not-a-uuid').set(bearer(a.members.viewer));
    expect(res.status).toBe(404);
  });
});
