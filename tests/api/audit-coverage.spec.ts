import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { auditPageSchema } from '@batchproof/shared';
import { aLot } from '../../fixtures/builders/lot-builder';
import { bearer } from '../support/auth-header';
import { formulaWorkspaceForFile } from '../support/formula-workspace';

// The audit log records who changed what for goods-in and formulas too, not only production.
const ws = formulaWorkspaceForFile();

describe('the audit log covers lots and formulas', () => {
  let lotId: string;
  let formulaId: string;

  beforeAll(async () => {
    const { h, w, m } = ws;
    const lot = await request(h.app)
      .post('/api/lots')
      .set(bearer(w.members.production))
      .send(aLot(m.citric, { supplierLotNumber: 'AUD-001' }));
    expect(lot.status).toBe(201);
    lotId = lot.body.id;
    const changed = await request(h.app)
      .put(`/api/lots/${lotId}`)
      .set(bearer(w.members.production))
      .send(aLot(m.citric, { supplierLotNumber: 'AUD-001', quantity: 7 }));
    expect(changed.status).toBe(200);
    formulaId = (await ws.createFormula()).id;
    const draft = await request(h.app)
      .post(`/api/formulas/${formulaId}/versions/1/release`)
      .set(bearer(w.members.formulator))
      .send({});
    expect(draft.status).toBe(200);
    const next = await request(h.app)
      .post(`/api/formulas/${formulaId}/versions`)
      .set(bearer(w.members.formulator))
      .send({});
    expect(next.status).toBe(201);
  });

  async function actionsOn(subjectId: string) {
    const { h, w } = ws;
    const res = await request(h.app)
      .get('/api/audit-events')
      .query({ pageSize: 100 })
      .set(bearer(w.members.owner));
    expect(res.status).toBe(200);
    return auditPageSchema
      .parse(res.body)
      .items.filter((e) => e.subjectId === subjectId)
      .map((e) => [e.action, e.actorName]);
  }

  it('names who received and who changed a lot', async () => {
    const { w } = ws;
    const name = w.members.production.name;
    expect(await actionsOn(lotId)).toEqual([
      ['lot.changed', name],
      ['lot.received', name],
    ]);
  });

  it('names who created a formula, released it and started its next draft', async () => {
    const { w } = ws;
    const name = w.members.formulator.name;
    expect((await actionsOn(formulaId)).map(([a]) => a)).toEqual([
      'formula.draft-started',
      'formula.created',
    ]);
    expect((await actionsOn(formulaId))[0]![1]).toBe(name);
  });
});
