import { and, count, eq, inArray } from 'drizzle-orm';
import {
  addDays,
  batchCreateSchema,
  batchRecordInputSchema,
  customerCreateSchema,
  deliveryCreateSchema,
  lotCreateSchema,
  recallCloseSchema,
  recallCreateSchema,
  todayIso,
  type Batch,
  type BatchLine,
} from '@batchproof/shared';
import { recordAudit } from '../audit/audit-log';
import type { AuthUser } from '../auth/authenticate';
import { createBatch, recordBatch, releaseBatch } from '../batches/batches-domain';
import type { Database } from '../db/database';
import { auditEvents, formulas, lots, materials } from '../db/schema';
import { createCustomer } from '../deliveries/customers-domain';
import { createDelivery } from '../deliveries/deliveries-domain';
import { insertLot } from '../lots/lots-repository';
import type { Mailer } from '../mail/mailer';
import { closeRecall, openRecall } from '../recalls/recalls-domain';
import { sendNotices } from '../recalls/recall-notices';
import { demoMaterials, type DemoMaterialKey } from './hollowmere-materials';
import {
  demoBatches,
  demoCustomers,
  demoEarlierLots,
  demoRecallDrill,
  type DemoBatch,
} from './hollowmere-production';

/** Audit action that marks the demo production history as seeded, so it is never seeded twice. */
const SEEDED = 'demo.production-seeded';

/** A drill writes its notices without sending them: a mailer that is never called. */
const drillMailer: Mailer = {
  send: () => Promise.reject(new Error('A drill sends nothing')),
  close: () => undefined,
};

/**
 * Seeds the demo workshop's production history once, after its workspace and labels: earlier
 * goods-in, customers, about five months of batches made, weighed, checked and released through the
 * same domain code as the API (so stock is drawn exactly as a maker's release draws it), deliveries
 * of the finished lots, and one finished recall drill on the earlier citric acid lot. The newest
 * batch is still curing and the last one waits for release. Does nothing when the marker exists or
 * when the demo formulas are not there (a workshop with data of its own).
 */
export async function seedDemoProduction(
  db: Database,
  actor: AuthUser,
  now = new Date(),
): Promise<'seeded' | 'already-seeded'> {
  const { workshopId } = actor;
  const today = todayIso(now);
  return db.transaction(async (tx) => {
    await tx.execute('select pg_advisory_xact_lock(4242002)');
    const [marker] = await tx
      .select({ n: count() })
      .from(auditEvents)
      .where(and(eq(auditEvents.workshopId, workshopId), eq(auditEvents.action, SEEDED)));
    if (marker!.n > 0) return 'already-seeded';
    const names = [...new Set(demoBatches.map((b) => b.formula))];
    const formulaRows = await tx
      .select({ id: formulas.id, name: formulas.name })
      .from(formulas)
      .where(and(eq(formulas.workshopId, workshopId), inArray(formulas.name, names)));
    const mark = (detail: Record<string, unknown>) =>
      recordAudit(tx, actor, {
        action: SEEDED,
        subjectType: 'workshop',
        subjectId: workshopId,
        detail,
      });
    if (formulaRows.length < names.length) {
      await mark({ skipped: 'the demo formulas are not in this workshop' });
      return 'already-seeded';
    }
    const formulaIds = Object.fromEntries(formulaRows.map((f) => [f.name, f.id]));
    try {
      // A savepoint: a history that cannot be made here (a demo seeded by an older version, whose
      // materials lack what a batch needs) is skipped whole, and the app still starts.
      const detail = await tx.transaction((inner) => seedHistory(inner, actor, formulaIds, today));
      await mark(detail);
    } catch (error) {
      await mark({ skipped: error instanceof Error ? error.message : String(error) });
    }
    return 'seeded';
  });
}

/** The history itself, inside the seed's savepoint. */
async function seedHistory(
  tx: Database,
  actor: AuthUser,
  formulaIds: Record<string, string>,
  today: string,
) {
  const { workshopId } = actor;

  const materialRows = await tx
    .select({ id: materials.id, tradeName: materials.tradeName })
    .from(materials)
    .where(eq(materials.workshopId, workshopId));
  const materialIds = new Map(materialRows.map((m) => [m.tradeName, m.id]));
  const materialId = (key: DemoMaterialKey) => materialIds.get(demoMaterials[key].tradeName)!;
  for (const { material, daysAgo, shelfDays, ...l } of demoEarlierLots) {
    const receivedOn = addDays(today, -daysAgo);
    const expiresOn = shelfDays === null ? null : addDays(receivedOn, shelfDays);
    await insertLot(
      tx,
      workshopId,
      lotCreateSchema.parse({ ...l, materialId: materialId(material), receivedOn, expiresOn }),
    );
  }

  const customerIds: string[] = [];
  for (const c of demoCustomers)
    customerIds.push((await createCustomer(tx, actor, customerCreateSchema.parse(c))).id);

  let delivery = 0;
  const made: Batch[] = [];
  for (const [n, plan] of demoBatches.entries()) {
    const madeOn = addDays(today, -plan.daysAgo);
    const started = await createBatch(
      tx,
      actor,
      batchCreateSchema.parse({
        formulaId: formulaIds[plan.formula],
        version: 1,
        units: plan.units,
        lossPercent: 2,
        madeOn,
      }),
    );
    await recordBatch(
      tx,
      actor,
      started.id,
      batchRecordInputSchema.parse(recordOf(started, plan, n)),
    );
    const batch = plan.release ? await releaseBatch(tx, actor, started.id) : started;
    made.push(batch);
    for (const d of plan.deliveries) {
      delivery += 1;
      await createDelivery(
        tx,
        actor,
        deliveryCreateSchema.parse({
          customerId: customerIds[d.customer],
          deliveredOn: addDays(madeOn, d.daysAfter),
          reference: `HB-${String(1000 + delivery)}`,
          lines: [{ lotCode: batch.batchCode, units: d.units }],
          notes: null,
        }),
      );
    }
  }

  const [citric] = await tx
    .select({ id: lots.id })
    .from(lots)
    .where(
      and(
        eq(lots.workshopId, workshopId),
        eq(lots.supplierLotNumber, demoRecallDrill.supplierLotNumber),
      ),
    );
  const drill = await openRecall(
    tx,
    actor,
    recallCreateSchema.parse({
      scope: { kind: 'supplier-lot', supplierLotId: citric!.id },
      reason: demoRecallDrill.reason,
      severity: 'unlikely-harm',
      drill: true,
    }),
  );
  await sendNotices(tx, drillMailer, actor, drill.id, { whatToDo: null });
  await closeRecall(
    tx,
    actor,
    drill.id,
    recallCloseSchema.parse({ summary: demoRecallDrill.summary }),
  );
  return { batches: made.length, deliveries: delivery, recallDrill: drill.id };
}
/**
 * What production wrote down for a demo batch: every line weighed from its suggested lots, a
 * little over or under the target (within the ±2 % tolerance), the room, the mould, the cure and
 * the checks. `n` varies the readings from batch to batch.
 */
function recordOf(batch: Batch, plan: DemoBatch, n: number) {
  const fizzer = plan.formula !== 'Lavender Oat Bath Salts';
  const unitMass = batch.size.unitMassGrams ?? 150;
  return {
    lines: batch.lines.map((line, i) => weighed(line, ((n + i) % 5) - 2)),
    conditions: { roomTemperatureC: 19 + (n % 4), humidityPercent: 42 + ((n * 7) % 18) },
    mould: {
      name: fizzer ? 'Round two-part mould, 65 mm' : 'Kraft pouch, 250 g',
      unitsMade: plan.units - (fizzer && n % 3 === 0 ? 1 : 0),
    },
    timing: fizzer ? { hoursInMould: 12, curingDays: 3 } : { hoursInMould: 0, curingDays: 0 },
    checks: {
      appearance: { result: 'pass', note: fizzer ? 'Even colour, crisp edges' : 'Even mix' },
      hardness: fizzer ? { result: 'pass', note: 'Holds when pressed at the seam' } : {},
      fizzOrLather: fizzer ? { result: 'pass', note: 'Full fizz in 2 minutes' } : {},
      unitWeightsGrams: [0.6, 1.2, 0.4, 1.8, 0.9].map((extra) => unitMass + extra),
    },
    notes: n % 4 === 1 ? 'Humid morning: pressed a little harder.' : null,
  };
}

/** A line weighed `tenths` tenths of a percent off its target, from its suggested lots. */
function weighed(line: BatchLine, tenths: number) {
  const picks =
    line.suggestedPicks.status === 'single'
      ? line.suggestedPicks.picks
      : (line.suggestedPicks.split ?? line.suggestedPicks.picks);
  if (line.suggestedPicks.status === 'short' || line.suggestedPicks.status === 'none')
    throw new Error(`Demo production: not enough stock for ${line.materialName}`);
  const step = line.stepGrams;
  const actual = Math.round((line.weighGrams * (1 + tenths / 1000)) / step) * step;
  const actualGrams = Math.round(actual * 100) / 100;
  // The last lot takes the difference from the suggestion, so the lots add up to the weight.
  const lotPicks = picks.map((p, i) => ({
    lotId: p.lotId,
    grams:
      i === picks.length - 1
        ? Math.round((actualGrams - picks.slice(0, -1).reduce((s, q) => s + q.grams, 0)) * 1e6) /
          1e6
        : p.grams,
  }));
  return { lineNumber: line.lineNumber, usedMaterialId: null, actualGrams, lotPicks };
}
