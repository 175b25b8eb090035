import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { pdfBytes } from '../../fixtures/builders/document-files';
import { bearer } from '../support/auth-header';
import { asBytes } from '../support/binary-body';
import { buildMaterial } from '../support/row-builders';
import { startApiHarness, TEST_JWT_SECRET, type ApiHarness } from '../support/api-harness';
import { buildWorkshop, type BuiltWorkshop } from '../support/workshop-builder';

let h: ApiHarness;
let w: BuiltWorkshop;
beforeAll(async () => {
  h = await startApiHarness();
  w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET);
});
afterAll(() => h.close());

/** Uploads `bytes` under `filename` (sent raw in UTF-8, as browsers do) and downloads it again. */
async function roundTrip(bytes: Buffer, filename: string, claimedType = 'application/pdf') {
  const m = await buildMaterial(h.handle.db, w.id);
  const created = await request(h.app)
    .post('/api/documents')
    .set(bearer(w.members.formulator))
    .field('materialId', m.id)
    .field('kind', 'sds')
    .field('title', 'Safety data sheet')
    .field('issuedOn', '2025-09-01')
    .field('version', '1')
    .attach('file', bytes, { filename, contentType: claimedType });
  expect(created.status).toBe(201);
  const download = await asBytes(
    request(h.app).get(`/api/documents/${created.body.id}/content`).set(bearer(w.members.viewer)),
  );
  expect(download.status).toBe(200);
  return { stored: created.body.filename as string, download };
}

describe('GET /api/documents/:id/content', () => {
  it('keeps a UTF-8 file name: é.pdf is stored as é.pdf and sent with RFC 5987 encoding', async () => {
    const { stored, download } = await roundTrip(pdfBytes(), 'é.pdf');
    expect(stored).toBe('é.pdf');
    // RFC 6266 section 4.3: an ASCII fallback, then filename* in UTF-8, percent-encoded.
    expect(download.headers['content-disposition']).toBe(
      `attachment; filename="_.pdf"; filename*=UTF-8''%C3%A9.pdf`,
    );
  });

  it('serves the type sniffed at upload, never one from the name: x.html holding a PDF is application/pdf', async () => {
    const { stored, download } = await roundTrip(pdfBytes(), 'x.html', 'text/html');
    expect(stored).toBe('x.html');
    expect(download.headers['content-type']).toBe('application/pdf');
    expect(download.headers['x-content-type-options']).toBe('nosniff');
    expect(Buffer.compare(download.body as Buffer, pdfBytes())).toBe(0);
  });

  it('drops control and bidirectional characters from the name, so `cod.exe` cannot pose as `exe.doc`', async () => {
    const { stored, download } = await roundTrip(pdfBytes(), 'in\u202Efdp.exe\u0085\u200F.pdf');
    expect(stored).toBe('infdp.exe.pdf');
    expect(download.headers['content-disposition']).toBe(
      `attachment; filename="infdp.exe.pdf"; filename*=UTF-8''infdp.exe.pdf`,
    );
  });

  it("encodes the characters RFC 5987 leaves out of filename*: ' ( ) * and the space", async () => {
    const { download } = await roundTrip(pdfBytes(), "it's (v2) *final*.pdf");
    expect(download.headers['content-disposition']).toBe(
      `attachment; filename="it's (v2) *final*.pdf"; filename*=UTF-8''it%27s%20%28v2%29%20%2Afinal%2A.pdf`,
    );
  });
});
