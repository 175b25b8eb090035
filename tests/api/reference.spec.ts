import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  referenceListIndexSchema,
  referenceLists,
  referenceRowsPageSchema,
} from '@batchproof/shared';
import { buildWorkshop, type BuiltWorkshop } from '../support/workshop-builder';
import { startApiHarness, TEST_JWT_SECRET, type ApiHarness } from '../support/api-harness';

let h: ApiHarness;
let w: BuiltWorkshop;
beforeAll(async () => {
  h = await startApiHarness();
  w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['assessor', 'viewer'] });
});
afterAll(() => h.close());

const get = (path: string) =>
  request(h.app).get(path).set('Authorization', `Bearer ${w.members.viewer.token}`);

describe('GET /api/reference', () => {
  it('lists every shipped reference list with its row count', async () => {
    const res = await get('/api/reference');
    expect(res.status).toBe(200);
    const { items } = referenceListIndexSchema.parse(res.body);
    expect(items.map((l) => l.key)).toEqual(referenceLists.map((l) => l.key));
    for (const list of referenceLists) {
      expect(items.find((l) => l.key === list.key)!.rowCount).toBe(list.rows.length);
    }
  });

  it('is readable by the external assessor too', async () => {
    const res = await request(h.app)
      .get('/api/reference')
      .set('Authorization', `Bearer ${w.members.assessor.token}`);
    expect(res.status).toBe(200);
  });
});

describe('GET /api/reference/:key', () => {
  it('every row carries its source and status', async () => {
    for (const list of referenceLists) {
      const page = referenceRowsPageSchema.parse(
        (await get(`/api/reference/${list.key}?pageSize=200`)).body,
      );
      expect(page.total).toBe(list.rows.length);
      for (const row of page.items) {
        expect(row.source.length).toBeGreaterThan(3);
        expect(['C', 'C2', 'CALC', 'M']).toContain(row.status);
      }
    }
  });

  it('filters by text on the server (a CAS number finds its allergen)', async () => {
    // Regulation (EC) No 1223/2009, Annex III entry 77: Coumarin, CAS 91-64-5
    const page = referenceRowsPageSchema.parse(
      (await get('/api/reference/eu-annex-iii-allergens?q=91-64-5')).body,
    );
    expect(page.total).toBeGreaterThanOrEqual(1);
    expect(page.items.map((r) => r.label.toLowerCase())).toContain('coumarin');
  });

  it('sorts by label in both directions and pages', async () => {
    const asc = referenceRowsPageSchema.parse(
      (await get('/api/reference/eu-annex-iii-allergens?sort=label&dir=asc&pageSize=5')).body,
    );
    const desc = referenceRowsPageSchema.parse(
      (await get('/api/reference/eu-annex-iii-allergens?sort=label&dir=desc&pageSize=5')).body,
    );
    const labels = asc.items.map((r) => r.label);
    expect(labels).toHaveLength(5);
    expect([...labels].sort((a, b) => (a < b ? -1 : a > b ? 1 : 0))).toEqual(labels);
    expect(desc.items[0]!.label >= labels[labels.length - 1]!).toBe(true);
    const second = referenceRowsPageSchema.parse(
      (await get('/api/reference/eu-annex-iii-allergens?sort=label&page=2&pageSize=5')).body,
    );
    expect(second.items[0]!.label >= labels[4]!).toBe(true);
  });

  it('treats filter wildcards literally', async () => {
    const page = referenceRowsPageSchema.parse(
      (await get('/api/reference/eu-annex-iii-allergens?q=%25%25')).body,
    );
    expect(page.total).toBe(0);
  });

  it('with a bad page size responds 400 with fieldErrors.pageSize', async () => {
    const res = await get('/api/reference/eu-annex-iii-allergens?pageSize=5000');
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.pageSize).toBeDefined();
  });

  it('an unknown list is 404', async () => {
    expect((await get('/api/reference/no-such-list')).status).toBe(404);
  });
});
