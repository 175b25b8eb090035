import { and, eq } from 'drizzle-orm';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { errorEnvelopeSchema } from '@batchproof/shared';
import {
  documents,
  formulas,
  formulaVersions,
  idempotencyKeys,
  lots,
} from '../../apps/api/src/db/schema';
import { pdfBytes } from '../../fixtures/builders/document-files';
import { aFormula } from '../../fixtures/builders/formula-builder';
import { aLot } from '../../fixtures/builders/lot-builder';
import { bearer } from '../support/auth-header';
import { formulaWorkspaceForFile } from '../support/formula-workspace';
import type { BuiltMember } from '../support/workshop-builder';

const f$ = formulaWorkspaceForFile();

const KEY = 'Idempotency-Key';
const newKey = () => crypto.randomUUID();

function postLot(body: object, key?: string, who: BuiltMember = f$.w.members.formulator) {
  const req = request(f$.h.app).post('/api/lots').set(bearer(who));
  return (key ? req.set(KEY, key) : req).send(body);
}

const lotsNumbered = (supplierLotNumber: string) =>
  f$.h.handle.db.$count(
    lots,
    and(eq(lots.workshopId, f$.w.id), eq(lots.supplierLotNumber, supplierLotNumber)),
  );

describe('POST /api/lots with an Idempotency-Key', () => {
  it('a retry with the same key answers the first status and body and creates one lot', async () => {
    const body = aLot(f$.m.bicarb);
    const key = newKey();
    const first = await postLot(body, key);
    const retry = await postLot(body, key);
    expect(first.status).toBe(201);
    expect(retry.status).toBe(201);
    expect(retry.text).toBe(first.text);
    expect(retry.headers['idempotent-replayed']).toBe('true');
    expect(first.headers['idempotent-replayed']).toBeUndefined();
    expect(await lotsNumbered(body.supplierLotNumber)).toBe(1);
  });

  it('retries sent at the same time still create one lot and all answer with its id', async () => {
    const body = aLot(f$.m.bicarb);
    const key = newKey();
    const answers = await Promise.all([postLot(body, key), postLot(body, key), postLot(body, key)]);
    expect(answers.map((a) => a.status)).toEqual([201, 201, 201]);
    expect(new Set(answers.map((a) => a.body.id)).size).toBe(1);
    expect(await lotsNumbered(body.supplierLotNumber)).toBe(1);
  });

  it('a different key creates another lot', async () => {
    const body = aLot(f$.m.bicarb);
    const first = await postLot(body, newKey());
    const second = await postLot(body, newKey());
    expect(second.status).toBe(201);
    expect(second.body.id).not.toBe(first.body.id);
    expect(await lotsNumbered(body.supplierLotNumber)).toBe(2);
  });

  it('the same key with a different body answers 422 idempotency_key_reused and creates nothing', async () => {
    const key = newKey();
    await postLot(aLot(f$.m.bicarb), key);
    const other = aLot(f$.m.bicarb);
    const res = await postLot(other, key);
    expect(res.status).toBe(422);
    const { error } = errorEnvelopeSchema.parse(res.body);
    expect(error.code).toBe('idempotency_key_reused');
    expect(error.message).toMatch(/already used for a different request/);
    expect(await lotsNumbered(other.supplierLotNumber)).toBe(0);
  });

  it('keys belong to one user: another member’s request with the same key creates its own lot', async () => {
    const body = aLot(f$.m.bicarb);
    const key = newKey();
    const mine = await postLot(body, key, f$.w.members.formulator);
    const theirs = await postLot(body, key, f$.w.members.owner);
    expect(theirs.status).toBe(201);
    expect(theirs.body.id).not.toBe(mine.body.id);
  });

  it('a first request that failed stores nothing, so its corrected retry with the key creates the lot', async () => {
    const key = newKey();
    const bad = await postLot({ ...aLot(f$.m.bicarb), quantity: 0 }, key);
    expect(bad.status).toBe(400);
    const good = aLot(f$.m.bicarb);
    const res = await postLot(good, key);
    expect(res.status).toBe(201);
    expect(await lotsNumbered(good.supplierLotNumber)).toBe(1);
  });

  it('a malformed key answers 400 with fieldErrors on the header', async () => {
    const res = await postLot(aLot(f$.m.bicarb), 'has spaces in it');
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors[KEY]).toBeDefined();
    const long = await postLot(aLot(f$.m.bicarb), 'k'.repeat(256));
    expect(long.status).toBe(400);
  });

  it('a key older than a day counts as new', async () => {
    const body = aLot(f$.m.bicarb);
    const key = newKey();
    await postLot(body, key);
    await f$.h.handle.db
      .update(idempotencyKeys)
      .set({ createdAt: new Date(Date.now() - 25 * 3_600_000) })
      .where(eq(idempotencyKeys.key, key));
    const again = await postLot(body, key);
    expect(again.headers['idempotent-replayed']).toBeUndefined();
    expect(await lotsNumbered(body.supplierLotNumber)).toBe(2);
  });
});

describe('the other create routes take an Idempotency-Key', () => {
  it('POST /api/formulas: a retry answers the same formula and creates one', async () => {
    const body = aFormula(f$.base(), { name: `Retried ${newKey()}` });
    const key = newKey();
    const send = () =>
      request(f$.h.app)
        .post('/api/formulas')
        .set(bearer(f$.w.members.formulator))
        .set(KEY, key)
        .send(body);
    const first = await send();
    const retry = await send();
    expect(first.status).toBe(201);
    expect(retry.status).toBe(201);
    expect(retry.body.id).toBe(first.body.id);
    expect(await f$.h.handle.db.$count(formulas, eq(formulas.name, body.name))).toBe(1);
  });

  it('POST /api/formulas/:id/versions: a retry answers the same draft and creates one version', async () => {
    const f = await f$.createFormula();
    expect((await f$.release(f.id, 1)).status).toBe(200);
    const key = newKey();
    const send = () =>
      request(f$.h.app)
        .post(`/api/formulas/${f.id}/versions`)
        .set(bearer(f$.w.members.formulator))
        .set(KEY, key)
        .send({});
    const first = await send();
    const retry = await send();
    expect(first.status).toBe(201);
    expect(retry.status).toBe(201);
    expect(retry.body.id).toBe(first.body.id);
    expect(await f$.h.handle.db.$count(formulaVersions, eq(formulaVersions.formulaId, f.id))).toBe(
      2,
    );
  });

  it('POST /api/documents: a retried upload answers the same document and stores one; another file with the key is 422', async () => {
    const key = newKey();
    const title = `Retried SDS ${newKey()}`;
    const send = (file: Buffer) =>
      request(f$.h.app)
        .post('/api/documents')
        .set(bearer(f$.w.members.formulator))
        .set(KEY, key)
        .field('materialId', f$.m.bicarb)
        .field('kind', 'sds')
        .field('title', title)
        .field('issuedOn', '2025-09-01')
        .attach('file', file, { filename: 'sds.pdf', contentType: 'application/pdf' });
    const first = await send(pdfBytes());
    const retry = await send(pdfBytes());
    expect(first.status).toBe(201);
    expect(retry.body.id).toBe(first.body.id);
    expect((await send(pdfBytes(4096))).status).toBe(422);
    expect(await f$.h.handle.db.$count(documents, eq(documents.title, title))).toBe(1);
  });
});
