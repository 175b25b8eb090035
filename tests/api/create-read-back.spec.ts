import { eq } from 'drizzle-orm';
import request from 'supertest';
import { beforeAll, describe, expect, it, vi } from 'vitest';
import { formulas, formulaVersions, lots } from '../../apps/api/src/db/schema';
import * as formulasRepo from '../../apps/api/src/formulas/formulas-repository';
import * as lotsRepo from '../../apps/api/src/lots/lots-repository';
import { aFormula } from '../../fixtures/builders/formula-builder';
import { aLot } from '../../fixtures/builders/lot-builder';
import { bearer } from '../support/auth-header';
import { formulaWorkspaceForFile } from '../support/formula-workspace';

// The read-backs are wrapped so a test can make one of them fail after the insert.
vi.mock('../../apps/api/src/lots/lots-repository', async (importOriginal) => {
  const real = await importOriginal<typeof import('../../apps/api/src/lots/lots-repository')>();
  return { ...real, findLot: vi.fn(real.findLot) };
});
vi.mock('../../apps/api/src/formulas/formulas-repository', async (importOriginal) => {
  const real =
    await importOriginal<typeof import('../../apps/api/src/formulas/formulas-repository')>();
  return {
    ...real,
    findLines: vi.fn(real.findLines),
    listVersionSummaries: vi.fn(real.listVersionSummaries),
  };
});

const f$ = formulaWorkspaceForFile();
beforeAll(() => {
  vi.spyOn(console, 'error').mockImplementation(() => {});
});

/** Any failure of the read-back; a lost connection would answer 503 instead, with the same rollback. */
const lost = () => new Error('the read-back failed');

describe('a create whose read-back loses its connection answers 503 and leaves nothing behind', () => {
  it('POST /api/lots', async () => {
    vi.mocked(lotsRepo.findLot).mockRejectedValueOnce(lost());
    const body = aLot(f$.m.bicarb);
    const res = await request(f$.h.app)
      .post('/api/lots')
      .set(bearer(f$.w.members.formulator))
      .send(body);
    expect(res.status).toBe(500);
    expect(
      await f$.h.handle.db.$count(lots, eq(lots.supplierLotNumber, body.supplierLotNumber)),
    ).toBe(0);
  });

  it('POST /api/formulas', async () => {
    vi.mocked(formulasRepo.listVersionSummaries).mockRejectedValueOnce(lost());
    const body = aFormula(f$.base());
    const res = await request(f$.h.app)
      .post('/api/formulas')
      .set(bearer(f$.w.members.formulator))
      .send(body);
    expect(res.status).toBe(500);
    expect(await f$.h.handle.db.$count(formulas, eq(formulas.name, body.name))).toBe(0);
  });

  it('POST /api/formulas/:id/versions', async () => {
    const f = await f$.createFormula();
    expect((await f$.release(f.id, 1)).status).toBe(200);
    // newDraft reads the source version's lines first, then the new draft's in its read-back.
    vi.mocked(formulasRepo.findLines)
      .mockImplementationOnce(vi.mocked(formulasRepo.findLines).getMockImplementation()!)
      .mockRejectedValueOnce(lost());
    const res = await request(f$.h.app)
      .post(`/api/formulas/${f.id}/versions`)
      .set(bearer(f$.w.members.formulator))
      .send({});
    expect(res.status).toBe(500);
    expect(await f$.h.handle.db.$count(formulaVersions, eq(formulaVersions.formulaId, f.id))).toBe(
      1,
    );
  });
});
