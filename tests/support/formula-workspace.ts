import request from 'supertest';
import { afterAll, beforeAll, expect } from 'vitest';
import { formulaSchema, formulaVersionSchema } from '@batchproof/shared';
import { aFormula } from '../../fixtures/builders/formula-builder';
import {
  aFragrance,
  aMaterial,
  anUltramarineBlend,
} from '../../fixtures/builders/material-builder';
import { buildMaterial } from './row-builders';
import { buildWorkshop, type BuiltMember, type BuiltWorkshop } from './workshop-builder';
import { startApiHarness, TEST_JWT_SECRET, type ApiHarness } from './api-harness';
import { bearer } from './auth-header';

/** Ids of the materials every formula spec works with. */
export type FormulaMaterials = Record<'bicarb' | 'citric' | 'blue' | 'scent', string>;

/**
 * A workshop with one member per role and four materials (bicarb, citric acid, a blue mica
 * blend with ultramarines, a fragrance), plus the calls the formula specs make.
 */
export async function startFormulaWorkspace() {
  const h: ApiHarness = await startApiHarness();
  const w: BuiltWorkshop = await buildWorkshop(h.handle.db, TEST_JWT_SECRET);
  const db = h.handle.db;
  const citric = aMaterial({
    tradeName: 'Citric',
    inci: 'Citric Acid',
    category: 'acid',
    functions: ['pH adjuster'],
  });
  const m: FormulaMaterials = {
    bicarb: (await buildMaterial(db, w.id)).id,
    citric: (await buildMaterial(db, w.id, citric)).id,
    blue: (await buildMaterial(db, w.id, anUltramarineBlend())).id,
    scent: (await buildMaterial(db, w.id, aFragrance())).id,
  };
  const base = () => [
    { materialId: m.bicarb, grams: 200 },
    { materialId: m.citric, grams: 100 },
  ];
  const versionUrl = (id: string, n: number) => `/api/formulas/${id}/versions/${n}`;
  return {
    h,
    w,
    m,
    base,
    versionUrl,
    /** Creates a formula as the formulator and checks it was created. */
    async createFormula(lines = base()) {
      const res = await request(h.app)
        .post('/api/formulas')
        .set(bearer(w.members.formulator))
        .send(aFormula(lines));
      expect(res.status).toBe(201);
      return formulaSchema.parse(res.body);
    },
    async getVersion(id: string, n: number) {
      const res = await request(h.app).get(versionUrl(id, n)).set(bearer(w.members.viewer));
      return formulaVersionSchema.parse(res.body);
    },
    release(id: string, n: number, who: BuiltMember = w.members.formulator, body: object = {}) {
      return request(h.app)
        .post(`${versionUrl(id, n)}/release`)
        .set(bearer(who))
        .send(body);
    },
  };
}

/** The workspace {@link startFormulaWorkspace} builds. */
export type FormulaWorkspace = Awaited<ReturnType<typeof startFormulaWorkspace>>;

/**
 * Starts a formula workspace before a spec file's tests and closes it after them. The object
 * returned reads through to the workspace once it exists, so the file can keep it in a const.
 */
export function formulaWorkspaceForFile(): FormulaWorkspace {
  let ws: FormulaWorkspace | undefined;
  beforeAll(async () => {
    ws = await startFormulaWorkspace();
  });
  afterAll(() => ws?.h.close());
  return new Proxy({} as FormulaWorkspace, {
    get(_target, key) {
      if (!ws) throw new Error('The formula workspace starts in beforeAll; read it in a test.');
      return ws[key as keyof FormulaWorkspace];
    },
  });
}
