import { eq, inArray } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { errorEnvelopeSchema } from '@batchproof/shared';
import { batches, lotConsumptions } from '../../apps/api/src/db/schema';
import { batchWorkspaceForFile } from '../support/batch-workspace';

const ws = batchWorkspaceForFile();

/** A recorded draft of 60 g of the one-line formula, weighed from the lots given, made through the API. */
async function draftFrom(formulaId: string, picks: { lotId: string; grams: number }[]) {
  const batch = await ws.started({ formulaId, version: 1, totalGrams: 60, madeOn: '2026-07-01' });
  const put = await ws.record(batch.id, {
    lines: [{ lineNumber: 1, lotPicks: picks, actualGrams: 60 }],
  });
  expect(put.status, JSON.stringify(put.body)).toBe(200);
  return batch.id;
}

let copies = 0;
/**
 * A copy of a recorded draft with other lot picks, inserted straight into the table: the rounds
 * of a race need many drafts, and only their release is under test.
 */
async function copyOf(templateId: string, picks: { lotId: string; grams: number }[]) {
  const db = ws.h.handle.db;
  const [template] = await db.select().from(batches).where(eq(batches.id, templateId));
  const { id: _id, createdAt: _c, updatedAt: _u, ...row } = template!;
  copies += 1;
  const [copy] = await db
    .insert(batches)
    .values({
      ...row,
      batchCode: `${row.batchCode}-C${copies}`,
      sequence: row.sequence + copies,
      record: { ...row.record, lines: [{ ...row.record.lines[0]!, lotPicks: picks }] },
    })
    .returning({ id: batches.id });
  return copy!.id;
}

/** Stock on hand of a lot straight from the table: received minus every movement. */
async function stockInTable(lotId: string) {
  const { rows } = await ws.h.handle.pool.query<{ stock: string }>(
    `select l.quantity - coalesce((select sum(c.quantity) from lot_consumptions c where c.lot_id = l.id), 0) as stock
     from lots l where l.id = $1`,
    [lotId],
  );
  return Number(rows[0]!.stock);
}

describe('two releases competing for the last stock of a lot', () => {
  it('exactly one wins, the other is 409 stock_short, and stock never goes below zero (50 rounds)', async () => {
    const { formulaId, materialIds } = await ws.releasedFormula([100], { productCode: 'RACE' });
    const spare = await ws.lot(materialIds[0]!, { quantity: 100 });
    const template = await draftFrom(formulaId, [{ lotId: spare.id, grams: 60 }]);
    for (let round = 1; round <= 50; round++) {
      // 100 g on hand; each batch takes 60 g: either fits alone, both together do not.
      const lot = await ws.lot(materialIds[0]!, { quantity: 100, supplierLotNumber: `R${round}` });
      const first = await copyOf(template, [{ lotId: lot.id, grams: 60 }]);
      const second = await copyOf(template, [{ lotId: lot.id, grams: 60 }]);
      // Each request runs its transaction on its own pooled connection.
      const answers = await Promise.all([ws.releaseBatch(first), ws.releaseBatch(second)]);
      const statuses = answers.map((a) => a.status).sort();
      expect(statuses, `round ${round}`).toEqual([200, 409]);
      const loser = answers.find((a) => a.status === 409)!;
      expect(errorEnvelopeSchema.parse(loser.body).error).toMatchObject({
        code: 'stock_short',
        fieldErrors: {
          'lines.0.lotPicks': [`Lot R${round} has only 40 g on hand; this batch needs 60 g`],
        },
      });
      expect(await stockInTable(lot.id), `round ${round}`).toBe(40);
      const moves = await ws.h.handle.db
        .select()
        .from(lotConsumptions)
        .where(eq(lotConsumptions.lotId, lot.id));
      expect(moves.map((m) => [m.kind, m.quantity, m.grams])).toEqual([['batch', 60, 60]]);
      const states = await ws.h.handle.db
        .select({ state: batches.state })
        .from(batches)
        .where(inArray(batches.id, [first, second]));
      expect(states.map((b) => b.state).sort()).toEqual(['draft', 'released']);
    }
    const { rows } = await ws.h.handle.pool.query<{ n: string }>(
      `select count(*) as n from lots l where l.workshop_id = $1 and l.quantity <
         coalesce((select sum(c.quantity) from lot_consumptions c where c.lot_id = l.id), 0)`,
      [ws.w.id],
    );
    expect(Number(rows[0]!.n)).toBe(0);
    // A guard against a hang on a loaded machine, not a timing target.
  }, 180_000);

  it('two batches picking the same two lots in opposite order both release: locks in id order never deadlock', async () => {
    const { formulaId, materialIds } = await ws.releasedFormula([100], { productCode: 'ORDER' });
    const spare = await ws.lot(materialIds[0]!, { quantity: 100 });
    const template = await draftFrom(formulaId, [{ lotId: spare.id, grams: 60 }]);
    for (let round = 1; round <= 10; round++) {
      const a = await ws.lot(materialIds[0]!, { quantity: 100 });
      const b = await ws.lot(materialIds[0]!, { quantity: 100 });
      const one = await copyOf(template, [
        { lotId: a.id, grams: 30 },
        { lotId: b.id, grams: 30 },
      ]);
      const two = await copyOf(template, [
        { lotId: b.id, grams: 30 },
        { lotId: a.id, grams: 30 },
      ]);
      const answers = await Promise.all([ws.releaseBatch(one), ws.releaseBatch(two)]);
      expect(answers.map((r) => r.status)).toEqual([200, 200]);
      expect([await stockInTable(a.id), await stockInTable(b.id)]).toEqual([40, 40]);
    }
  }, 120_000);

  it('the same batch released twice at once: one release, one 409 record_released, stock taken once', async () => {
    const { formulaId, materialIds } = await ws.releasedFormula([100], { productCode: 'TWICE' });
    const lot = await ws.lot(materialIds[0]!, { quantity: 500 });
    const id = await draftFrom(formulaId, [{ lotId: lot.id, grams: 60 }]);
    const answers = await Promise.all([ws.releaseBatch(id), ws.releaseBatch(id)]);
    expect(answers.map((r) => r.status).sort()).toEqual([200, 409]);
    expect(errorEnvelopeSchema.parse(answers.find((r) => r.status === 409)!.body).error.code).toBe(
      'record_released',
    );
    const { rows } = await ws.h.handle.pool.query<{ n: string }>(
      'select count(*) as n from lot_consumptions where batch_id = $1',
      [id],
    );
    expect(Number(rows[0]!.n)).toBe(1);
  });
});
