import { gzipSync } from 'node:zlib';
import { sql } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { errorEnvelopeSchema } from '@batchproof/shared';
import { hashToken, signAccessToken } from '../../apps/api/src/auth/access-tokens';
import { insertSignUpRequest } from '../../apps/api/src/auth/auth-repository';
import { materials } from '../../apps/api/src/db/schema';
import { aFormula } from '../../fixtures/builders/formula-builder';
import { aLot } from '../../fixtures/builders/lot-builder';
import { aMaterial, aSupplier } from '../../fixtures/builders/material-builder';
import { pdfBytes } from '../../fixtures/builders/document-files';
import { startApiHarness, TEST_JWT_SECRET, type ApiHarness } from '../support/api-harness';
import { bearer } from '../support/auth-header';
import { buildLot, buildMaterial } from '../support/row-builders';
import { buildWorkshop, type BuiltWorkshop } from '../support/workshop-builder';
import { whileHeld } from '../support/held-transaction';

// Named regressions from a hostile-input probe: each of these answered 500 before.
let h: ApiHarness;
let w: BuiltWorkshop;
let materialId: string;
beforeAll(async () => {
  h = await startApiHarness();
  w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
  materialId = (await buildMaterial(h.handle.db, w.id)).id;
});
afterAll(() => h.close());

const owner = () => bearer(w.members.owner);
const post = (path: string, body: object) => request(h.app).post(path).set(owner()).send(body);

/** Uploads a small PDF as an SDS of the test material, with some form fields replaced. */
function uploadDocument(fields: Record<string, string>) {
  const all = { kind: 'sds', title: 'SDS', issuedOn: '2025-01-01', materialId, ...fields };
  const req = request(h.app).post('/api/documents').set(owner());
  for (const [name, value] of Object.entries(all)) req.field(name, value);
  return req.attach('file', pdfBytes(), 'sds.pdf');
}

/** The envelope of a 400, with the field paths it names. */
function fieldsOf(res: request.Response) {
  expect(res.status).toBe(400);
  return Object.keys(errorEnvelopeSchema.parse(res.body).error.fieldErrors ?? {});
}

describe('NUL characters (PostgreSQL cannot store U+0000)', () => {
  it('in a supplier name, respond 400 with fieldErrors.name', async () => {
    expect(fieldsOf(await post('/api/suppliers', aSupplier({ name: 'Salt\u0000Co' })))).toEqual([
      'name',
    ]);
  });

  it('in text kept as an array or as JSON (functions, blend components, IFRA categories), respond 400 naming each field', async () => {
    const body = aMaterial({
      category: 'fragrance',
      functions: ['fragrance\u0000'],
      components: [{ inci: 'Lina\u0000lool', percent: 100 }],
      ifraCertificate: {
        maxPercentByIfraCategory: { '9\u0000': 2 },
        issuedOn: '2025-01-01',
        amendment: 51,
      },
    });
    expect(fieldsOf(await post('/api/materials', body))).toEqual(
      expect.arrayContaining([
        'functions.0',
        'components.0.inci',
        'ifraCertificate.maxPercentByIfraCategory.9\u0000',
      ]),
    );
  });

  it('in a list filter ?q=, respond 400 with fieldErrors.q', async () => {
    const res = await request(h.app).get('/api/materials?q=a%00b').set(owner());
    expect(fieldsOf(res)).toEqual(['q']);
  });

  it('in a multipart field of an upload, respond 400 with fieldErrors.title', async () => {
    const res = await uploadDocument({ title: 'SDS\u0000' });
    expect(fieldsOf(res)).toEqual(['title']);
  });

  it('in a sign-up, respond 400 with fieldErrors.workshopName', async () => {
    const res = await request(h.app).post('/api/auth/sign-up').send({
      workshopName: 'Suds\u0000',
      name: 'Pat',
      email: 'pat@test.example',
      password: 'long-enough-password',
    });
    expect(fieldsOf(res)).toEqual(['workshopName']);
  });

  it('as half of a surrogate pair (not Unicode; jsonb refuses it), respond 400', async () => {
    const body = aMaterial({ components: [{ inci: 'Mica\ud800', percent: 100 }] });
    expect(fieldsOf(await post('/api/materials', body))).toEqual(['components.0.inci']);
  });
});

describe('dates outside what PostgreSQL stores', () => {
  it('a lot received in year 0 responds 400 with fieldErrors.receivedOn', async () => {
    const res = await post('/api/lots', aLot(materialId, { receivedOn: '0000-06-01' }));
    expect(fieldsOf(res)).toContain('receivedOn');
  });

  it('a list filter ?expiresBefore= in year 0 responds 400', async () => {
    const res = await request(h.app).get('/api/lots?expiresBefore=0000-01-01').set(owner());
    expect(fieldsOf(res)).toEqual(['expiresBefore']);
  });

  it('a document issued in year 0 responds 400 with fieldErrors.issuedOn', async () => {
    const res = await uploadDocument({ issuedOn: '0000-02-29' });
    expect(fieldsOf(res)).toEqual(['issuedOn']);
  });
});

describe('quantities that round to 0 at the column’s decimals', () => {
  it('a lot of 0.00001 kg (stored to 4 decimals) responds 400 with fieldErrors.quantity', async () => {
    const res = await post('/api/lots', aLot(materialId, { quantity: 0.00001 }));
    expect(fieldsOf(res)).toEqual(['quantity']);
  });

  it('a formula line of 0.0000001 g (stored to 6 decimals) responds 400 naming the line', async () => {
    const res = await post('/api/formulas', aFormula([{ materialId, grams: 0.0000001 }]));
    expect(fieldsOf(res)).toEqual(['draft.lines.0.grams']);
  });
});

describe('whole numbers beyond an integer column', () => {
  it('GET /api/formulas/:id/compare?to=99999999999 responds 400 with fieldErrors.to', async () => {
    const created = await post('/api/formulas', aFormula([{ materialId, grams: 10 }]));
    const res = await request(h.app)
      .get(`/api/formulas/${created.body.id}/compare?from=1&to=99999999999`)
      .set(owner());
    expect(fieldsOf(res)).toEqual(['to']);
  });

  it('POST /api/formulas/:id/versions with fromVersion 99999999999 responds 400', async () => {
    const created = await post('/api/formulas', aFormula([{ materialId, grams: 10 }]));
    // Released, so no draft is open and the request would reach the version lookup.
    expect((await post(`/api/formulas/${created.body.id}/versions/1/release`, {})).status).toBe(
      200,
    );
    const res = await post(`/api/formulas/${created.body.id}/versions`, {
      fromVersion: 99999999999,
    });
    expect(fieldsOf(res)).toEqual(['fromVersion']);
  });
});

describe('access tokens', () => {
  it('a validly signed token whose subject is not a UUID is refused with 401, never queried', async () => {
    const token = signAccessToken(
      { sub: 'not-a-uuid', wid: w.id, role: 'owner' },
      TEST_JWT_SECRET,
      600,
    );
    const res = await request(h.app).get('/api/materials').set(bearer({ token }));
    expect(res.status).toBe(401);
    expect(errorEnvelopeSchema.parse(res.body).error.code).toBe('unauthenticated');
  });
});

describe('bodies and paths that libraries refuse keep their 4xx status', () => {
  it('an unsupported Content-Encoding responds 415 in the envelope, before any sign-in', async () => {
    const res = await request(h.app)
      .post('/api/auth/sign-in')
      .set('Content-Type', 'application/json')
      .set('Content-Encoding', 'compress')
      .send('{}');
    expect(res.status).toBe(415);
    expect(errorEnvelopeSchema.parse(res.body).error.code).toBe('unsupported_media_type');
  });

  it('a gzip body that does not decompress responds 400', async () => {
    const broken = gzipSync('{"email":"a@b.example"}').subarray(0, 12);
    const res = await request(h.app)
      .post('/api/auth/sign-in')
      .set('Content-Type', 'application/json')
      .set('Content-Encoding', 'gzip')
      .send(broken);
    expect(res.status).toBe(400);
    expect(errorEnvelopeSchema.parse(res.body).error.code).toBe('validation_failed');
  });

  it('a path with broken percent-encoding responds 400', async () => {
    const res = await request(h.app).get('/api/materials/%E0%A4%A').set(owner());
    expect(res.status).toBe(400);
    errorEnvelopeSchema.parse(res.body);
  });

  it('a multipart upload without a boundary responds 400', async () => {
    const res = await request(h.app)
      .post('/api/documents')
      .set(owner())
      .set('Content-Type', 'multipart/form-data')
      .send('--x\r\n');
    expect(res.status).toBe(400);
    expect(errorEnvelopeSchema.parse(res.body).error.message).toMatch(/upload could not be read/);
  });

  it('a multipart upload cut short responds 400, on documents and on the CSV import', async () => {
    const cut = [
      '--b0undary',
      'Content-Disposition: form-data; name="kind"',
      '',
      'sds',
      '--b0undary',
      'Content-Disposition: form-data; name="file"; filename="sds.pdf"',
      'Content-Type: application/pdf',
      '',
      '%PDF-1.4 and then nothing',
    ].join('\r\n');
    for (const path of ['/api/documents', '/api/materials/import/preview']) {
      const res = await request(h.app)
        .post(path)
        .set(owner())
        .set('Content-Type', 'multipart/form-data; boundary=b0undary')
        .send(cut);
      expect(res.status, path).toBe(400);
      errorEnvelopeSchema.parse(res.body);
    }
  });
});

describe('races the database settles (unique and foreign keys) answer 409', () => {
  it('20 parallel confirmations of sign-ups with one e-mail: one account, 19 × 409 with a message', async () => {
    const email = `race-${crypto.randomUUID().slice(0, 8)}@test.example`;
    const tokens = Array.from({ length: 20 }, (_, i) => `race-token-${i}-${crypto.randomUUID()}`);
    for (const token of tokens) {
      await insertSignUpRequest(h.handle.db, {
        email,
        name: 'Racer',
        workshopName: 'Race Workshop',
        passwordHash: 'not-used-by-this-test',
        tokenHash: hashToken(token),
        expiresAt: new Date(Date.now() + 3_600_000),
      });
    }
    const answers = await Promise.all(
      tokens.map((token) => request(h.app).post('/api/auth/sign-up/confirm').send({ token })),
    );
    const statuses = answers.map((r) => r.status).sort();
    expect(statuses).toEqual([201, ...Array(19).fill(409)]);
    for (const r of answers.filter((a) => a.status === 409)) {
      expect(errorEnvelopeSchema.parse(r.body).error).toMatchObject({ code: 'conflict' });
    }
  });

  it('a lot added for a material deleted at the same moment responds 409', async () => {
    const doomed = (await buildMaterial(h.handle.db, w.id)).id;
    const res = await whileHeld(
      h.handle.db,
      (tx) => tx.delete(materials).where(sql`${materials.id} = ${doomed}`),
      () => post('/api/lots', aLot(doomed)),
    );
    expect(res.status).toBe(409);
    expect(errorEnvelopeSchema.parse(res.body).error.message).toMatch(/removed at the same time/);
  });

  it('deleting a material while a lot of it is being added responds 409 and keeps the material', async () => {
    const used = (await buildMaterial(h.handle.db, w.id)).id;
    const res = await whileHeld(
      h.handle.db,
      async (tx) => {
        await buildLot(tx, w.id, used);
      },
      () => request(h.app).delete(`/api/materials/${used}`).set(owner()),
    );
    expect(res.status).toBe(409);
    expect(errorEnvelopeSchema.parse(res.body).error.code).toBe('conflict');
    expect((await request(h.app).get(`/api/materials/${used}`).set(owner())).status).toBe(200);
  });

  it('deleting a material while lots and formula lines are added to it never answers 5xx', async () => {
    const contested = (await buildMaterial(h.handle.db, w.id)).id;
    const answers = await Promise.all([
      ...Array.from({ length: 5 }, () => post('/api/lots', aLot(contested))),
      ...Array.from({ length: 5 }, () =>
        post('/api/formulas', aFormula([{ materialId: contested, grams: 10 }])),
      ),
      request(h.app).delete(`/api/materials/${contested}`).set(owner()),
    ]);
    for (const r of answers) {
      expect([200, 201, 204, 400, 409]).toContain(r.status);
      if (r.status >= 400) errorEnvelopeSchema.parse(r.body);
    }
  });
});
