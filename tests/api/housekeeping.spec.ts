import { and, eq } from 'drizzle-orm';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import {
  attentionSchema,
  documentListSchema,
  documentSchema,
  documentStatusSchema,
  formulaPageSchema,
  formulaSchema,
  materialPageSchema,
  materialSchema,
  materialsByIdSchema,
  supplierPageSchema,
  supplierSchema,
} from '@batchproof/shared';
import { auditEvents } from '../../apps/api/src/db/schema';
import { pdfBytes } from '../../fixtures/builders/document-files';
import { aFragrance, aMaterial, aSupplier } from '../../fixtures/builders/material-builder';
import { buildLot, buildMaterial, buildSupplier } from '../support/row-builders';
import { buildWorkshop, type BuiltMember } from '../support/workshop-builder';
import { TEST_JWT_SECRET } from '../support/api-harness';
import { bearer } from '../support/auth-header';
import { formulaWorkspaceForFile } from '../support/formula-workspace';

const f$ = formulaWorkspaceForFile();

/** A fresh workshop, so lists and the home page hold only what the test made. */
const freshWorkshop = () => buildWorkshop(f$.h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });

const post = (who: BuiltMember, path: string) =>
  request(f$.h.app).post(path).set(bearer(who)).send({});
const get = (who: BuiltMember, path: string) => request(f$.h.app).get(path).set(bearer(who));
const del = (who: BuiltMember, path: string) => request(f$.h.app).delete(path).set(bearer(who));

function upload(who: BuiltMember, materialId: string, fields: Record<string, string> = {}) {
  const all = { kind: 'sds', title: 'Safety data sheet', issuedOn: '2025-01-01', ...fields };
  let req = request(f$.h.app)
    .post('/api/documents')
    .set(bearer(who))
    .field('materialId', materialId);
  for (const [k, v] of Object.entries(all)) req = req.field(k, v);
  return req.attach('file', pdfBytes(), { filename: 'sds.pdf', contentType: 'application/pdf' });
}

async function auditActions(workshopId: string, subjectId: string) {
  const rows = await f$.h.handle.db
    .select({ action: auditEvents.action, subjectType: auditEvents.subjectType })
    .from(auditEvents)
    .where(and(eq(auditEvents.workshopId, workshopId), eq(auditEvents.subjectId, subjectId)))
    .orderBy(auditEvents.createdAt);
  return rows.map((r) => `${r.subjectType} ${r.action}`);
}

describe('archiving materials', () => {
  it('leaves an archived material out of the list (and so the pickers) unless asked, but ?ids= still answers it', async () => {
    const ws = await freshWorkshop();
    const owner = ws.members.owner;
    const kept = await buildMaterial(f$.h.handle.db, ws.id, aMaterial({ tradeName: 'Kept' }));
    const old = await buildMaterial(f$.h.handle.db, ws.id, aMaterial({ tradeName: 'Old' }));

    const archived = await post(owner, `/api/materials/${old.id}/archive`);
    expect(archived.status).toBe(200);
    expect(materialSchema.parse(archived.body).archivedAt).toEqual(expect.any(String));

    const names = async (qs: string) =>
      materialPageSchema
        .parse((await get(owner, `/api/materials?${qs}`)).body)
        .items.map((m) => m.tradeName);
    expect(await names('sort=tradeName')).toEqual(['Kept']);
    expect(await names('sort=tradeName&includeArchived=true')).toEqual(['Kept', 'Old']);
    // An old formula version that uses the material must still open.
    const byId = materialsByIdSchema.parse(
      (await get(owner, `/api/materials?ids=${kept.id},${old.id}`)).body,
    );
    expect(byId.items.map((m) => m.tradeName).sort()).toEqual(['Kept', 'Old']);

    const back = await post(owner, `/api/materials/${old.id}/unarchive`);
    expect(back.status).toBe(200);
    expect(back.body.archivedAt).toBeNull();
    expect(await names('sort=tradeName')).toEqual(['Kept', 'Old']);
    expect(await auditActions(ws.id, old.id)).toEqual(['material archive', 'material unarchive']);
  });

  it('with includeArchived that is not a boolean responds 400 with fieldErrors.includeArchived', async () => {
    const res = await get(f$.w.members.owner, '/api/materials?includeArchived=perhaps');
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.includeArchived).toBeDefined();
  });

  it('leaves an archived material out of the home page’s missing documents', async () => {
    const ws = await freshWorkshop();
    const scent = await buildMaterial(f$.h.handle.db, ws.id, aFragrance());
    const before = attentionSchema.parse((await get(ws.members.owner, '/api/attention')).body);
    expect(before.items.some((i) => 'materialId' in i && i.materialId === scent.id)).toBe(true);
    await post(ws.members.owner, `/api/materials/${scent.id}/archive`);
    const after = attentionSchema.parse((await get(ws.members.owner, '/api/attention')).body);
    expect(after.items.some((i) => 'materialId' in i && i.materialId === scent.id)).toBe(false);
  });
});

describe('DELETE /api/materials/:id', () => {
  it('refuses with 409 and says what refers to it: a lot, then a document', async () => {
    const ws = await freshWorkshop();
    const owner = ws.members.owner;
    const withLot = await buildMaterial(f$.h.handle.db, ws.id);
    await buildLot(f$.h.handle.db, ws.id, withLot.id);
    const refused = await del(owner, `/api/materials/${withLot.id}`);
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toBe(
      'This material cannot be deleted: 1 lot refers to it. Archive it instead: it leaves the ' +
        'lists and pickers, and what refers to it stays readable.',
    );

    const withDocument = await buildMaterial(f$.h.handle.db, ws.id);
    expect((await upload(owner, withDocument.id)).status).toBe(201);
    const second = await del(owner, `/api/materials/${withDocument.id}`);
    expect(second.status).toBe(409);
    expect(second.body.error.message).toMatch(/^This material cannot be deleted: 1 document /);
  });

  it('deletes an unused material and logs the deletion', async () => {
    const ws = await freshWorkshop();
    const unused = await buildMaterial(f$.h.handle.db, ws.id);
    expect((await del(ws.members.owner, `/api/materials/${unused.id}`)).status).toBe(204);
    expect(await auditActions(ws.id, unused.id)).toEqual(['material delete']);
  });
});

describe('suppliers: archive, delete and duplicate names', () => {
  it('refuses with 409 to delete a supplier a material names, and archives it instead', async () => {
    const ws = await freshWorkshop();
    const owner = ws.members.owner;
    const supplier = await buildSupplier(f$.h.handle.db, ws.id, { name: 'Wrenfield' });
    await buildMaterial(f$.h.handle.db, ws.id, aMaterial({ supplierId: supplier.id }));
    const refused = await del(owner, `/api/suppliers/${supplier.id}`);
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toMatch(
      /^This supplier cannot be deleted: 1 material refers to it\. Archive it instead/,
    );

    expect((await post(owner, `/api/suppliers/${supplier.id}/archive`)).status).toBe(200);
    const list = supplierPageSchema.parse((await get(owner, '/api/suppliers')).body);
    expect(list.items).toEqual([]);
    const all = supplierPageSchema.parse(
      (await get(owner, '/api/suppliers?includeArchived=true')).body,
    );
    expect(all.items.map((s) => s.name)).toEqual(['Wrenfield']);

    const unused = await buildSupplier(f$.h.handle.db, ws.id);
    expect((await del(owner, `/api/suppliers/${unused.id}`)).status).toBe(204);
    expect(await auditActions(ws.id, unused.id)).toEqual(['supplier delete']);
  });

  it('warns, without refusing, on a second supplier with the same name in other case and spacing', async () => {
    const ws = await freshWorkshop();
    const owner = ws.members.owner;
    const first = await request(f$.h.app)
      .post('/api/suppliers')
      .set(bearer(owner))
      .send(aSupplier({ name: 'Alder Chemicals' }));
    expect(supplierSchema.parse(first.body).warnings).toEqual([]);

    const second = await request(f$.h.app)
      .post('/api/suppliers')
      .set(bearer(owner))
      .send(aSupplier({ name: '  alder   CHEMICALS ' }));
    expect(second.status).toBe(201);
    expect(supplierSchema.parse(second.body).warnings).toEqual([
      {
        field: 'name',
        message:
          'Another supplier is already called “Alder Chemicals”. Check this is not the same company entered twice.',
      },
    ]);

    const renamed = await request(f$.h.app)
      .put(`/api/suppliers/${second.body.id}`)
      .set(bearer(owner))
      .send(aSupplier({ name: 'Alder Minerals' }));
    expect(renamed.body.warnings).toEqual([]);
  });
});

describe('formulas: archive and delete', () => {
  it('leaves an archived formula out of the list and the home page, and shows it when asked', async () => {
    const blocked = await f$.createFormula([...f$.base(), { materialId: f$.m.blue, grams: 2 }]);
    const owner = f$.w.members.owner;
    const blockedIds = async () =>
      attentionSchema
        .parse((await get(owner, '/api/attention')).body)
        .items.flatMap((i) => (i.kind === 'formula-blocked' ? [i.formulaId] : []));
    expect(await blockedIds()).toContain(blocked.id);

    const archived = await post(owner, `/api/formulas/${blocked.id}/archive`);
    expect(formulaSchema.parse(archived.body).archivedAt).toEqual(expect.any(String));
    expect(await blockedIds()).not.toContain(blocked.id);
    const ids = async (qs: string) =>
      formulaPageSchema
        .parse((await get(owner, `/api/formulas?pageSize=100&${qs}`)).body)
        .items.map((f) => f.id);
    expect(await ids('')).not.toContain(blocked.id);
    expect(await ids('includeArchived=true')).toContain(blocked.id);
  });

  it('deletes a formula never released, and refuses with 409 once a version was released', async () => {
    const owner = f$.w.members.owner;
    const draftOnly = await f$.createFormula();
    expect((await del(owner, `/api/formulas/${draftOnly.id}`)).status).toBe(204);
    expect((await get(owner, `/api/formulas/${draftOnly.id}`)).status).toBe(404);
    expect(await auditActions(f$.w.id, draftOnly.id)).toEqual([
      'formula formula.created',
      'formula delete',
    ]);

    const released = await f$.createFormula();
    expect((await f$.release(released.id, 1)).status).toBe(200);
    const refused = await del(owner, `/api/formulas/${released.id}`);
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toMatch(
      /^This formula cannot be deleted: a version was released, .* Archive it instead/,
    );
  });
});

describe('documents: replace, archive and delete', () => {
  it('replaces a document with a newer one: the old one stays listed as superseded and no longer counts', async () => {
    const ws = await freshWorkshop();
    const owner = ws.members.owner;
    const material = await buildMaterial(f$.h.handle.db, ws.id);
    const old = documentSchema.parse((await upload(owner, material.id)).body);
    const newer = await upload(owner, material.id, { replacesId: old.id, issuedOn: '2024-06-01' });
    expect(newer.status).toBe(201);
    expect(newer.body.replacesId).toBe(old.id);

    const list = documentListSchema.parse(
      (await get(owner, `/api/documents?materialId=${material.id}`)).body,
    );
    expect(list.items.find((d) => d.id === old.id)?.supersededById).toBe(newer.body.id);
    // The status follows the newer document even though the old one's issue date is later.
    const status = documentStatusSchema.parse(
      (await get(owner, `/api/materials/${material.id}/document-status`)).body,
    );
    expect(status.entries[0]?.latest?.id).toBe(newer.body.id);

    const refused = await del(owner, `/api/documents/${old.id}`);
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toMatch(/a newer document replaced it/);
    const again = await upload(owner, material.id, { replacesId: old.id });
    expect(again.status).toBe(409);
    expect(again.body.error.fieldErrors.replacesId).toBeDefined();
  });

  it('refuses to replace a document of another material with 400 on replacesId', async () => {
    const ws = await freshWorkshop();
    const owner = ws.members.owner;
    const a = await buildMaterial(f$.h.handle.db, ws.id);
    const b = await buildMaterial(f$.h.handle.db, ws.id);
    const docOfA = (await upload(owner, a.id)).body.id as string;
    const res = await upload(owner, b.id, { replacesId: docOfA });
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.replacesId).toEqual([
      'Choose a document of the same material or lot to replace',
    ]);
  });

  it('leaves an archived document out of the list unless asked, and out of the status', async () => {
    const ws = await freshWorkshop();
    const owner = ws.members.owner;
    const material = await buildMaterial(f$.h.handle.db, ws.id);
    const doc = (await upload(owner, material.id)).body.id as string;
    expect((await post(owner, `/api/documents/${doc}/archive`)).status).toBe(200);
    const listed = async (qs: string) =>
      documentListSchema
        .parse((await get(owner, `/api/documents?materialId=${material.id}${qs}`)).body)
        .items.map((d) => d.id);
    expect(await listed('')).toEqual([]);
    expect(await listed('&includeArchived=true')).toEqual([doc]);
    const status = documentStatusSchema.parse(
      (await get(owner, `/api/materials/${material.id}/document-status`)).body,
    );
    expect(status.entries[0]?.state).toBe('missing');

    expect((await del(owner, `/api/documents/${doc}`)).status).toBe(204);
    expect(await auditActions(ws.id, doc)).toEqual(['document archive', 'document delete']);
  });
});
