import request from 'supertest';
import { vi } from 'vitest';
import { BUILT_IN_LABEL_STOCKS, ROLE_SETS, ROLES, type Role } from '@batchproof/shared';
import { pdfBytes } from '../../fixtures/builders/document-files';
import { aFormula, aDraft } from '../../fixtures/builders/formula-builder';
import { aLot } from '../../fixtures/builders/lot-builder';
import { aSheetLabelStock } from '../../fixtures/builders/label-stock-builder';
import {
  aLabelRun,
  aProductIdentity,
  aWorkshopLabelDetails,
} from '../../fixtures/builders/label-run-builder';
import { buildLot, buildMaterial, buildSupplier } from '../support/row-builders';
import { aMaterial, aSupplier } from '../../fixtures/builders/material-builder';
import type { BuiltWorkshop } from '../support/workshop-builder';
import type { ApiHarness } from '../support/api-harness';
import { bearer } from '../support/auth-header';

type Caller = Role | 'other-workshop' | 'anonymous';

/** One request of the access matrix, as the matrix in access-matrix.spec.ts runs it. */
export interface WorkspaceRequest {
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  path: string;
  body?: object | string;
  /** Content-Type to send the body with, when not JSON. */
  type?: string;
  /** A multipart upload: form fields plus one file. */
  upload?: { fields: Record<string, string>; file: Buffer; filename: string };
}

/** Expected statuses: readers (owner, formulator, production, viewer) or writers (owner, formulator). */
const expect = (
  allowed: readonly Role[],
  ok: number,
  otherWorkshop: number,
): Record<Caller, number> => ({
  ...(Object.fromEntries(ROLES.map((r) => [r, allowed.includes(r) ? ok : 403])) as Record<
    Role,
    number
  >),
  'other-workshop': otherWorkshop,
  anonymous: 401,
});
const read = (ok: number, other: number) => expect(ROLE_SETS.members, ok, other);
const write = (ok: number, other: number) => expect(ROLE_SETS.writers, ok, other);
const goodsIn = (ok: number, other: number) => expect(ROLE_SETS.goodsIn, ok, other);

/**
 * The formulator's workspace routes for the access matrix. Records belong to workshop A; each
 * destructive case builds its own record so callers never collide.
 */
export function workspaceAccessCases(ctx: () => { h: ApiHarness; a: BuiltWorkshop }) {
  const db = () => ctx().h.handle.db;
  const wid = () => ctx().a.id;
  const material = async () => (await buildMaterial(db(), wid())).id;
  const supplier = async () => (await buildSupplier(db(), wid())).id;
  const lot = async () => (await buildLot(db(), wid(), await material())).id;
  const document = async () => {
    const res = await request(ctx().h.app)
      .post('/api/documents')
      .set(bearer(ctx().a.members.owner))
      .field('kind', 'sds')
      .field('title', 'SDS')
      .field('issuedOn', '2025-01-01')
      .field('materialId', await material())
      .attach('file', pdfBytes(), 'sds.pdf');
    return res.body.id as string;
  };
  const formula = async (released = false) => {
    const { h, a } = ctx();
    const res = await request(h.app)
      .post('/api/formulas')
      .set(bearer(a.members.owner))
      .send(aFormula([{ materialId: await material(), grams: 100 }]));
    if (released) {
      await request(h.app)
        .post(`/api/formulas/${res.body.id}/versions/1/release`)
        .set(bearer(a.members.owner))
        .send({});
    }
    return res.body.id as string;
  };
  const labelStock = async () => {
    const res = await request(ctx().h.app)
      .post('/api/label-stocks')
      .set(bearer(ctx().a.members.owner))
      .send(aSheetLabelStock());
    return res.body.id as string;
  };
  const builtInStock = BUILT_IN_LABEL_STOCKS[0]!.key;
  /** A released formula of workshop A, printable: A has an address and the formula an identity. */
  const printable = async () => {
    const { h, a } = ctx();
    await request(h.app)
      .put('/api/workshop/label-details')
      .set(bearer(a.members.owner))
      .send(aWorkshopLabelDetails());
    const id = await formula(true);
    await request(h.app)
      .put(`/api/formulas/${id}/identity`)
      .set(bearer(a.members.owner))
      .send(aProductIdentity());
    return id;
  };
  /** A print run of workshop A whose PDF is made. */
  const labelRun = async () => {
    const { h, a } = ctx();
    const res = await request(h.app)
      .post('/api/label-runs')
      .set(bearer(a.members.owner))
      .send(aLabelRun(await printable()));
    const id = res.body.id as string;
    await vi.waitFor(
      async () => {
        const run = await request(h.app).get(`/api/label-runs/${id}`).set(bearer(a.members.owner));
        if (run.body.status !== 'ready') throw new Error(`run ${id} is ${run.body.status}`);
      },
      { timeout: 30_000, interval: 50 },
    );
    return id;
  };
  const csv = () => `tradeName,inci,category\nSea Salt ${Math.random()},Sodium Chloride,base\n`;

  const cases: {
    route: string;
    prepare: () => Promise<WorkspaceRequest>;
    expected: Record<Caller, number>;
  }[] = [
    {
      route: 'GET /api/attention (whatever the role may see)',
      prepare: async () => ({ method: 'get', path: '/api/attention' }),
      expected: expect(ROLES, 200, 200),
    },
    {
      route: 'GET /api/suppliers',
      prepare: async () => ({ method: 'get', path: '/api/suppliers' }),
      expected: read(200, 200),
    },
    {
      route: 'POST /api/suppliers',
      prepare: async () => ({ method: 'post', path: '/api/suppliers', body: aSupplier() }),
      expected: write(201, 201),
    },
    {
      route: 'GET /api/suppliers/:id',
      prepare: async () => ({ method: 'get', path: `/api/suppliers/${await supplier()}` }),
      expected: read(200, 404),
    },
    {
      route: 'PUT /api/suppliers/:id',
      prepare: async () => ({
        method: 'put',
        path: `/api/suppliers/${await supplier()}`,
        body: aSupplier(),
      }),
      expected: write(200, 404),
    },
    {
      route: 'DELETE /api/suppliers/:id',
      prepare: async () => ({ method: 'delete', path: `/api/suppliers/${await supplier()}` }),
      expected: write(204, 404),
    },
    {
      route: 'GET /api/materials',
      prepare: async () => ({ method: 'get', path: '/api/materials?q=bicarb&sort=tradeName' }),
      expected: read(200, 200),
    },
    {
      route: 'POST /api/materials',
      prepare: async () => ({ method: 'post', path: '/api/materials', body: aMaterial() }),
      expected: write(201, 201),
    },
    {
      route: 'GET /api/materials/:id',
      prepare: async () => ({ method: 'get', path: `/api/materials/${await material()}` }),
      expected: read(200, 404),
    },
    {
      route: 'PUT /api/materials/:id',
      prepare: async () => ({
        method: 'put',
        path: `/api/materials/${await material()}`,
        body: aMaterial(),
      }),
      expected: write(200, 404),
    },
    {
      route: 'DELETE /api/materials/:id',
      prepare: async () => ({ method: 'delete', path: `/api/materials/${await material()}` }),
      expected: write(204, 404),
    },
    {
      route: 'GET /api/materials/:id/document-status',
      prepare: async () => ({
        method: 'get',
        path: `/api/materials/${await material()}/document-status`,
      }),
      expected: read(200, 404),
    },
    {
      route: 'GET /api/materials/export.csv',
      prepare: async () => ({ method: 'get', path: '/api/materials/export.csv' }),
      expected: read(200, 200),
    },
    {
      route: 'POST /api/materials/import/preview',
      prepare: async () => ({
        method: 'post',
        path: '/api/materials/import/preview',
        body: csv(),
        type: 'text/csv',
      }),
      expected: write(200, 200),
    },
    {
      route: 'POST /api/materials/import',
      prepare: async () => ({
        method: 'post',
        path: '/api/materials/import',
        body: csv(),
        type: 'text/csv',
      }),
      expected: write(201, 201),
    },
    {
      route: 'GET /api/documents?materialId=',
      prepare: async () => ({
        method: 'get',
        path: `/api/documents?materialId=${await material()}`,
      }),
      expected: read(200, 404),
    },
    {
      route: 'POST /api/documents (on a material of workshop A)',
      prepare: async () => ({
        method: 'post',
        path: '/api/documents',
        upload: {
          fields: {
            kind: 'sds',
            title: 'SDS',
            issuedOn: '2025-01-01',
            materialId: await material(),
          },
          file: pdfBytes(),
          filename: 'sds.pdf',
        },
      }),
      expected: write(201, 400),
    },
    {
      route: 'GET /api/documents/:id',
      prepare: async () => ({ method: 'get', path: `/api/documents/${await document()}` }),
      expected: read(200, 404),
    },
    {
      route: 'GET /api/documents/:id/content',
      prepare: async () => ({ method: 'get', path: `/api/documents/${await document()}/content` }),
      expected: read(200, 404),
    },
    {
      route: 'DELETE /api/documents/:id',
      prepare: async () => ({ method: 'delete', path: `/api/documents/${await document()}` }),
      expected: write(204, 404),
    },
    {
      route: 'GET /api/lots',
      prepare: async () => ({ method: 'get', path: '/api/lots?sort=receivedOn&dir=desc' }),
      expected: read(200, 200),
    },
    {
      route: 'POST /api/lots (of a material of workshop A)',
      prepare: async () => ({ method: 'post', path: '/api/lots', body: aLot(await material()) }),
      expected: goodsIn(201, 400),
    },
    {
      route: 'GET /api/lots/:id',
      prepare: async () => ({ method: 'get', path: `/api/lots/${await lot()}` }),
      expected: read(200, 404),
    },
    {
      route: 'PUT /api/lots/:id',
      prepare: async () => {
        const m = await material();
        const l = await buildLot(db(), wid(), m);
        return { method: 'put', path: `/api/lots/${l.id}`, body: aLot(m, { quantity: 30 }) };
      },
      expected: goodsIn(200, 404),
    },
    {
      route: 'DELETE /api/lots/:id',
      prepare: async () => ({ method: 'delete', path: `/api/lots/${await lot()}` }),
      expected: write(204, 404),
    },
    {
      route: 'GET /api/formulas',
      prepare: async () => ({ method: 'get', path: '/api/formulas' }),
      expected: read(200, 200),
    },
    {
      route: 'POST /api/formulas (with a material of workshop A)',
      prepare: async () => ({
        method: 'post',
        path: '/api/formulas',
        body: aFormula([{ materialId: await material(), grams: 10 }]),
      }),
      expected: write(201, 400),
    },
    {
      route: 'GET /api/formulas/:id',
      prepare: async () => ({ method: 'get', path: `/api/formulas/${await formula()}` }),
      expected: read(200, 404),
    },
    {
      route: 'PATCH /api/formulas/:id',
      prepare: async () => ({
        method: 'patch',
        path: `/api/formulas/${await formula()}`,
        body: { name: 'Renamed', productType: 'fizzer' },
      }),
      expected: write(200, 404),
    },
    {
      route: 'GET /api/formulas/:id/compare',
      prepare: async () => ({
        method: 'get',
        path: `/api/formulas/${await formula()}/compare?from=1&to=1`,
      }),
      expected: read(200, 404),
    },
    {
      route: 'POST /api/formulas/:id/versions',
      prepare: async () => ({
        method: 'post',
        path: `/api/formulas/${await formula(true)}/versions`,
        body: {},
      }),
      expected: write(201, 404),
    },
    {
      route: 'GET /api/formulas/:id/versions/:n',
      prepare: async () => ({ method: 'get', path: `/api/formulas/${await formula()}/versions/1` }),
      expected: read(200, 404),
    },
    {
      route: 'PUT /api/formulas/:id/versions/:n',
      prepare: async () => ({
        method: 'put',
        path: `/api/formulas/${await formula()}/versions/1`,
        body: aDraft([{ materialId: await material(), grams: 50 }]),
      }),
      expected: write(200, 404),
    },
    {
      route: 'PATCH /api/formulas/:id/versions/:n',
      prepare: async () => ({
        method: 'patch',
        path: `/api/formulas/${await formula()}/versions/1`,
        body: { notes: 'n' },
      }),
      expected: write(200, 404),
    },
    {
      route: 'POST /api/formulas/:id/versions/:n/release',
      prepare: async () => ({
        method: 'post',
        path: `/api/formulas/${await formula()}/versions/1/release`,
        body: {},
      }),
      expected: write(200, 404),
    },
    {
      route: 'POST /api/formulas/:id/versions/:n/scale',
      prepare: async () => ({
        method: 'post',
        path: `/api/formulas/${await formula()}/versions/1/scale`,
        body: { totalGrams: 1000 },
      }),
      expected: read(200, 404),
    },
    {
      route: 'DELETE /api/formulas/:id (never released)',
      prepare: async () => ({ method: 'delete', path: `/api/formulas/${await formula()}` }),
      expected: write(204, 404),
    },
    {
      route: 'GET /api/label-stocks',
      prepare: async () => ({ method: 'get', path: '/api/label-stocks' }),
      expected: read(200, 200),
    },
    {
      route: 'POST /api/label-stocks',
      prepare: async () => ({
        method: 'post',
        path: '/api/label-stocks',
        body: aSheetLabelStock(),
      }),
      expected: write(201, 201),
    },
    {
      route: 'GET /api/label-stocks/:id',
      prepare: async () => ({ method: 'get', path: `/api/label-stocks/${await labelStock()}` }),
      expected: read(200, 404),
    },
    {
      route: 'GET /api/label-stocks/:id (built in: every workshop reads it)',
      prepare: async () => ({ method: 'get', path: `/api/label-stocks/${builtInStock}` }),
      expected: read(200, 200),
    },
    {
      route: 'GET /api/label-stocks/:id/calibration.pdf',
      prepare: async () => ({
        method: 'get',
        path: `/api/label-stocks/${await labelStock()}/calibration.pdf`,
      }),
      expected: read(200, 404),
    },
    {
      route: 'PUT /api/label-stocks/:id',
      prepare: async () => ({
        method: 'put',
        path: `/api/label-stocks/${await labelStock()}`,
        body: aSheetLabelStock(),
      }),
      expected: write(200, 404),
    },
    {
      route: 'PUT /api/label-stocks/:id (built in: nobody changes it)',
      prepare: async () => ({
        method: 'put',
        path: `/api/label-stocks/${builtInStock}`,
        body: aSheetLabelStock(),
      }),
      expected: write(409, 409),
    },
    {
      route: 'DELETE /api/label-stocks/:id',
      prepare: async () => ({ method: 'delete', path: `/api/label-stocks/${await labelStock()}` }),
      expected: write(204, 404),
    },
    {
      route: 'DELETE /api/label-stocks/:id (built in)',
      prepare: async () => ({ method: 'delete', path: `/api/label-stocks/${builtInStock}` }),
      expected: write(409, 409),
    },
    {
      route: 'GET /api/workshop/label-details',
      prepare: async () => ({ method: 'get', path: '/api/workshop/label-details' }),
      expected: expect(ROLES, 200, 200),
    },
    {
      route: "PUT /api/workshop/label-details (the caller's own workshop)",
      prepare: async () => ({
        method: 'put',
        path: '/api/workshop/label-details',
        body: aWorkshopLabelDetails(),
      }),
      expected: expect(ROLE_SETS.ownerOnly, 200, 200),
    },
    {
      route: 'GET /api/formulas/:id/identity',
      prepare: async () => ({ method: 'get', path: `/api/formulas/${await formula()}/identity` }),
      expected: read(200, 404),
    },
    {
      route: 'PUT /api/formulas/:id/identity',
      prepare: async () => ({
        method: 'put',
        path: `/api/formulas/${await formula()}/identity`,
        body: aProductIdentity(),
      }),
      expected: write(200, 404),
    },
    {
      route: 'GET /api/readiness',
      prepare: async () => ({ method: 'get', path: '/api/readiness' }),
      // Another workshop's owner reads their own workshop's readiness.
      expected: read(200, 200),
    },
    {
      route: 'PUT /api/readiness/:formulaId/records/:kind',
      prepare: async () => ({
        method: 'put',
        path: `/api/readiness/${await formula()}/records/eu-notification`,
        body: { reference: 'CPNP-1', recordedOn: '2026-11-30' },
      }),
      expected: write(200, 404),
    },
    {
      // Production prints from batches, which do not exist yet.
      route: 'POST /api/label-runs (a released formula of workshop A)',
      prepare: async () => ({
        method: 'post',
        path: '/api/label-runs',
        body: aLabelRun(await printable()),
      }),
      expected: write(201, 404),
    },
    {
      route: 'GET /api/label-runs',
      prepare: async () => ({ method: 'get', path: '/api/label-runs' }),
      expected: expect(ROLES, 200, 200),
    },
    {
      route: 'GET /api/label-runs/:id',
      prepare: async () => ({ method: 'get', path: `/api/label-runs/${await labelRun()}` }),
      expected: expect(ROLES, 200, 404),
    },
    {
      route: 'GET /api/label-runs/:id/pdf',
      prepare: async () => ({ method: 'get', path: `/api/label-runs/${await labelRun()}/pdf` }),
      expected: expect(ROLES, 200, 404),
    },
    {
      route: 'POST /api/label-runs/:id/withdraw',
      prepare: async () => ({
        method: 'post',
        path: `/api/label-runs/${await labelRun()}/withdraw`,
      }),
      expected: expect(ROLE_SETS.ownerOnly, 200, 404),
    },
    // Archive and unarchive: owner and formulator, like every other write to these records.
    ...(
      [
        ['materials', material],
        ['suppliers', supplier],
        ['formulas', () => formula()],
        ['documents', document],
        ['label-stocks', labelStock],
      ] as const
    ).flatMap(([feature, make]) =>
      (['archive', 'unarchive'] as const).map((action) => ({
        route: `POST /api/${feature}/:id/${action}`,
        prepare: async (): Promise<WorkspaceRequest> => ({
          method: 'post',
          path: `/api/${feature}/${await make()}/${action}`,
        }),
        expected: write(200, 404),
      })),
    ),
  ];
  return cases;
}
