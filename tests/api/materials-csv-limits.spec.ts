import { eq } from 'drizzle-orm';
import Papa from 'papaparse';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  MATERIAL_CSV_MAX_JSON_CELL,
  MATERIAL_CSV_MAX_ROWS,
  MATERIAL_CSV_PREVIEW_ROWS,
  materialImportPreviewSchema,
  materialImportResultSchema,
} from '@batchproof/shared';
import { materials } from '../../apps/api/src/db/schema';
import { buildWorkshop, type BuiltWorkshop } from '../support/workshop-builder';
import { startApiHarness, TEST_JWT_SECRET, type ApiHarness } from '../support/api-harness';
import { bearer } from '../support/auth-header';

let h: ApiHarness;
beforeAll(async () => {
  h = await startApiHarness();
});
afterAll(() => h.close());

const workshop = () => buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
const materialCount = (w: BuiltWorkshop) =>
  h.handle.db.$count(materials, eq(materials.workshopId, w.id));

/** A CSV of `n` rows; `row(i)` gives the cells of row i. */
function csv(n: number, row: (i: number) => Record<string, string>) {
  const rows = Array.from({ length: n }, (_, i) => row(i));
  return Papa.unparse({ fields: Object.keys(rows[0]!), data: rows });
}
const salt = (i: number) => ({ tradeName: `Salt ${i}`, inci: 'Sodium Chloride', category: 'base' });

function send(w: BuiltWorkshop, path: 'import' | 'import/preview', body: string) {
  return request(h.app)
    .post(`/api/materials/${path}`)
    .set(bearer(w.members.owner))
    .set('Content-Type', 'text/csv')
    .send(body);
}

describe('a materials CSV above the row cap', () => {
  // 40,000 rows, ~1.4 MB: parsing stops after the cap instead of reading every row.
  const oversized = csv(40_000, salt);

  it('preview answers with one file error and no rows, in a small body', async () => {
    const w = await workshop();
    const res = await send(w, 'import/preview', oversized);
    expect(res.status).toBe(200);
    const p = materialImportPreviewSchema.parse(res.body);
    expect(p.fileErrors).toEqual([
      `The file has more than ${MATERIAL_CSV_MAX_ROWS} rows; import at most ${MATERIAL_CSV_MAX_ROWS} at a time`,
    ]);
    expect(p.rows).toEqual([]);
    expect(res.text.length).toBeLessThan(1_000);
  });

  it('import answers 400 with the same file error and writes nothing', async () => {
    const w = await workshop();
    const res = await send(w, 'import', oversized);
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.file.join(' ')).toMatch(/more than 5000 rows/);
    expect(await materialCount(w)).toBe(0);
  });
});

describe('the largest accepted materials CSV', () => {
  it(`imports ${MATERIAL_CSV_MAX_ROWS} rows whole (more parameters than one insert statement takes)`, async () => {
    const w = await workshop();
    const res = await send(w, 'import', csv(MATERIAL_CSV_MAX_ROWS, salt));
    expect(res.status).toBe(201);
    expect(materialImportResultSchema.parse(res.body).imported).toBe(MATERIAL_CSV_MAX_ROWS);
    expect(await materialCount(w)).toBe(MATERIAL_CSV_MAX_ROWS);
  });

  it(`preview sends back at most ${MATERIAL_CSV_PREVIEW_ROWS} rows, those needing attention first, and counts them all`, async () => {
    const w = await workshop();
    // Every third row has an unknown category.
    const body = csv(MATERIAL_CSV_MAX_ROWS, (i) => ({
      ...salt(i),
      category: i % 3 === 0 ? 'glitter' : 'base',
    }));
    const res = await send(w, 'import/preview', body);
    const p = materialImportPreviewSchema.parse(res.body);
    expect(p.errorCount).toBe(Math.ceil(MATERIAL_CSV_MAX_ROWS / 3));
    expect(p.validCount).toBe(MATERIAL_CSV_MAX_ROWS - p.errorCount);
    expect(p.rows).toHaveLength(MATERIAL_CSV_PREVIEW_ROWS);
    expect(p.rows.every((r) => !r.valid)).toBe(true);
    expect(p.rows.map((r) => r.line)).toEqual([...p.rows.map((r) => r.line)].sort((a, b) => a - b));
  });
});

describe('oversized cells', () => {
  it('a JSON cell over the cell limit is refused on that cell, and a long name is clipped in the answer', async () => {
    const w = await workshop();
    const body = csv(1, () => ({
      tradeName: 'N'.repeat(5_000),
      inci: 'Mica',
      category: 'colourant',
      supplier: 'S'.repeat(5_000),
      components: JSON.stringify(
        Array.from({ length: 5_000 }, () => ({ inci: 'Mica', percent: 0.02 })),
      ),
    }));
    expect(body.length).toBeGreaterThan(MATERIAL_CSV_MAX_JSON_CELL);
    const res = await send(w, 'import/preview', body);
    const [row] = materialImportPreviewSchema.parse(res.body).rows;
    expect(row!.errors['components']).toEqual([
      `This cell is too long (${MATERIAL_CSV_MAX_JSON_CELL} characters at most)`,
    ]);
    expect(row!.tradeName.length).toBeLessThanOrEqual(200);
    expect(res.text.length).toBeLessThan(3_000);
  });
});
