import request from 'supertest';
import { afterAll, beforeAll, expect } from 'vitest';
import {
  batchSchema,
  type Batch,
  type BatchCreate,
  type BatchRecordInput,
  type LotCreate,
  type ProductIdentityInput,
} from '@batchproof/shared';
import { aProductIdentity } from '../../fixtures/builders/label-run-builder';
import { aMaterial } from '../../fixtures/builders/material-builder';
import { bearer } from './auth-header';
import { startFormulaWorkspace } from './formula-workspace';
import { buildLot, buildMaterial } from './row-builders';
import { buildWorkshop, type BuiltMember } from './workshop-builder';
import { TEST_JWT_SECRET } from './api-harness';

const citric = () =>
  aMaterial({
    tradeName: `Citric ${crypto.randomUUID().slice(0, 6)}`,
    inci: 'Citric Acid',
    category: 'acid',
    functions: ['pH adjuster'],
  });

/**
 * A formula workspace (one member per role) with another workshop, and the calls the batch specs
 * make: released formulas of fresh materials (so each test's lots are its own), lots, and the
 * batch routes.
 */
export async function startBatchWorkspace() {
  const ws = await startFormulaWorkspace();
  const { h, w } = ws;
  const db = h.handle.db;
  const other = await buildWorkshop(db, TEST_JWT_SECRET, { roles: ['owner'] });
  const owner = w.members.owner;
  return {
    ...ws,
    other,
    /**
     * A formula released as version 1 with one fresh material per line (bicarb, then citric
     * acid, then bicarb again), and a product identity (code TF-01, 12 months, PAO 6) unless null.
     */
    async releasedFormula(
      grams: number[] = [200, 100],
      identity: Partial<ProductIdentityInput> | null = {},
    ) {
      const materialIds: string[] = [];
      for (const [i] of grams.entries())
        materialIds.push((await buildMaterial(db, w.id, i % 2 === 1 ? citric() : aMaterial())).id);
      const formula = await ws.createFormula(
        grams.map((g, i) => ({ materialId: materialIds[i]!, grams: g })),
      );
      expect((await ws.release(formula.id, 1)).status).toBe(200);
      if (identity) {
        const put = await request(h.app)
          .put(`/api/formulas/${formula.id}/identity`)
          .set(bearer(owner))
          .send(aProductIdentity(identity));
        expect(put.status, JSON.stringify(put.body)).toBe(200);
      }
      return { formulaId: formula.id, name: formula.name, materialIds };
    },
    /** A lot of a material in this workshop (grams unless the overrides say otherwise). */
    lot(materialId: string, overrides: Partial<LotCreate> = {}) {
      return buildLot(db, w.id, materialId, { unit: 'g', quantity: 1000, ...overrides });
    },
    start(body: Partial<BatchCreate>, who: BuiltMember = w.members.production) {
      return request(h.app).post('/api/batches').set(bearer(who)).send(body);
    },
    /** Starts a batch and checks it was created. */
    async started(body: Partial<BatchCreate>, who: BuiltMember = w.members.production) {
      const res = await request(h.app).post('/api/batches').set(bearer(who)).send(body);
      expect(res.status, JSON.stringify(res.body)).toBe(201);
      return batchSchema.parse(res.body);
    },
    record(id: string, body: BatchRecordInput | object, who: BuiltMember = w.members.production) {
      return request(h.app).put(`/api/batches/${id}`).set(bearer(who)).send(body);
    },
    releaseBatch(id: string, who: BuiltMember = w.members.formulator) {
      return request(h.app).post(`/api/batches/${id}/release`).set(bearer(who)).send({});
    },
    async read(id: string, who: BuiltMember = w.members.viewer): Promise<Batch> {
      const res = await request(h.app).get(`/api/batches/${id}`).set(bearer(who));
      expect(res.status).toBe(200);
      return batchSchema.parse(res.body);
    },
    async stockOf(lotId: string) {
      const res = await request(h.app).get(`/api/lots/${lotId}`).set(bearer(owner));
      return res.body.stockOnHand as number;
    },
  };
}

export type BatchWorkspace = Awaited<ReturnType<typeof startBatchWorkspace>>;

/** Starts a batch workspace before a spec file's tests and closes it after them. */
export function batchWorkspaceForFile(): BatchWorkspace {
  let ws: BatchWorkspace | undefined;
  beforeAll(async () => {
    ws = await startBatchWorkspace();
  });
  afterAll(() => ws?.h.close());
  return new Proxy({} as BatchWorkspace, {
    get(_target, key) {
      if (!ws) throw new Error('The batch workspace starts in beforeAll; read it in a test.');
      return ws[key as keyof BatchWorkspace];
    },
  });
}
