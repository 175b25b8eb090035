import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  BUILT_IN_LABEL_STOCKS,
  labelPositions,
  labelStockListSchema,
  labelStockRecordSchema,
  ROLE_SETS,
  ROLES,
} from '@batchproof/shared';
import { aSheetLabelStock } from '../../fixtures/builders/label-stock-builder';
import { buildWorkshop, type BuiltWorkshop } from '../support/workshop-builder';
import { startApiHarness, TEST_JWT_SECRET, type ApiHarness } from '../support/api-harness';
import { bearer } from '../support/auth-header';
import { asBytes } from '../support/binary-body';
import { readPdf, textIn } from '../support/label-pdf-reader';

let h: ApiHarness;
let w: BuiltWorkshop;
let other: BuiltWorkshop;
beforeAll(async () => {
  h = await startApiHarness();
  w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET);
  other = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
});
afterAll(() => h.close());

const create = (body: object, ws = w) =>
  request(h.app).post('/api/label-stocks').set(bearer(ws.members.formulator)).send(body);

describe('POST /api/label-stocks', () => {
  it('creates a stock of the workshop and answers its geometry, ready for label positions', async () => {
    const body = aSheetLabelStock();
    const res = await create(body);
    expect(res.status).toBe(201);
    const record = labelStockRecordSchema.parse(res.body);
    expect(record).toMatchObject({ builtIn: false, key: null, archivedAt: null });
    expect(record.stock).toEqual(body);
    const boxes = labelPositions(record.stock);
    expect(boxes).toHaveLength(10);
    expect(boxes[9]).toMatchObject({ xMm: 12 + 96, yMm: 20 + 4 * 52 });
    const again = await request(h.app)
      .get(`/api/label-stocks/${record.id}`)
      .set(bearer(w.members.viewer));
    expect(again.status).toBe(200);
    expect(again.body).toEqual(res.body);
  });

  it('refuses a layout that overflows the page with 400 and the shared schema’s field paths', async () => {
    const res = await create(
      aSheetLabelStock({
        across: 3,
        down: 6,
        shape: { kind: 'rounded-rectangle', cornerRadiusMm: 40 },
      }),
    );
    expect(res.status).toBe(400);
    const { fieldErrors } = res.body.error;
    // 12 + 2 × 96 + 90 = 294 mm across a 210 mm page; 20 + 5 × 52 + 50 = 330 mm down a 297 mm one.
    expect(fieldErrors.across).toEqual([expect.stringContaining('294 mm')]);
    expect(fieldErrors.down).toEqual([expect.stringContaining('330 mm')]);
    expect(fieldErrors['shape.cornerRadiusMm']).toEqual([
      expect.stringContaining('at most half the label'),
    ]);
  });

  it('refuses a name PostgreSQL cannot store with a field message, never a 500', async () => {
    const res = await create(aSheetLabelStock({ name: 'Sheet \u0000 one' }));
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.name).toBeDefined();
  });

  it('with an Idempotency-Key, a retry answers the same stock and stores one', async () => {
    const body = aSheetLabelStock();
    const key = crypto.randomUUID();
    const again = () =>
      request(h.app)
        .post('/api/label-stocks')
        .set(bearer(w.members.owner))
        .set('Idempotency-Key', key)
        .send(body);
    const first = await again();
    const retry = await again();
    expect(first.status).toBe(201);
    expect(retry.body.id).toBe(first.body.id);
    const list = await request(h.app).get('/api/label-stocks').set(bearer(w.members.owner));
    const named = list.body.items.filter(
      (s: { stock: { name: string } }) => s.stock.name === body.name,
    );
    expect(named).toHaveLength(1);
  });

  it('is refused to production and viewers', async () => {
    for (const role of ['production', 'viewer'] as const) {
      const res = await request(h.app)
        .post('/api/label-stocks')
        .set(bearer(w.members[role]))
        .send(aSheetLabelStock());
      expect(res.status).toBe(403);
    }
  });
});

describe('GET /api/label-stocks', () => {
  it('lists the built-in stocks first, with their keys, then the workshop’s own by name', async () => {
    const ws = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['formulator'] });
    for (const name of ['Zinc tins roll', 'Amber jar sheet']) {
      expect((await create(aSheetLabelStock({ name }), ws)).status).toBe(201);
    }
    const res = await request(h.app).get('/api/label-stocks').set(bearer(ws.members.formulator));
    expect(res.status).toBe(200);
    const { items } = labelStockListSchema.parse(res.body);
    const builtIns = BUILT_IN_LABEL_STOCKS.length;
    expect(items.slice(0, builtIns).map((s) => [s.builtIn, s.key, s.id])).toEqual(
      BUILT_IN_LABEL_STOCKS.map((s) => [true, s.key, s.key]),
    );
    expect(items.slice(builtIns).map((s) => [s.builtIn, s.stock.name])).toEqual([
      [false, 'Amber jar sheet'],
      [false, 'Zinc tins roll'],
    ]);
  });

  it('answers a built-in stock by its key', async () => {
    const [first] = BUILT_IN_LABEL_STOCKS;
    const res = await request(h.app)
      .get(`/api/label-stocks/${first!.key}`)
      .set(bearer(w.members.viewer));
    expect(res.status).toBe(200);
    const { key, ...stock } = first!;
    expect(labelStockRecordSchema.parse(res.body)).toMatchObject({ builtIn: true, key, stock });
  });

  it('leaves archived stocks out unless asked for', async () => {
    const ws = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    const made = await request(h.app)
      .post('/api/label-stocks')
      .set(bearer(ws.members.owner))
      .send(aSheetLabelStock());
    const archived = await request(h.app)
      .post(`/api/label-stocks/${made.body.id}/archive`)
      .set(bearer(ws.members.owner));
    expect(archived.status).toBe(200);
    expect(archived.body.archivedAt).not.toBeNull();
    const list = (qs: string) =>
      request(h.app).get(`/api/label-stocks${qs}`).set(bearer(ws.members.owner));
    const own = (body: { items: { builtIn: boolean }[] }) => body.items.filter((s) => !s.builtIn);
    expect(own((await list('')).body)).toHaveLength(0);
    expect(own((await list('?includeArchived=true')).body)).toHaveLength(1);
  });
});

describe('another workshop', () => {
  it('cannot see, change, archive or delete a workshop’s stock: 404, and the stock is unchanged', async () => {
    const made = await create(aSheetLabelStock());
    const path = `/api/label-stocks/${made.body.id}`;
    const as = bearer(other.members.owner);
    expect((await request(h.app).get(path).set(as)).status).toBe(404);
    const list = await request(h.app).get('/api/label-stocks').set(as);
    expect(list.body.items.map((s: { id: string }) => s.id)).not.toContain(made.body.id);
    expect((await request(h.app).put(path).set(as).send(aSheetLabelStock())).status).toBe(404);
    expect((await request(h.app).post(`${path}/archive`).set(as)).status).toBe(404);
    expect((await request(h.app).delete(path).set(as)).status).toBe(404);
    const after = await request(h.app).get(path).set(bearer(w.members.viewer));
    expect(after.body).toEqual(made.body);
  });
});

describe('changing a stock', () => {
  it('PUT replaces the geometry; DELETE removes it', async () => {
    const made = await create(aSheetLabelStock());
    const path = `/api/label-stocks/${made.body.id}`;
    const roll = {
      kind: 'roll',
      name: 'Thermal roll 50 × 30',
      labelWidthMm: 50,
      labelHeightMm: 30,
      gapMm: 3,
      shape: { kind: 'rectangle' },
    };
    const put = await request(h.app).put(path).set(bearer(w.members.owner)).send(roll);
    expect(put.status).toBe(200);
    expect(labelStockRecordSchema.parse(put.body).stock).toEqual(roll);
    expect((await request(h.app).delete(path).set(bearer(w.members.formulator))).status).toBe(204);
    expect((await request(h.app).get(path).set(bearer(w.members.owner))).status).toBe(404);
  });

  it('refuses any change to a built-in stock with 409 and a plain message', async () => {
    const key = BUILT_IN_LABEL_STOCKS[0]!.key;
    const path = `/api/label-stocks/${key}`;
    const as = bearer(w.members.owner);
    const answers = [
      await request(h.app).put(path).set(as).send(aSheetLabelStock()),
      await request(h.app).delete(path).set(as),
      await request(h.app).post(`${path}/archive`).set(as),
      await request(h.app).post(`${path}/unarchive`).set(as),
    ];
    for (const res of answers) {
      expect(res.status).toBe(409);
      expect(res.body.error.message).toMatch(/^Built-in label stocks cannot be changed/);
    }
    const still = await request(h.app).get(path).set(as);
    expect(still.body.stock.name).toBe(BUILT_IN_LABEL_STOCKS[0]!.name);
  });
});

describe('GET /api/label-stocks/:id/calibration.pdf', () => {
  it('answers every role that reads stocks a PDF of the workshop’s own stock: its outlines where the template puts them, and the actual-size reminder', async () => {
    const made = await create(aSheetLabelStock({ shape: { kind: 'oval' } }));
    const path = `/api/label-stocks/${made.body.id}/calibration.pdf`;
    for (const role of ROLE_SETS.members) {
      const res = await asBytes(request(h.app).get(path).set(bearer(w.members[role])));
      expect(res.status, role).toBe(200);
      expect(res.headers['content-type']).toBe('application/pdf');
      expect(res.headers['content-disposition']).toMatch(/^inline; filename=".*calibration\.pdf"/);
    }
    for (const role of ROLES.filter((r) => !(ROLE_SETS.members as readonly string[]).includes(r))) {
      expect((await request(h.app).get(path).set(bearer(w.members[role]))).status, role).toBe(403);
    }
    const res = await asBytes(request(h.app).get(path).set(bearer(w.members.viewer)));
    const [page] = await readPdf(res.body as Buffer);
    expect(page!.widthMm).toBeCloseTo(210, 1);
    const outlines = page!.shapes.filter((s) => s.stroked && s.curves === 4);
    const boxes = labelPositions(made.body.stock);
    expect(outlines).toHaveLength(boxes.length);
    outlines.forEach((o, i) => {
      // Within 0.2 mm of the template (the check the issue asks for).
      expect(Math.abs(o.xMm - boxes[i]!.xMm)).toBeLessThanOrEqual(0.2);
      expect(Math.abs(o.yMm - boxes[i]!.yMm)).toBeLessThanOrEqual(0.2);
      expect(Math.abs(o.widthMm - boxes[i]!.widthMm)).toBeLessThanOrEqual(0.2);
    });
    expect(textIn(page!, { xMm: 0, yMm: 0, widthMm: 210, heightMm: 297 })).toContain(
      "Print at actual size (100 %), not 'fit to page'",
    );
  });

  it('answers a built-in stock’s page, 404 for another workshop’s stock and 401 without sign-in', async () => {
    const builtIn = await asBytes(
      request(h.app)
        .get(`/api/label-stocks/${BUILT_IN_LABEL_STOCKS[0]!.key}/calibration.pdf`)
        .set(bearer(w.members.production)),
    );
    expect(builtIn.status).toBe(200);
    expect((builtIn.body as Buffer).subarray(0, 5).toString()).toBe('%PDF-');
    const made = await create(aSheetLabelStock());
    const path = `/api/label-stocks/${made.body.id}/calibration.pdf`;
    expect((await request(h.app).get(path).set(bearer(other.members.owner))).status).toBe(404);
    expect((await request(h.app).get(path)).status).toBe(401);
  });
});
