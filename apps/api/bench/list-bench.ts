// Benchmark of the formulator's workspace list routes and formula saving, on the real database.
// Seeds 10,000 materials and 100,000 lots in a workshop of its own, measures p95 latency over
// HTTP against a listening createApp(), prints the numbers next to the targets and as a ratio to
// a trivial query's measured in the same run (so a slower or busier machine moves both), never
// asserts, and deletes its workshop at the end. Run: npx tsx apps/api/bench/list-bench.ts
import { sql } from 'drizzle-orm';
import { latency, startBench } from './bench-app';

const MATERIALS = 10_000;
const LOTS = 100_000;
const RUNS = 60;
/** Concurrent clients of the throughput figures, and the API's default pool for them (env.ts). */
const CLIENTS = 20;
const POOL_SIZE = 20;

const bench = await startBench('Bench workshop', POOL_SIZE);
const { db, w, call } = bench;
const wid = w.id;

let t = performance.now();
// generate_series keeps seeding to a few statements; categories and names vary so filters bite.
await db.execute(sql`
  insert into materials (workshop_id, trade_name, inci, category, functions, cas)
  select ${wid}, 'Material ' || lpad(i::text, 5, '0') || case when i % 10 = 0 then ' Salt' else '' end,
         'Ingredient ' || (i % 500), (array['base','acid','oil','butter','surfactant','additive'])[1 + i % 6]::material_category,
         array['bulking'], (1000 + i) || '-00-0'
  from generate_series(1, ${MATERIALS}) as i`);
await db.execute(sql`
  with m as (select id, row_number() over (order by id) as n from materials where workshop_id = ${wid})
  insert into lots (workshop_id, material_id, supplier_lot_number, quantity, unit, received_on, expires_on, unit_cost)
  select ${wid}, m.id, 'LOT-' || lpad(i::text, 6, '0'), 1 + (i % 50), 'kg',
         date '2024-01-01' + (i % 700), date '2024-01-01' + (i % 700) + 365, 2.5
  from generate_series(1, ${LOTS}) as i join m on m.n = 1 + (i % ${MATERIALS})`);
await db.execute(sql`analyze materials; analyze lots`);
console.log(
  `seeded ${MATERIALS} materials and ${LOTS} lots in ${Math.round(performance.now() - t)} ms`,
);

const ms = (n: number) => `${n.toFixed(1).padStart(6)} ms`;

// The trivial query every figure is set against: `select 1` through the same app and pool, with
// more runs than the others so that its p95, the divisor, is steadier.
const trivial = await latency(() => call('GET', '/api/health'), RUNS * 3);
console.log(
  `${'GET /api/health (select 1: the trivial query)'.padEnd(62)} p50 ${ms(trivial.p50)}  p95 ${ms(trivial.p95)}`,
);

async function measure(label: string, target: number, run: () => Promise<unknown>) {
  const { p50, p95 } = await latency(run, RUNS);
  const ratio = `${(p95 / trivial.p95).toFixed(1)}× trivial`;
  const verdict = p95 < target ? 'within' : 'OVER';
  console.log(
    `${label.padEnd(62)} p50 ${ms(p50)}  p95 ${ms(p95)} = ${ratio.padStart(13)}  (target < ${target} ms: ${verdict})`,
  );
}

/** Requests a second that CLIENTS clients, each sending the next on an answer, get through. */
async function throughput(run: () => Promise<unknown>, seconds = 3) {
  for (let i = 0; i < CLIENTS; i++) await run();
  let done = 0;
  const end = performance.now() + seconds * 1000;
  await Promise.all(
    Array.from({ length: CLIENTS }, async () => {
      while (performance.now() < end) {
        await run();
        done++;
      }
    }),
  );
  return done / seconds;
}

const [{ id: someMaterial }] = (
  await db.execute<{ id: string }>(
    sql`select id from materials where workshop_id = ${wid} order by trade_name offset 4321 limit 1`,
  )
).rows as [{ id: string }];
await measure('GET /api/materials?q=salt&sort=tradeName (filter + sort)', 50, () =>
  call('GET', '/api/materials?q=salt&sort=tradeName&dir=asc&pageSize=25'),
);
await measure('GET /api/materials?category=oil&sort=updatedAt&dir=desc&page=20', 50, () =>
  call('GET', '/api/materials?category=oil&sort=updatedAt&dir=desc&page=20&pageSize=25'),
);
await measure('GET /api/lots?sort=receivedOn&dir=desc (100k lots)', 50, () =>
  call('GET', '/api/lots?sort=receivedOn&dir=desc&pageSize=25'),
);
await measure('GET /api/lots?q=LOT-0123&sort=expiresOn (filter + sort)', 50, () =>
  call('GET', '/api/lots?q=LOT-0123&sort=expiresOn&pageSize=25'),
);
await measure('GET /api/lots?materialId=…&sort=receivedOn', 50, () =>
  call('GET', `/api/lots?materialId=${someMaterial}&sort=receivedOn&pageSize=25`),
);
await measure('GET /api/lots?sort=materialName (the lot’s copy of the name)', 50, () =>
  call('GET', '/api/lots?sort=materialName&pageSize=25&page=3'),
);

const forty = (
  await db.execute<{ id: string }>(
    sql`select id from materials where workshop_id = ${wid} order by trade_name limit 40`,
  )
).rows.map((r, i) => ({ materialId: r.id, grams: 10 + i }));
const profile = {
  use: 'rinse-off',
  contact: { mucousMembranes: true, eyeArea: false, lips: false },
  inBath: true,
  adultsOnly: false,
  ifraCategory: '9',
  markets: ['US', 'EU', 'UK', 'CA'],
  unitMassGrams: 150,
};
const created = await call('POST', '/api/formulas', {
  name: 'Forty-line bench formula',
  productType: 'fizzer',
  draft: { lines: forty, profile },
});
let bump = 0;
await measure('PUT /api/formulas/:id/versions/1 (40 lines, evaluated, 4 markets)', 100, () =>
  call('PUT', `/api/formulas/${String(created['id'])}/versions/1`, {
    lines: forty.map((l, i) => (i === 0 ? { ...l, grams: l.grams + (bump++ % 7) } : l)),
    profile,
  }),
);

// Throughput: the routes take turns in one-second slices, three rounds, so that a change in the
// machine's load during the run weighs on all of them alike.
const rates = [
  { label: 'GET /api/health (the trivial query)', route: '/api/health', done: 0 },
  { label: 'GET /api/me (token check and the member, signed in)', route: '/api/me', done: 0 },
  {
    label: 'GET /api/materials (first page of 10,000, signed in)',
    route: '/api/materials?pageSize=25',
    done: 0,
  },
];
for (let round = 0; round < 3; round++) {
  for (const r of rates) r.done += await throughput(() => call('GET', r.route), 1);
}
console.log(`\n${CLIENTS} concurrent clients, pool of ${POOL_SIZE}, 3 × 1 s each, interleaved:`);
for (const r of rates) {
  const rate = r.done / 3;
  const ratio = r === rates[0] ? '' : ` = ${(r.done / rates[0]!.done).toFixed(2)} of trivial`;
  console.log(`${r.label.padEnd(62)} ${rate.toFixed(0).padStart(6)} req/s${ratio}`);
}

t = performance.now();
await bench.close();
console.log(`removed the bench workshop in ${Math.round(performance.now() - t)} ms`);
