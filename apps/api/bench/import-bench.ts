// Benchmark: does one heavy request hold up the others? Runs the largest materials CSV the API
// accepts (5,000 rows, close to the 5 MB cap) through preview and import, and an oversized file
// (290,000 rows) through preview, over HTTP against a listening createApp(), while a second
// client asks GET /api/health one call after another. Prints health's latency idle and during
// each heavy request, the heavy request's own time and answer size; never asserts. Deletes its
// workshop at the end. Run: npx tsx apps/api/bench/import-bench.ts
import { monitorEventLoopDelay } from 'node:perf_hooks';
import Papa from 'papaparse';
import { MATERIAL_CSV_MAX_ROWS } from '@batchproof/shared';
import { startBench } from './bench-app';

/** Health's latency target while a heavy request runs. */
const HEALTH_TARGET_MS = 100;

const bench = await startBench('Import bench workshop', 10);
const { base, w } = bench;

/** A CSV of `rows` blends, each padded with notes so the file nears `bytes`. */
function blendsCsv(rows: number, bytes: number) {
  const components = JSON.stringify([
    { inci: 'Mica', percent: 60, colourIndex: 'CI 77019' },
    { inci: 'Titanium Dioxide', percent: 25, colourIndex: 'CI 77891' },
    { inci: 'Iron Oxides', percent: 15, colourIndex: 'CI 77491' },
  ]);
  const probe = Papa.unparse([{ tradeName: 'x', inci: 'Mica', category: 'colourant', components }]);
  const notes = 'n'.repeat(Math.max(0, Math.min(3_900, Math.floor(bytes / rows) - probe.length)));
  return Papa.unparse(
    Array.from({ length: rows }, (_, i) => ({
      tradeName: `Bench Mica ${i}`,
      inci: 'Mica (and) Titanium Dioxide (and) Iron Oxides',
      category: 'colourant',
      functions: 'colorant',
      notes,
      components,
    })),
  );
}
/** A CSV of `rows` short rows (the 4.9 MB, 290,000-row file of the probe that found the fault). */
const manyRowsCsv = (rows: number) =>
  Papa.unparse(
    Array.from({ length: rows }, (_, i) => ({
      tradeName: `S${i}`,
      inci: 'Na',
      category: 'oil',
    })),
  );

const healthOnce = async () => {
  const start = performance.now();
  const res = await fetch(`${base}/api/health`);
  await res.text();
  return performance.now() - start;
};
const pct = (times: number[], p: number) =>
  [...times].sort((a, b) => a - b)[Math.min(times.length - 1, Math.floor(times.length * p))]!;
const ms = (n: number) => `${n.toFixed(1).padStart(7)} ms`;

/** Health's latency, one call after another, until `done` says stop. */
async function healthWhile(done: () => boolean) {
  const times: number[] = [];
  while (!done() || times.length === 0) times.push(await healthOnce());
  return times;
}

function report(label: string, times: number[]) {
  const p95 = pct(times, 0.95);
  const max = Math.max(...times);
  const verdict = max < HEALTH_TARGET_MS ? 'met' : 'MISSED';
  console.log(
    `${label.padEnd(44)} n ${String(times.length).padStart(4)}  p50 ${ms(pct(times, 0.5))}  p95 ${ms(p95)}  max ${ms(max)}  (target max < ${HEALTH_TARGET_MS} ms: ${verdict})`,
  );
}

/** Sends `body` to `route` while health is asked in a loop; reports both. */
async function heavy(label: string, route: string, body: string) {
  // The server runs in this process: its longest stall shows what health could not avoid.
  const stalls = monitorEventLoopDelay({ resolution: 5 });
  stalls.enable();
  let finished = false;
  const start = performance.now();
  const sent = fetch(`${base}${route}`, {
    method: 'POST',
    headers: { Authorization: `Bearer ${w.members.owner.token}`, 'Content-Type': 'text/csv' },
    body,
  }).then(async (res) => {
    const text = await res.text();
    finished = true;
    return { status: res.status, bytes: text.length, ms: performance.now() - start };
  });
  const [answer, health] = await Promise.all([sent, healthWhile(() => finished)]);
  stalls.disable();
  console.log(
    `${label}: ${(body.length / 1e6).toFixed(1)} MB sent, answered ${answer.status} in ${Math.round(answer.ms)} ms with ${(answer.bytes / 1e3).toFixed(1)} kB`,
  );
  report('  health meanwhile', health);
  console.log(`  longest event-loop stall ${ms(stalls.max / 1e6)}`);
}

for (let i = 0; i < 20; i++) await healthOnce();
const idle: number[] = [];
for (let i = 0; i < 100; i++) idle.push(await healthOnce());
report('health, nothing else running', idle);

const largest = blendsCsv(MATERIAL_CSV_MAX_ROWS, 4_900_000);
await heavy(
  `preview of the largest accepted file (${MATERIAL_CSV_MAX_ROWS} rows)`,
  '/api/materials/import/preview',
  largest,
);
await heavy(
  `import of the largest accepted file (${MATERIAL_CSV_MAX_ROWS} rows)`,
  '/api/materials/import',
  largest,
);
await heavy(
  'preview of an oversized file (290,000 rows)',
  '/api/materials/import/preview',
  manyRowsCsv(290_000),
);

await bench.close();
