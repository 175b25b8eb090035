import { eq } from 'drizzle-orm';
import Papa from 'papaparse';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { materialImportPreviewSchema } from '@batchproof/shared';
import { materials } from '../../apps/api/src/db/schema';
import { startApiHarness, TEST_JWT_SECRET, type ApiHarness } from '../support/api-harness';
import { bearer } from '../support/auth-header';
import { buildWorkshop, type BuiltWorkshop } from '../support/workshop-builder';

let h: ApiHarness;
let w: BuiltWorkshop;
beforeAll(async () => {
  h = await startApiHarness();
  w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
});
afterAll(() => h.close());

const csv = (rows: Record<string, string>[]) =>
  Papa.unparse({ fields: [...new Set(rows.flatMap((r) => Object.keys(r)))], data: rows });
const row = (tradeName: string, extra: Record<string, string> = {}) => ({
  tradeName,
  inci: 'Sodium Chloride',
  category: 'base',
  ...extra,
});

const previewText = (text: string) =>
  request(h.app)
    .post('/api/materials/import/preview')
    .set(bearer(w.members.owner))
    .set('Content-Type', 'text/csv')
    .send(text);
const uploadBytes = (path: string, bytes: Buffer) =>
  request(h.app)
    .post(path)
    .set(bearer(w.members.owner))
    .attach('file', bytes, { filename: 'materials.csv', contentType: 'text/csv' });

/** UTF-16 little-endian bytes of `text`, as Excel's "Unicode text" and some editors save. */
const utf16le = (text: string, bom: boolean) =>
  Buffer.concat([Buffer.from(bom ? [0xff, 0xfe] : []), Buffer.from(text, 'utf16le')]);
const utf16be = (text: string) => {
  const le = Buffer.from(text, 'utf16le');
  const be = Buffer.alloc(le.length);
  for (let i = 0; i < le.length; i += 2) [be[i], be[i + 1]] = [le[i + 1]!, le[i]!];
  return Buffer.concat([Buffer.from([0xfe, 0xff]), be]);
};

describe('materials CSV saved as UTF-16', () => {
  const text = csv([row('Sea Salt')]);
  const files: [string, Buffer][] = [
    ['little-endian with a byte-order mark', utf16le(text, true)],
    ['little-endian without a byte-order mark', utf16le(text, false)],
    ['big-endian with a byte-order mark', utf16be(text)],
  ];

  for (const [name, bytes] of files) {
    it(`${name}: preview and import answer 400 asking for UTF-8, and write nothing`, async () => {
      for (const path of ['/api/materials/import/preview', '/api/materials/import']) {
        const res = await uploadBytes(path, bytes);
        expect(res.status, path).toBe(400);
        expect(res.body.error.code).toBe('validation_failed');
        expect(res.body.error.message).toMatch(/UTF-16/);
        expect(res.body.error.fieldErrors.file.join(' ')).toMatch(/save it as CSV UTF-8/i);
      }
      const stored = await h.handle.db
        .select()
        .from(materials)
        .where(eq(materials.workshopId, w.id));
      expect(stored.filter((m) => m.tradeName === 'Sea Salt')).toEqual([]);
    });
  }

  it('sent as a text/csv body without a charset, answers 400 asking for UTF-8', async () => {
    const res = await request(h.app)
      .post('/api/materials/import/preview')
      .set(bearer(w.members.owner))
      .set('Content-Type', 'text/csv')
      .send(utf16le(text, true));
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.file.join(' ')).toMatch(/UTF-8/);
  });

  it('a UTF-8 file with a byte-order mark and accents is read as usual', async () => {
    const res = await uploadBytes(
      '/api/materials/import/preview',
      Buffer.from(`\uFEFF${csv([row('Crème de Sel')])}`, 'utf8'),
    );
    expect(res.status).toBe(200);
    expect(materialImportPreviewSchema.parse(res.body).rows[0]).toMatchObject({
      tradeName: 'Crème de Sel',
      valid: true,
    });
  });
});

describe('materials CSV preview messages use the file’s columns and the UI’s words', () => {
  it('keys a problem inside a JSON cell by its column, and says where in the cell it is', async () => {
    const res = await previewText(
      csv([
        row('Broken Blend', {
          category: 'colourant',
          components: JSON.stringify([
            { inci: 'Mica', percent: 95 },
            { inci: '', percent: 5 },
          ]),
          calibrations: JSON.stringify([{ unit: 'bucket', amount: 1, grams: 2 }]),
        }),
      ]),
    );
    const [r] = materialImportPreviewSchema.parse(res.body).rows;
    expect(Object.keys(r!.errors).sort()).toEqual(['calibrations', 'components']);
    expect(r!.errors['components']).toContain('Entry 2, inci: INCI name is required');
    expect(r!.errors['calibrations']!.join(' ')).toMatch(/^Entry 1, unit: /);
  });

  it('a category written as the screen shows it ("Essential oil") is read as that category', async () => {
    const res = await previewText(
      csv([row('Lavender Oil', { category: 'Essential oil' }), row('Salt', { category: 'BASE' })]),
    );
    const p = materialImportPreviewSchema.parse(res.body);
    expect(p.rows.map((r) => [r.valid, r.errors])).toEqual([
      [true, {}],
      [true, {}],
    ]);
  });

  it('an unknown category names the categories as the screen does', async () => {
    const res = await previewText(
      csv([row('Glitter', { category: 'glitter' }), row('Nothing', { category: '' })]),
    );
    const [unknown, blank] = materialImportPreviewSchema.parse(res.body).rows;
    const message = unknown!.errors['category']!.join(' ');
    expect(message).toContain('"glitter" is not a category');
    expect(message).toContain('Essential oil');
    expect(message).not.toContain('essential-oil');
    expect(blank!.errors['category']!.join(' ')).toMatch(/^Choose a category: Base, Acid/);
  });

  it('an import refused for a JSON cell keys the field error by line and column', async () => {
    const res = await request(h.app)
      .post('/api/materials/import')
      .set(bearer(w.members.owner))
      .set('Content-Type', 'text/csv')
      .send(
        csv([row('Broken Blend', { components: JSON.stringify([{ inci: 'Mica', percent: -5 }]) })]),
      );
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fieldErrors)).toEqual(['rows.2.components']);
  });
});
