// Benchmark of tracing and batch release on five years of a busy workshop, on the real database.
// Seeds 50,000 released batches (20 lots each: 1,000,000 lot consumptions), 40,000 supplier lots
// (each used by 25 consecutive batches), 300 customers and 100,000 deliveries of 5 lines (500,000 delivery lines), then measures over
// HTTP the p95 of a forward trace (supplier lot → batches → customers) and a backward trace
// (finished lot → supplier lots, suppliers, documents; and its deliveries), and the time to
// release a 40-line batch (locks, stock check, 40 consumption rows). Targets: p95 under 50 ms
// for each trace, release under 100 ms. Reports, never asserts; deletes its workshop at the end.
// Run: npx tsx apps/api/bench/trace-bench.ts (TRACE_BENCH_KEEP=1 keeps the seeded workshop)
import { sql } from 'drizzle-orm';
import { batchRecordInputSchema, type Batch } from '@batchproof/shared';
import { latency, startBench } from './bench-app';

const BATCHES = 50_000;
const LOTS_PER_BATCH = 20;
/** Each supplier lot goes into 25 batches (a 25 kg sack of bicarbonate makes about 14 batches of 24 fizzers). */
const SUPPLIER_LOTS = 40_000;
const BATCHES_PER_LOT = (BATCHES * LOTS_PER_BATCH) / SUPPLIER_LOTS;
const MATERIALS = 100;
const FORMULAS = 20;
const CUSTOMERS = 300;
const DELIVERIES = 100_000;
const LINES_PER_DELIVERY = 5;
const TRACES = 100;
const RELEASES = 20;
const RELEASE_LINES = 40;

const bench = await startBench('Trace bench workshop', 10);
const { db, w, call } = bench;
const wid = w.id;
const ms = (n: number) => `${n.toFixed(1).padStart(6)} ms`;

// A product profile as the formula contract stores it (the trace reads only names and codes).
const profile = {
  use: 'rinse-off',
  contact: { mucousMembranes: true, eyeArea: false, lips: false },
  inBath: true,
  adultsOnly: false,
  ifraCategory: '9',
  markets: ['US', 'EU', 'UK', 'CA'],
  unitMassGrams: 150,
  netQuantity: { amount: 150, unit: 'g' },
};
const emptyRecord = batchRecordInputSchema.parse({});
const sheet = {
  lines: [],
  sum: { batchGrams: 15000, roundedGrams: 15000, differenceGrams: 0, withinRounding: true },
  notes: [],
};

let t = performance.now();
// generate_series keeps seeding to a few statements. Batches made on consecutive days draw on the
// same supplier lots (a lot is used up over a few weeks), as in a real workshop. One transaction
// holds one connection, so its temporary tables of row numbers stay visible to every statement.
// The rows are consistent by construction, so the seeding transaction runs as a replica
// (session_replication_role, superuser only, as the test database's owner is): the composite
// foreign keys' triggers would otherwise check 1.5 million rows one by one.
await db.transaction(async (tx) => {
  await tx.execute(sql`set local session_replication_role = replica`);
  await tx.execute(sql`
    insert into suppliers (workshop_id, name) values (${wid}, 'Bench Supplies')`);
  await tx.execute(sql`
    insert into materials (workshop_id, trade_name, inci, category, functions)
  select ${wid}, 'Bench material ' || lpad(i::text, 3, '0'), 'Ingredient ' || i, 'base', array['bulking']
  from generate_series(1, ${MATERIALS}) as i`);
  await tx.execute(sql`
    with m as (select id, row_number() over (order by trade_name) as n from materials where workshop_id = ${wid})
  insert into lots (workshop_id, material_id, supplier_lot_number, quantity, unit, received_on, expires_on)
  select ${wid}, m.id, 'SL-' || lpad(i::text, 6, '0'), 1000000, 'kg',
         date '2021-11-01' + (i * 1826 / ${SUPPLIER_LOTS}), date '2021-11-01' + (i * 1826 / ${SUPPLIER_LOTS}) + 730
  from generate_series(1, ${SUPPLIER_LOTS}) as i join m on m.n = 1 + (i % ${MATERIALS})`);
  await tx.execute(sql`
    insert into formulas (workshop_id, name, product_type)
  select ${wid}, 'Bench product ' || lpad(i::text, 2, '0'), 'fizzer' from generate_series(1, ${FORMULAS}) as i`);
  await tx.execute(sql`
    insert into formula_versions (workshop_id, formula_id, number, state, profile, released_at)
  select ${wid}, id, 1, 'released', ${JSON.stringify(profile)}::jsonb, now()
  from formulas where workshop_id = ${wid}`);
  await tx.execute(sql`
    insert into customers (workshop_id, kind, name, email)
  select ${wid}, 'stockist', 'Bench stockist ' || lpad(i::text, 3, '0'), 'stockist' || i || '@example.test'
  from generate_series(1, ${CUSTOMERS}) as i`);
  await tx.execute(sql`
    with v as (select formula_id, id, row_number() over (order by formula_id) as n
             from formula_versions where workshop_id = ${wid})
  insert into batches (workshop_id, formula_id, version_id, version_number, batch_code, sequence, state,
                       made_on, units, unit_mass_grams, target_grams, loss_percent, batch_grams,
                       tolerance_percent, sheet, record, units_made, released_at)
  select ${wid}, v.formula_id, v.id, 1, 'B' || lpad(i::text, 6, '0'), 1, 'released',
         date '2021-12-01' + (i * 1826 / ${BATCHES}), 100, 150, 15000, 0, 15000, 2,
         ${JSON.stringify(sheet)}::jsonb, ${JSON.stringify(emptyRecord)}::jsonb, 100, now()
  from generate_series(1, ${BATCHES}) as i join v on v.n = 1 + (i % ${FORMULAS})`);
  await tx.execute(sql`
    create temporary table bench_lot on commit drop as
    select id, (row_number() over (order by supplier_lot_number)) - 1 as n from lots where workshop_id = ${wid}`);
  await tx.execute(sql`
    create temporary table bench_batch on commit drop as
    select id, (row_number() over (order by batch_code)) - 1 as n from batches where workshop_id = ${wid}`);
  await tx.execute(sql`
    create index on bench_lot (n)`);
  await tx.execute(sql`
    create index on bench_batch (n)`);
  await tx.execute(sql`
    insert into lot_consumptions (workshop_id, lot_id, quantity, kind, batch_id, line_number, grams)
  select ${wid}, l.id, 0.75, 'batch', b.id, j, 750
  from bench_batch b cross join generate_series(1, ${LOTS_PER_BATCH}) as j
  join bench_lot l on l.n = ((b.n / ${BATCHES_PER_LOT}) * ${LOTS_PER_BATCH} + j - 1) % ${SUPPLIER_LOTS}`);
  await tx.execute(sql`
    insert into deliveries (workshop_id, customer_id, delivered_on, reference)
  select ${wid}, c.id, date '2021-12-05' + (d * 1826 / ${DELIVERIES}), 'INV-' || d
  from generate_series(1, ${DELIVERIES}) as d
  join (select id, row_number() over (order by name) as n from customers where workshop_id = ${wid}) c
    on c.n = 1 + (d % ${CUSTOMERS})`);
  await tx.execute(sql`
    create temporary table bench_delivery on commit drop as
    select id, (row_number() over (order by delivered_on, reference)) - 1 as n from deliveries where workshop_id = ${wid}`);
  await tx.execute(sql`
    create index on bench_delivery (n)`);
  await tx.execute(sql`
    insert into delivery_lines (workshop_id, delivery_id, position, batch_id, units)
  select ${wid}, d.id, k + 1, b.id, 10
  from bench_delivery d cross join generate_series(0, ${LINES_PER_DELIVERY - 1}) as k
  join bench_batch b on b.n = (d.n % 10000) * ${LINES_PER_DELIVERY} + k`);
  await tx.execute(sql`
    analyze lots`);
  await tx.execute(sql`
    analyze batches`);
  await tx.execute(sql`
    analyze lot_consumptions`);
  await tx.execute(sql`
    analyze deliveries`);
  await tx.execute(sql`
    analyze delivery_lines`);
  await tx.execute(sql`
    analyze customers`);
});
const counted = await db.execute<{ batches: number; consumptions: number; lines: number }>(sql`
  select (select count(*) from batches where workshop_id = ${wid})::int as batches,
         (select count(*) from lot_consumptions where workshop_id = ${wid})::int as consumptions,
         (select count(*) from delivery_lines where workshop_id = ${wid})::int as lines`);
const c = counted.rows[0]!;
console.log(
  `seeded ${c.batches} batches, ${c.consumptions} lot consumptions, ${c.lines} delivery lines in ${Math.round(performance.now() - t)} ms`,
);

/** `count` supplier lots and `count` finished lots picked evenly through the seeded rows. */
async function sample(kind: 'lots' | 'batches', count: number) {
  const order = sql.raw(kind === 'lots' ? 'supplier_lot_number' : 'batch_code');
  const step = Math.floor((kind === 'lots' ? SUPPLIER_LOTS : BATCHES) / count);
  const rows = await db.execute<{ id: string }>(sql`
    select id from (select id, row_number() over (order by ${order}) as n
                    from ${sql.raw(kind)} where workshop_id = ${wid}) as numbered
    where n % ${step} = 7 order by n`);
  return rows.rows.map((r) => r.id);
}
const lotIds = await sample('lots', TRACES);
const batchIds = await sample('batches', TRACES);

const trivial = await latency(() => call('GET', '/api/health'), TRACES * 2);
console.log(
  `${'GET /api/health (select 1: the trivial query)'.padEnd(52)} p50 ${ms(trivial.p50)}  p95 ${ms(trivial.p95)}`,
);
let i = 0;
const forward = await latency(
  () => call('GET', `/api/trace/supplier-lots/${lotIds[i++ % lotIds.length]}`),
  TRACES,
);
console.log(
  `${'GET /api/trace/supplier-lots/:id (forward)'.padEnd(52)} p50 ${ms(forward.p50)}  p95 ${ms(forward.p95)}  (target p95 < 50 ms)`,
);
i = 0;
const backward = await latency(
  () => call('GET', `/api/trace/finished-lots/${batchIds[i++ % batchIds.length]}`),
  TRACES,
);
console.log(
  `${'GET /api/trace/finished-lots/:id (backward)'.padEnd(52)} p50 ${ms(backward.p50)}  p95 ${ms(backward.p95)}  (target p95 < 50 ms)`,
);

// Release of a 40-line batch: a formula of 40 seeded materials, released and given an identity
// through the API; each round starts a batch, records every line from its suggested lot and
// times the release alone.
t = performance.now();
const materials = await db.execute<{ id: string }>(
  sql`select id from materials where workshop_id = ${wid} order by trade_name limit ${RELEASE_LINES}`,
);
const formula = await call('POST', '/api/formulas', {
  name: 'Bench forty-line fizzer',
  productType: 'fizzer',
  notes: null,
  draft: {
    lines: materials.rows.map((m, n) => ({ materialId: m.id, grams: 10 + n })),
    profile,
    notes: null,
  },
});
const formulaId = formula['id'] as string;
await call('POST', `/api/formulas/${formulaId}/versions/1/release`, {
  override: { reason: 'Bench formula: released to measure batch release, not sold.' },
});
await call('PUT', `/api/formulas/${formulaId}/identity`, {
  productName: 'Bench forty-line fizzer',
  productCode: 'BENCH40',
  shelfLifeMonths: 12,
});
const releases: number[] = [];
for (let round = 0; round < RELEASES + 3; round++) {
  const batch = (await call('POST', '/api/batches', {
    formulaId,
    version: 1,
    units: 10,
  })) as unknown as Batch;
  await call('PUT', `/api/batches/${batch.id}`, {
    lines: batch.lines.map((line) => ({
      lineNumber: line.lineNumber,
      usedMaterialId: null,
      actualGrams: line.weighGrams,
      lotPicks: [{ lotId: line.suggestedPicks.picks[0]!.lotId, grams: line.weighGrams }],
    })),
  });
  const start = performance.now();
  await call('POST', `/api/batches/${batch.id}/release`);
  if (round >= 3) releases.push(performance.now() - start);
}
releases.sort((a, b) => a - b);
const median = releases[Math.floor(releases.length / 2)]!;
const worst = releases[releases.length - 1]!;
console.log(
  `${'POST /api/batches/:id/release (40 lines)'.padEnd(52)} median ${ms(median)}  slowest ${ms(worst)}  (target < 100 ms; ${RELEASES} releases, set-up ${Math.round(performance.now() - t)} ms)`,
);

if (process.env['TRACE_BENCH_KEEP']) {
  // Keeps the seeded workshop for EXPLAIN; delete it by hand afterwards.
  console.log(`kept workshop ${wid}`);
  process.exit(0);
}
// The bulk rows go the way they came (the cascade from the workshop would visit them one by one).
await db.transaction(async (tx) => {
  await tx.execute(sql`set local session_replication_role = replica`);
  for (const table of ['delivery_lines', 'deliveries', 'lot_consumptions', 'batches', 'lots'])
    await tx.execute(sql`delete from ${sql.raw(table)} where workshop_id = ${wid}`);
});
await bench.close();
