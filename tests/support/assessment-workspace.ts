import request from 'supertest';
import { afterAll, beforeAll, expect } from 'vitest';
import type { AssessmentDetail, AssessmentUpdateInput, ShareRecord } from '@batchproof/shared';
import { bearer } from './auth-header';
import { startBatchWorkspace } from './batch-workspace';
import type { BuiltMember } from './workshop-builder';

/** A draft the assessor may sign: their own exposure values, Part B written, no substances. */
export const aSignableUpdate = (
  overrides: Partial<AssessmentUpdateInput> = {},
): AssessmentUpdateInput => ({
  exposure: {
    presetKey: null,
    dailyAmountGrams: 7.82,
    retentionFactor: 1,
    bodyWeightKg: 60,
    source: 'SCCS Notes of Guidance (SCCS/1647/22), Table 3A, body lotion',
  },
  substances: [],
  partB: {
    conclusion: 'The product is safe for human health when used as directed.',
    labelWarnings: 'Avoid contact with eyes.',
    reasoning: 'Every margin of safety is above 100.',
    credentials: 'MSc Toxicology; safety assessor since 2012.',
  },
  ...overrides,
});

/**
 * A batch workspace (one member per role, another workshop) with the calls the assessment specs
 * make: a released version, sharing it with the workshop's assessor, accepting, editing, signing.
 */
export async function startAssessmentWorkspace() {
  const ws = await startBatchWorkspace();
  const { h, w } = ws;
  const owner = w.members.owner;
  const assessor = w.members.assessor;
  return {
    ...ws,
    /** A fresh released formula and its version 1's id. */
    async releasedVersion() {
      const { formulaId, name } = await ws.releasedFormula();
      const res = await request(h.app)
        .get(`/api/formulas/${formulaId}/versions/1`)
        .set(bearer(owner));
      expect(res.status).toBe(200);
      return { formulaId, name, versionId: res.body.id as string };
    },
    share(versionId: string, assessorId = assessor.id, who: BuiltMember = owner) {
      return request(h.app)
        .post('/api/assessment-shares')
        .set(bearer(who))
        .send({ versionId, assessorId });
    },
    /** Shares a version with the assessor and checks it was shared. */
    async shared(versionId: string, assessorId = assessor.id): Promise<ShareRecord> {
      const res = await request(h.app)
        .post('/api/assessment-shares')
        .set(bearer(owner))
        .send({ versionId, assessorId });
      expect(res.status, JSON.stringify(res.body)).toBe(201);
      return res.body as ShareRecord;
    },
    /** The assessor accepts a share and starts the assessment; checks it started. */
    async accepted(shareId: string, who: Pick<BuiltMember, 'token'> = assessor) {
      const res = await request(h.app).post('/api/assessments').set(bearer(who)).send({ shareId });
      expect(res.status, JSON.stringify(res.body)).toBe(201);
      return res.body as AssessmentDetail;
    },
    /** A fresh released version shared with the assessor and accepted. */
    async startedAssessment() {
      const v = await this.releasedVersion();
      const share = await this.shared(v.versionId);
      return { ...v, share, assessment: await this.accepted(share.id) };
    },
    put(id: string, body: unknown, who: Pick<BuiltMember, 'token'> = assessor) {
      return request(h.app).put(`/api/assessments/${id}`).set(bearer(who)).send(body!);
    },
    sign(id: string, contentHash: string, who: Pick<BuiltMember, 'token'> = assessor) {
      return request(h.app)
        .post(`/api/assessments/${id}/sign`)
        .set(bearer(who))
        .send({ contentHash, confirm: true });
    },
    async detail(id: string, who: Pick<BuiltMember, 'token'> = assessor) {
      const res = await request(h.app).get(`/api/assessments/${id}`).set(bearer(who));
      expect(res.status, JSON.stringify(res.body)).toBe(200);
      return res.body as AssessmentDetail;
    },
  };
}

export type AssessmentWorkspace = Awaited<ReturnType<typeof startAssessmentWorkspace>>;

/** Starts an assessment workspace before a spec file's tests and closes it after them. */
export function assessmentWorkspaceForFile(): AssessmentWorkspace {
  let ws: AssessmentWorkspace | undefined;
  beforeAll(async () => {
    ws = await startAssessmentWorkspace();
  });
  afterAll(() => ws?.h.close());
  return new Proxy({} as AssessmentWorkspace, {
    get(_target, key) {
      if (!ws) throw new Error('The assessment workspace starts in beforeAll; read it in a test.');
      const value = ws[key as keyof AssessmentWorkspace];
      return typeof value === 'function' ? value.bind(ws) : value;
    },
  });
}
