import { count, eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DOCUMENT_MAX_BYTES, documentSchema, documentStatusSchema } from '@batchproof/shared';
import { documents } from '../../apps/api/src/db/schema';
import {
  elfExecutableBytes,
  pdfBytes,
  pngBytes,
  windowsExecutableBytes,
} from '../../fixtures/builders/document-files';
import { buildLot, buildMaterial } from '../support/row-builders';
import { aFragrance } from '../../fixtures/builders/material-builder';
import { buildWorkshop, type BuiltWorkshop } from '../support/workshop-builder';
import { startApiHarness, TEST_JWT_SECRET, type ApiHarness } from '../support/api-harness';
import { bearer } from '../support/auth-header';
import { asBytes } from '../support/binary-body';

let h: ApiHarness;
let w: BuiltWorkshop;
beforeAll(async () => {
  h = await startApiHarness();
  w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET);
});
afterAll(() => h.close());

function upload(
  owner: { materialId?: string; lotId?: string },
  file: Buffer,
  filename: string,
  fields: Record<string, string> = {},
) {
  let req = request(h.app).post('/api/documents').set(bearer(w.members.formulator));
  const all = {
    kind: 'sds',
    title: 'Safety data sheet',
    issuedOn: '2025-09-01',
    version: '3',
    ...owner,
    ...fields,
  };
  for (const [k, v] of Object.entries(all)) req = req.field(k, v);
  return req.attach('file', file, { filename, contentType: 'application/pdf' });
}

async function rowsFor(materialId: string) {
  const [row] = await h.handle.db
    .select({ n: count() })
    .from(documents)
    .where(eq(documents.materialId, materialId));
  return row!.n;
}

describe('POST /api/documents', () => {
  it('stores a PDF on a material with its metadata and SHA-256, and streams it back', async () => {
    const m = await buildMaterial(h.handle.db, w.id);
    const bytes = pdfBytes();
    const res = await upload({ materialId: m.id }, bytes, 'sds.pdf');
    expect(res.status).toBe(201);
    const doc = documentSchema.parse(res.body);
    expect(doc).toMatchObject({
      kind: 'sds',
      mimeType: 'application/pdf',
      sizeBytes: bytes.length,
      version: '3',
    });
    expect(doc.sha256).toMatch(/^[0-9a-f]{64}$/);
    const file = await asBytes(
      request(h.app).get(`/api/documents/${doc.id}/content`).set(bearer(w.members.production)),
    );
    expect(file.status).toBe(200);
    expect(file.headers['content-type']).toBe('application/pdf');
    expect(file.headers['content-disposition']).toBe(
      `attachment; filename="sds.pdf"; filename*=UTF-8''sds.pdf`,
    );
    expect(Buffer.compare(file.body as Buffer, bytes)).toBe(0);
  });

  it('decides the type from the first bytes: a PNG sent as application/pdf is stored as image/png', async () => {
    const lot = await buildLot(h.handle.db, w.id, (await buildMaterial(h.handle.db, w.id)).id);
    const res = await upload({ lotId: lot.id }, pngBytes(), 'coa.pdf', {
      kind: 'certificate-of-analysis',
    });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ mimeType: 'image/png', lotId: lot.id, materialId: null });
  });

  it.each([
    ['a Windows executable renamed cert.pdf', windowsExecutableBytes()],
    ['a Linux executable renamed cert.pdf', elfExecutableBytes()],
    ['plain text renamed cert.pdf', Buffer.from('just some text, not a certificate')],
  ])('refuses %s with 415 unsupported_media_type and stores nothing', async (_label, bytes) => {
    const m = await buildMaterial(h.handle.db, w.id);
    const res = await upload({ materialId: m.id }, bytes, 'cert.pdf');
    expect(res.status).toBe(415);
    expect(res.body.error.code).toBe('unsupported_media_type');
    expect(await rowsFor(m.id)).toBe(0);
  });

  it('refuses a file over 10 MB with 413 and leaves no row behind', async () => {
    const m = await buildMaterial(h.handle.db, w.id);
    const res = await upload({ materialId: m.id }, pdfBytes(DOCUMENT_MAX_BYTES + 1), 'big.pdf');
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('payload_too_large');
    expect(await rowsFor(m.id)).toBe(0);
  });

  it('when the metadata is bad, responds 400 with field errors and stores nothing', async () => {
    const m = await buildMaterial(h.handle.db, w.id);
    const res = await upload({ materialId: m.id }, pdfBytes(), 'x.pdf', {
      kind: 'receipt',
      issuedOn: 'yesterday',
    });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fieldErrors)).toEqual(
      expect.arrayContaining(['kind', 'issuedOn']),
    );
    expect(await rowsFor(m.id)).toBe(0);
  });

  it('needs exactly one of a material or a lot (400 fieldErrors.materialId), and a file (400 fieldErrors.file)', async () => {
    const none = await upload({}, pdfBytes(), 'x.pdf');
    expect(none.status).toBe(400);
    expect(none.body.error.fieldErrors.materialId).toBeDefined();
    const m = await buildMaterial(h.handle.db, w.id);
    const noFile = await request(h.app)
      .post('/api/documents')
      .set(bearer(w.members.owner))
      .field('kind', 'sds')
      .field('title', 'SDS')
      .field('issuedOn', '2025-01-01')
      .field('materialId', m.id);
    expect(noFile.status).toBe(400);
    expect(noFile.body.error.fieldErrors.file).toBeDefined();
  });

  it('for another workshop’s material responds 400 with fieldErrors.materialId', async () => {
    const other = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    const foreign = await buildMaterial(h.handle.db, other.id);
    const res = await upload({ materialId: foreign.id }, pdfBytes(), 'x.pdf');
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.materialId).toBeDefined();
  });
});

describe('GET /api/documents and /content', () => {
  it('lists a material’s documents without their bytes; another workshop gets 404 on the file', async () => {
    const m = await buildMaterial(h.handle.db, w.id);
    const up = await upload({ materialId: m.id }, pdfBytes(), 'a.pdf');
    const list = await request(h.app)
      .get(`/api/documents?materialId=${m.id}`)
      .set(bearer(w.members.viewer));
    expect(list.status).toBe(200);
    expect(list.body.items).toHaveLength(1);
    expect(list.body.items[0].content).toBeUndefined();
    const other = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    const res = await request(h.app)
      .get(`/api/documents/${up.body.id}/content`)
      .set(bearer(other.members.owner));
    expect(res.status).toBe(404);
  });

  it('without a material or lot responds 400 with fieldErrors.materialId', async () => {
    const res = await request(h.app).get('/api/documents').set(bearer(w.members.owner));
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.materialId).toBeDefined();
  });
});

describe('GET /api/materials/:id/document-status', () => {
  it('lists the missing and out-of-date documents a fragrance needs', async () => {
    const m = await buildMaterial(h.handle.db, w.id, aFragrance());
    const get = async () =>
      documentStatusSchema.parse(
        (
          await request(h.app)
            .get(`/api/materials/${m.id}/document-status`)
            .set(bearer(w.members.viewer))
        ).body,
      );
    const before = await get();
    expect(before.entries.map((e) => [e.kind, e.state])).toEqual([
      ['sds', 'missing'],
      ['ifra-certificate', 'missing'],
      ['allergen-declaration', 'missing'],
    ]);
    const today = new Date().toISOString().slice(0, 10);
    await upload({ materialId: m.id }, pdfBytes(), 'sds.pdf', { issuedOn: today });
    await upload({ materialId: m.id }, pdfBytes(), 'ifra.pdf', {
      kind: 'ifra-certificate',
      issuedOn: '2020-01-15',
    });
    const after = await get();
    expect(after.entries.map((e) => e.state)).toEqual(['current', 'out-of-date', 'missing']);
    expect(after.complete).toBe(false);
  });
});

describe('DELETE /api/documents/:id', () => {
  it('removes the document and its file', async () => {
    const m = await buildMaterial(h.handle.db, w.id);
    const up = await upload({ materialId: m.id }, pdfBytes(), 'a.pdf');
    const del = await request(h.app)
      .delete(`/api/documents/${up.body.id}`)
      .set(bearer(w.members.owner));
    expect(del.status).toBe(204);
    expect(await rowsFor(m.id)).toBe(0);
  });
});
