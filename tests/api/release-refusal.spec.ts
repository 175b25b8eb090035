import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { errorEnvelopeSchema } from '@batchproof/shared';
import { aMaterial, anUltramarineBlend } from '../../fixtures/builders/material-builder';
import { buildMaterial } from '../support/row-builders';
import { bearer } from '../support/auth-header';
import { formulaWorkspaceForFile } from '../support/formula-workspace';

const f$ = formulaWorkspaceForFile();

/**
 * A formula saved while its colourant was a plain mica, after which the material record changed
 * to a blend with ultramarines: the draft's stored check has no block, the fresh one at release
 * has one.
 */
async function draftThatBecameBlocked() {
  const plain = aMaterial({
    tradeName: 'Shimmer',
    inci: 'Mica',
    category: 'colourant',
    functions: ['colorant'],
  });
  const colourant = await buildMaterial(f$.h.handle.db, f$.w.id, plain);
  const f = await f$.createFormula([...f$.base(), { materialId: colourant.id, grams: 2 }]);
  expect((await f$.getVersion(f.id, 1)).counts?.block).toBe(0);
  const changed = await request(f$.h.app)
    .put(`/api/materials/${colourant.id}`)
    .set(bearer(f$.w.members.formulator))
    .send(anUltramarineBlend({ tradeName: 'Shimmer' }));
  expect(changed.status).toBe(200);
  return f;
}

describe('POST /api/formulas/:id/versions/:n/release refused', () => {
  it('responds 409 release_blocked with the blocking findings in the envelope', async () => {
    const f = await draftThatBecameBlocked();
    const res = await f$.release(f.id, 1);
    expect(res.status).toBe(409);
    const { error } = errorEnvelopeSchema.parse(res.body);
    expect(error.code).toBe('release_blocked');
    expect(error.findings?.length).toBeGreaterThan(0);
    expect(error.findings!.every((x) => x.severity === 'block')).toBe(true);
    // 21 CFR 73.2725: ultramarines are listed for externally applied cosmetics only, not the bath
    expect(error.findings).toContainEqual(expect.objectContaining({ market: 'US' }));
  });

  it('stores the fresh evaluation on the version although the release was refused', async () => {
    const f = await draftThatBecameBlocked();
    const res = await f$.release(f.id, 1);
    const { error } = errorEnvelopeSchema.parse(res.body);
    const stored = await f$.getVersion(f.id, 1);
    expect(stored.state).toBe('draft');
    expect(stored.counts?.block).toBe(error.findings!.length);
    const storedBlocks = stored.evaluation!.findings.filter((x) => x.severity === 'block');
    expect(storedBlocks).toEqual(error.findings);
  });

  it('the formulator’s override is refused with 403, and the fresh evaluation is stored too', async () => {
    const f = await draftThatBecameBlocked();
    const res = await f$.release(f.id, 1, f$.w.members.formulator, {
      override: { reason: 'Assessor approved the exception in writing' },
    });
    expect(res.status).toBe(403);
    expect((await f$.getVersion(f.id, 1)).counts?.block).toBeGreaterThan(0);
  });

  it('a version that cannot be checked is refused with 409 conflict and no findings', async () => {
    const f = await f$.createFormula();
    await request(f$.h.app)
      .patch(f$.versionUrl(f.id, 1))
      .set(bearer(f$.w.members.formulator))
      .send({ lines: [] });
    const res = await f$.release(f.id, 1);
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('conflict');
    expect(res.body.error.findings).toBeUndefined();
  });
});
