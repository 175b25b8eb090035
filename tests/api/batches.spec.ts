import { and, eq, sql } from 'drizzle-orm';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { batchPageSchema, errorEnvelopeSchema } from '@batchproof/shared';
import { auditEvents, batches, lotConsumptions, workshops } from '../../apps/api/src/db/schema';
import { bearer } from '../support/auth-header';
import { batchWorkspaceForFile } from '../support/batch-workspace';
import { buildLot, buildMaterial, consumeFromLot } from '../support/row-builders';

const ws = batchWorkspaceForFile();
const refusal = (body: unknown) => errorEnvelopeSchema.parse(body).error;

describe('POST /api/batches: the weigh sheet', () => {
  it('by units of the profile unit mass with a loss allowance: grams worked by hand', async () => {
    // Bicarb 200 g + citric 100 g; 24 units × 150 g (the profile's unit mass) = 3,600 g, + 3 % = 3,708 g.
    const { formulaId, materialIds } = await ws.releasedFormula();
    const batch = await ws.started({
      formulaId,
      version: 1,
      units: 24,
      lossPercent: 3,
      madeOn: '2026-12-02',
    });
    expect(batch).toMatchObject({
      formulaId,
      version: 1,
      state: 'draft',
      madeOn: '2026-12-02',
      batchCode: '261202-TF-01-001',
      size: { units: 24, unitMassGrams: 150, targetGrams: 3600, lossPercent: 3, batchGrams: 3708 },
      sum: { batchGrams: 3708, roundedGrams: 3708, differenceGrams: 0, withinRounding: true },
      tolerancePercent: 2,
      // 12 months from 2026-12-02: best before the end of 2027-12; PAO 6 months.
      durability: {
        bestBeforeMonth: '2027-12',
        expiresOn: '2027-12-31',
        periodAfterOpeningMonths: 6,
      },
      releasedAt: null,
      amendments: [],
    });
    // 2/3 of 3,708 = 2,472 g and 1/3 = 1,236 g, both on a whole-gram scale (over 1 kg).
    expect(
      batch.lines.map((l) => [l.lineNumber, l.materialId, l.grams, l.weighGrams, l.stepGrams]),
    ).toEqual([
      [1, materialIds[0], 2472, 2472, 1],
      [2, materialIds[1], 1236, 1236, 1],
    ]);
    expect(batch.lines[0]).toMatchObject({
      usedMaterialId: materialIds[0],
      lotPicks: [],
      actualGrams: null,
      substitutes: [],
      weighing: { status: 'not-weighed' },
    });
  });

  it('by a total, or by units of a unit mass given: rounded to each line’s scale step', async () => {
    const { formulaId } = await ws.releasedFormula();
    // 1,000 g: 666.666667 g and 333.333333 g, weighed to 0.1 g as 666.7 g and 333.3 g.
    const total = await ws.started({ formulaId, version: 1, totalGrams: 1000 });
    expect(total.size).toEqual({
      units: null,
      unitMassGrams: null,
      targetGrams: 1000,
      lossPercent: 0,
      batchGrams: 1000,
    });
    expect(total.lines.map((l) => [l.grams, l.weighGrams, l.stepGrams])).toEqual([
      [666.666667, 666.7, 0.1],
      [333.333333, 333.3, 0.1],
    ]);
    expect(total.madeOn).toBe(new Date().toISOString().slice(0, 10));
    // 10 × 100 g + 10 % = 1,100 g: 733.333333 g and 366.666667 g.
    const units = await ws.started({
      formulaId,
      version: 1,
      units: 10,
      unitMass: 100,
      lossPercent: 10,
    });
    expect(units.size).toMatchObject({ units: 10, unitMassGrams: 100, batchGrams: 1100 });
    expect(units.lines.map((l) => l.weighGrams)).toEqual([733.3, 366.7]);
  });

  it('suggests the first-expiring lot with enough stock, leaving out expired and short lots', async () => {
    const { formulaId, materialIds } = await ws.releasedFormula();
    const citric = materialIds[1]!;
    await ws.lot(citric, {
      supplierLotNumber: 'LATE',
      expiresOn: '2027-06-01',
      quantity: 5,
      unit: 'kg',
    });
    const early = await ws.lot(citric, {
      supplierLotNumber: 'EARLY',
      expiresOn: '2027-02-01',
      quantity: 3,
      unit: 'kg',
    });
    await ws.lot(citric, {
      supplierLotNumber: 'GONE',
      receivedOn: '2025-01-01',
      expiresOn: '2026-11-30',
      quantity: 5,
      unit: 'kg',
    });
    const nearlyEmpty = await ws.lot(citric, {
      supplierLotNumber: 'LOW',
      expiresOn: '2027-01-01',
      quantity: 1,
      unit: 'kg',
    });
    await consumeFromLot(ws.h.handle.db, ws.w.id, nearlyEmpty.id, 0.9);
    const batch = await ws.started({
      formulaId,
      version: 1,
      units: 24,
      lossPercent: 3,
      madeOn: '2026-12-02',
    });
    const suggested = batch.lines[1]!.suggestedPicks;
    expect(suggested.status).toBe('single');
    // 1,236 g from a lot counted in kg is 1.236 kg.
    expect(suggested.picks).toEqual([
      {
        lotId: early.id,
        supplierLotNumber: 'EARLY',
        expiresOn: '2027-02-01',
        grams: 1236,
        quantity: 1.236,
        unit: 'kg',
      },
    ]);
    expect(suggested.notes.join(' ')).toMatch(/GONE expired/);
    expect(suggested.notes.join(' ')).toMatch(/LOW expires earlier but holds only 100/);
    // No bicarb lot: that line has nothing to suggest.
    expect(batch.lines[0]!.suggestedPicks).toMatchObject({
      status: 'none',
      picks: [],
      shortGrams: 2472,
    });
  });

  it('lists each line’s approved substitutes from the formula', async () => {
    const { formulaId, materialIds } = await ws.releasedFormula();
    const starch = await buildMaterial(ws.h.handle.db, ws.w.id);
    await ws.h.handle.db.execute(sql`
      insert into formula_line_substitutes (workshop_id, line_id, material_id, position)
      select l.workshop_id, l.id, ${starch.id}, 1 from formula_lines l
      join formula_versions v on v.id = l.version_id
      where v.formula_id = ${formulaId} and l.material_id = ${materialIds[0]!}`);
    const batch = await ws.started({ formulaId, version: 1, totalGrams: 300 });
    expect(batch.lines[0]!.substitutes).toEqual([
      { materialId: starch.id, materialName: starch.tradeName },
    ]);
    expect(batch.lines[1]!.substitutes).toEqual([]);
  });

  it('numbers the day’s batches 001, 002 … even when started at the same moment', async () => {
    const { formulaId } = await ws.releasedFormula([100], { productCode: 'SEQ' });
    const body = { formulaId, version: 1, totalGrams: 100, madeOn: '2026-03-04' };
    const all = await Promise.all([1, 2, 3, 4].map(() => ws.start(body)));
    expect(all.map((r) => r.status)).toEqual([201, 201, 201, 201]);
    expect(all.map((r) => r.body.batchCode as string).sort()).toEqual([
      '260304-SEQ-001',
      '260304-SEQ-002',
      '260304-SEQ-003',
      '260304-SEQ-004',
    ]);
  });

  it('records the start in the audit log', async () => {
    const { formulaId } = await ws.releasedFormula([100]);
    const batch = await ws.started({ formulaId, version: 1, totalGrams: 100 });
    const rows = await ws.h.handle.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.subjectId, batch.id), eq(auditEvents.action, 'batch.created')));
    expect(rows).toHaveLength(1);
    expect(rows[0]!.actorId).toBe(ws.w.members.production.id);
  });
});

describe('POST /api/batches: what is refused', () => {
  it('bad input: 400 with field errors', async () => {
    const { formulaId } = await ws.releasedFormula([100]);
    const cases: [object, string][] = [
      [{ formulaId, version: 1 }, 'units'],
      [{ formulaId, version: 1, units: 2, totalGrams: 100 }, 'totalGrams'],
      [{ formulaId, version: 1, units: 2.5, unitMass: 10 }, 'units'],
      [{ formulaId, version: 1, totalGrams: 100, lossPercent: 60 }, 'lossPercent'],
      [{ formulaId: 'nope', version: 1, totalGrams: 100 }, 'formulaId'],
      [{ formulaId, version: 1, totalGrams: 100, madeOn: '2026-02-30' }, 'madeOn'],
    ];
    for (const [body, field] of cases) {
      const res = await ws.start(body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(Object.keys(refusal(res.body).fieldErrors!)).toContain(field);
    }
  });

  it('units without a unit mass anywhere: 400 on unitMass', async () => {
    const { formulaId } = await ws.releasedFormula([100]);
    await ws.h.handle.db.execute(
      sql`update formula_versions set profile = profile || '{"unitMassGrams": null}' where formula_id = ${formulaId}`,
    );
    const res = await ws.start({ formulaId, version: 1, units: 5 });
    expect(res.status).toBe(400);
    expect(refusal(res.body).fieldErrors).toEqual({
      unitMass: ["Enter the unit mass, or set it on the version's product profile"],
    });
  });

  it('only the released version: a draft or a version that does not exist is 409', async () => {
    const { formulaId } = await ws.releasedFormula([100]);
    const draft = await request(ws.h.app)
      .post(`/api/formulas/${formulaId}/versions`)
      .set(bearer(ws.w.members.formulator))
      .send({});
    expect(draft.status).toBeLessThan(300);
    const fromDraft = await ws.start({ formulaId, version: 2, totalGrams: 100 });
    expect(fromDraft.status).toBe(409);
    expect(refusal(fromDraft.body).message).toMatch(
      /Version 2 .* is a draft: batches are made from the released version only \(version 1\)/,
    );
    const missing = await ws.start({ formulaId, version: 7, totalGrams: 100 });
    expect(missing.status).toBe(409);
    expect(refusal(missing.body).message).toMatch(/has no version 7/);
  });

  it('an unknown formula or another workshop’s is 404', async () => {
    const { formulaId } = await ws.releasedFormula([100]);
    expect(
      (await ws.start({ formulaId: crypto.randomUUID(), version: 1, totalGrams: 100 })).status,
    ).toBe(404);
    expect(
      (await ws.start({ formulaId, version: 1, totalGrams: 100 }, ws.other.members.owner)).status,
    ).toBe(404);
  });

  it('no product identity: 409 saying to fill it in, since the batch code needs the product code', async () => {
    const { formulaId } = await ws.releasedFormula([100], null);
    const res = await ws.start({ formulaId, version: 1, totalGrams: 100 });
    expect(res.status).toBe(409);
    expect(refusal(res.body).message).toMatch(/fill in the product identity/);
  });

  it('a pattern that cannot make the code: 409 with the problem', async () => {
    const { formulaId } = await ws.releasedFormula([100], { productCode: 'ABCDEFGHIJKLMNOPQRST' });
    const res = await ws.start({ formulaId, version: 1, totalGrams: 100 });
    expect(res.status).toBe(409);
    expect(refusal(res.body).message).toMatch(/The batch code would have 31 characters/);
  });
});

/** A draft of a one-line formula, weighed from `lot` and recorded. */
async function recordedDraft(grams: number, lotQuantity = 1000) {
  const { formulaId, materialIds } = await ws.releasedFormula([100]);
  const lot = await ws.lot(materialIds[0]!, { quantity: lotQuantity });
  const batch = await ws.started({ formulaId, version: 1, totalGrams: grams });
  const put = await ws.record(batch.id, {
    lines: [{ lineNumber: 1, lotPicks: [{ lotId: lot.id, grams }], actualGrams: grams }],
    mould: { name: 'Sphere 6 cm', unitsMade: 4 },
    timing: { hoursInMould: 30, curingDays: 2 },
  });
  expect(put.status, JSON.stringify(put.body)).toBe(200);
  return { formulaId, materialIds, lot, batch };
}

describe('PUT /api/batches/:id: the record', () => {
  it('stores weights, lots, conditions and checks; weighing at the tolerance; unit weights against 150 g', async () => {
    const { formulaId, materialIds } = await ws.releasedFormula();
    const bicarb = await ws.lot(materialIds[0]!, {
      supplierLotNumber: 'B1',
      quantity: 2,
      unit: 'kg',
    });
    const citric = await ws.lot(materialIds[1]!, { supplierLotNumber: 'C1' });
    const batch = await ws.started({
      formulaId,
      version: 1,
      totalGrams: 600,
      madeOn: '2026-12-02',
    });
    // Targets 400 g and 200 g; at ±2 %, 408 g is inside and 205 g (2.5 %) is out.
    const res = await ws.record(batch.id, {
      lines: [
        { lineNumber: 1, lotPicks: [{ lotId: bicarb.id, grams: 408 }], actualGrams: 408 },
        { lineNumber: 2, lotPicks: [{ lotId: citric.id, grams: 205 }], actualGrams: 205 },
      ],
      conditions: { roomTemperatureC: 19.5, humidityPercent: 48 },
      mould: { name: 'Sphere 6 cm', unitsMade: 4 },
      timing: { hoursInMould: 30, curingDays: 2 },
      checks: { appearance: { result: 'pass' }, unitWeightsGrams: [152, 149, 151] },
      notes: 'Fizzed well',
    });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const read = await ws.read(batch.id);
    expect(read.lines.map((l) => l.weighing)).toEqual([
      { status: 'ok', deviationPercent: 2, message: null },
      expect.objectContaining({ status: 'out', deviationPercent: 2.5 }),
    ]);
    // 408 g from a lot counted in kg is 0.408 kg.
    expect(read.lines[0]!.lotPicks).toEqual([
      {
        lotId: bicarb.id,
        supplierLotNumber: 'B1',
        expiresOn: '2027-05-01',
        grams: 408,
        quantity: 0.408,
        unit: 'kg',
      },
    ]);
    expect(read.conditions).toEqual({ roomTemperatureC: 19.5, humidityPercent: 48 });
    // 30 h in the mould counts as 2 days, then 2 days' cure: 2026-12-06.
    expect(read.timing).toEqual({ hoursInMould: 30, curingDays: 2, readyOn: '2026-12-06' });
    // Average 150.67 g is not below 150 g, but unit 2 is (16 CFR 500.25(c)).
    expect(read.checks.unitWeight).toMatchObject({ status: 'light-units', averageGrams: 150.67 });
    expect(read.checks.appearance).toEqual({ result: 'pass', note: null });
    expect(read.notes).toBe('Fizzed well');
    const [row] = await ws.h.handle.db.select().from(batches).where(eq(batches.id, batch.id));
    expect(row).toMatchObject({ readyOn: '2026-12-06', unitsMade: 4 });
    const list = await request(ws.h.app)
      .get(`/api/batches?formulaId=${formulaId}`)
      .set(bearer(ws.w.members.viewer));
    expect(batchPageSchema.parse(list.body).items).toEqual([
      expect.objectContaining({
        id: batch.id,
        outOfTolerance: 1,
        readyOn: '2026-12-06',
        unitsMade: 4,
      }),
    ]);
  });

  it('a material that is not the line’s own nor an approved substitute: 400 on usedMaterialId', async () => {
    const { batch } = await recordedDraft(100);
    const stranger = await buildMaterial(ws.h.handle.db, ws.w.id);
    const res = await ws.record(batch.id, {
      lines: [{ lineNumber: 1, usedMaterialId: stranger.id }],
    });
    expect(res.status).toBe(400);
    expect(refusal(res.body).fieldErrors!['lines.0.usedMaterialId']![0]).toMatch(
      /has no approved substitutes/,
    );
  });

  it('a lot of another material or another workshop: 400 on lotPicks', async () => {
    const { batch } = await recordedDraft(100);
    const { materialIds } = await ws.releasedFormula([100]);
    const wrong = await ws.lot(materialIds[0]!, { supplierLotNumber: 'WRONG' });
    const res = await ws.record(batch.id, {
      lines: [{ lineNumber: 1, lotPicks: [{ lotId: wrong.id, grams: 100 }], actualGrams: 100 }],
    });
    expect(res.status).toBe(400);
    expect(refusal(res.body).fieldErrors!['lines.0.lotPicks']![0]).toMatch(
      /Lot WRONG is not a lot of/,
    );
    const theirs = await buildMaterial(ws.h.handle.db, ws.other.id);
    const theirLot = await buildLot(ws.h.handle.db, ws.other.id, theirs.id);
    const foreign = await ws.record(batch.id, {
      lines: [{ lineNumber: 1, lotPicks: [{ lotId: theirLot.id, grams: 100 }], actualGrams: 100 }],
    });
    expect(foreign.status).toBe(400);
    expect(Object.keys(refusal(foreign.body).fieldErrors!)).toEqual(['lines.0.lotPicks']);
  });

  it('bad input: 400 with field errors (line not on the sheet, lots not adding up, pH 15)', async () => {
    const { batch, lot } = await recordedDraft(100);
    const res = await ws.record(batch.id, {
      lines: [{ lineNumber: 1, lotPicks: [{ lotId: lot.id, grams: 90 }], actualGrams: 100 }],
      checks: { ph: 15 },
    });
    expect(res.status).toBe(400);
    expect(Object.keys(refusal(res.body).fieldErrors!).sort()).toEqual([
      'checks.ph',
      'lines.0.lotPicks',
    ]);
    const off = await ws.record(batch.id, { lines: [{ lineNumber: 9 }] });
    expect(off.status).toBe(400);
    expect(refusal(off.body).fieldErrors).toEqual({
      'lines.0.lineNumber': ['The weigh sheet has no line 9'],
    });
  });
});

describe('POST /api/batches/:id/release', () => {
  it('takes the stock in the lot’s unit, marks the batch released and keeps it as released', async () => {
    const { formulaId, materialIds } = await ws.releasedFormula([100]);
    const lot = await ws.lot(materialIds[0]!, { quantity: 2, unit: 'kg', supplierLotNumber: 'KG' });
    const batch = await ws.started({ formulaId, version: 1, totalGrams: 250 });
    expect(
      (
        await ws.record(batch.id, {
          lines: [{ lineNumber: 1, lotPicks: [{ lotId: lot.id, grams: 250 }], actualGrams: 250 }],
        })
      ).status,
    ).toBe(200);
    const res = await ws.releaseBatch(batch.id, ws.w.members.owner);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body).toMatchObject({ state: 'released', releasedBy: ws.w.members.owner.name });
    expect(res.body.releasedAt).toEqual(expect.any(String));
    // 250 g of a 2 kg lot: 1.75 kg left.
    expect(await ws.stockOf(lot.id)).toBe(1.75);
    const moves = await ws.h.handle.db
      .select()
      .from(lotConsumptions)
      .where(eq(lotConsumptions.batchId, batch.id));
    expect(moves).toEqual([
      expect.objectContaining({
        lotId: lot.id,
        kind: 'batch',
        lineNumber: 1,
        grams: 250,
        quantity: 0.25,
      }),
    ]);
    const audit = await ws.h.handle.db
      .select({ action: auditEvents.action })
      .from(auditEvents)
      .where(eq(auditEvents.subjectId, batch.id));
    expect(audit.map((a) => a.action).sort()).toEqual([
      'batch.created',
      'batch.recorded',
      'batch.released',
    ]);
  });

  it('a released batch is not changed by PUT, DELETE, a second release, nor a direct SQL update', async () => {
    const { batch } = await recordedDraft(100);
    expect((await ws.releaseBatch(batch.id)).status).toBe(200);
    const put = await ws.record(batch.id, { notes: 'changed' });
    expect(put.status).toBe(409);
    expect(refusal(put.body)).toMatchObject({
      code: 'record_released',
      message: expect.stringMatching(/amendment/),
    });
    const del = await request(ws.h.app)
      .delete(`/api/batches/${batch.id}`)
      .set(bearer(ws.w.members.owner));
    expect(del.status).toBe(409);
    expect(refusal(del.body).code).toBe('record_released');
    const again = await ws.releaseBatch(batch.id);
    expect(again.status).toBe(409);
    expect(refusal(again.body).code).toBe('record_released');
    await expect(
      ws.h.handle.db.update(batches).set({ batchCode: 'CHANGED' }).where(eq(batches.id, batch.id)),
    ).rejects.toThrow();
    await expect(
      ws.h.handle.db.execute(sql`update batches set record = '{}'::jsonb where id = ${batch.id}`),
    ).rejects.toThrow();
    const read = await ws.read(batch.id);
    expect(read).toMatchObject({
      batchCode: batch.batchCode,
      state: 'released',
      lines: [expect.objectContaining({ actualGrams: 100 })],
    });
  });

  it('a line not weighed or not covered by its lots: 409 batch_not_ready naming each line', async () => {
    const { formulaId, materialIds } = await ws.releasedFormula();
    const lot = await ws.lot(materialIds[0]!);
    const batch = await ws.started({ formulaId, version: 1, totalGrams: 300 });
    expect(
      (
        await ws.record(batch.id, {
          lines: [{ lineNumber: 1, actualGrams: 200 }],
        })
      ).status,
    ).toBe(200);
    const res = await ws.releaseBatch(batch.id);
    expect(res.status).toBe(409);
    const error = refusal(res.body);
    expect(error.code).toBe('batch_not_ready');
    expect(Object.keys(error.fieldErrors!).sort()).toEqual([
      'lines.0.lotPicks',
      'lines.1.actualGrams',
    ]);
    expect(error.fieldErrors!['lines.0.lotPicks']![0]).toMatch(
      /choose the lots the 200 g came from/,
    );
    void lot;
    expect((await ws.read(batch.id)).state).toBe('draft');
  });

  it('more than a lot holds: 409 stock_short saying what is on hand, and nothing is taken', async () => {
    const { batch, lot } = await recordedDraft(150, 1000);
    await consumeFromLot(ws.h.handle.db, ws.w.id, lot.id, 880);
    const res = await ws.releaseBatch(batch.id);
    expect(res.status).toBe(409);
    const error = refusal(res.body);
    expect(error.code).toBe('stock_short');
    expect(error.fieldErrors).toEqual({
      'lines.0.lotPicks': [
        `Lot ${lot.supplierLotNumber} has only 120 g on hand; this batch needs 150 g`,
      ],
    });
    expect(await ws.stockOf(lot.id)).toBe(120);
    expect((await ws.read(batch.id)).state).toBe('draft');
  });
});

describe('GET /api/batches: the list', () => {
  it('filters by state, formula, search and the day still curing; sorts by code', async () => {
    const { formulaId, name } = await ws.releasedFormula([100], { productCode: 'LST' });
    const a = await recordedOn(formulaId, '2026-05-01', 2);
    const b = await recordedOn(formulaId, '2026-05-02', 10);
    expect((await ws.releaseBatch(a)).status).toBe(200);
    const list = async (query: string) => {
      const res = await request(ws.h.app)
        .get(`/api/batches?formulaId=${formulaId}&${query}`)
        .set(bearer(ws.w.members.viewer));
      expect(res.status).toBe(200);
      return batchPageSchema.parse(res.body);
    };
    expect((await list('sort=batchCode&dir=asc')).items.map((i) => i.id)).toEqual([a, b]);
    expect((await list('sort=batchCode&dir=desc')).items.map((i) => i.id)).toEqual([b, a]);
    expect((await list('state=released')).items.map((i) => i.id)).toEqual([a]);
    // Ready on 2026-05-04 (a) and 2026-05-13 (b): on 2026-05-05 only b is curing.
    expect((await list('curingOn=2026-05-05')).items.map((i) => i.id)).toEqual([b]);
    expect((await list('q=260502-LST')).items.map((i) => i.id)).toEqual([b]);
    const byName = await list(`q=${encodeURIComponent(name.slice(-6))}`);
    expect(byName.total).toBe(2);
    expect(byName.items[0]).toMatchObject({ formulaName: name, version: 1 });
    const bad = await request(ws.h.app)
      .get('/api/batches?state=lost')
      .set(bearer(ws.w.members.viewer));
    expect(bad.status).toBe(400);
  });

  it('shows no other workshop’s batches', async () => {
    const res = await request(ws.h.app).get('/api/batches').set(bearer(ws.other.members.owner));
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ items: [], total: 0 });
  });
});

async function recordedOn(formulaId: string, madeOn: string, curingDays: number) {
  const batch = await ws.started({ formulaId, version: 1, totalGrams: 100, madeOn });
  const lot = await ws.lot(batch.lines[0]!.materialId);
  const put = await ws.record(batch.id, {
    lines: [{ lineNumber: 1, lotPicks: [{ lotId: lot.id, grams: 100 }], actualGrams: 100 }],
    timing: { hoursInMould: 24, curingDays },
  });
  expect(put.status).toBe(200);
  return batch.id;
}

describe('DELETE /api/batches/:id', () => {
  it('deletes a draft and logs it; then it is 404', async () => {
    const { batch } = await recordedDraft(100);
    const del = await request(ws.h.app)
      .delete(`/api/batches/${batch.id}`)
      .set(bearer(ws.w.members.production));
    expect(del.status).toBe(204);
    expect(
      (await request(ws.h.app).get(`/api/batches/${batch.id}`).set(bearer(ws.w.members.owner)))
        .status,
    ).toBe(404);
    const audit = await ws.h.handle.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.subjectId, batch.id), eq(auditEvents.action, 'batch.deleted')));
    expect(audit).toHaveLength(1);
  });
});

describe('the workshop’s tolerance', () => {
  it('a batch keeps the tolerance it was started with', async () => {
    const { formulaId } = await ws.releasedFormula([100]);
    await ws.h.handle.db
      .update(workshops)
      .set({ weighingTolerancePercent: 5 })
      .where(eq(workshops.id, ws.w.id));
    try {
      const batch = await ws.started({ formulaId, version: 1, totalGrams: 100 });
      expect(batch.tolerancePercent).toBe(5);
    } finally {
      await ws.h.handle.db
        .update(workshops)
        .set({ weighingTolerancePercent: 2 })
        .where(eq(workshops.id, ws.w.id));
    }
  });
});
