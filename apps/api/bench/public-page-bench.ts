// Benchmark of the public ingredients page (/p/:token) under 50 concurrent readers, the way a QR
// code on a market stall's labels is read. Prints one run of a released formula through the API,
// then 50 clients each read the page one request after another; prints p50/p95 next to the target
// and as a ratio to /api/health under the same load (so a busier machine moves both). Never
// asserts. Run: npx tsx apps/api/bench/public-page-bench.ts
import type { FormulaCreate, LabelRunCreate, ProductIdentityInput } from '@batchproof/shared';
import { buildMaterial } from '../../../tests/support/row-builders';
import { startBench } from './bench-app';

const READERS = 50;
const READS_EACH = 40;
/**
 * With 50 requests in flight on 2 cores, queueing dominates: even `select 1` waits ~150 ms at p95.
 * The targets: an absolute p95 and no more than 1.5× the trivial route under the same load.
 */
const TARGET_P95_MS = 250;
const TARGET_RATIO = 1.5;

const bench = await startBench('Public page bench', 20);
const { db, w, base, call } = bench;

// A US-only product of one material: the page's size does not depend on the formula's length.
await call('PUT', '/api/workshop/label-details', {
  name: 'Bench Bathworks',
  address: '1 Bench Row, Wrenfield, NY 10001, USA',
});
const material = await buildMaterial(db, w.id);
const formulaBody: FormulaCreate = {
  name: 'Bench Fizzer',
  productType: 'fizzer',
  notes: null,
  draft: {
    lines: [{ materialId: material.id, grams: 100 }],
    notes: null,
    profile: {
      use: 'rinse-off',
      contact: { mucousMembranes: true, eyeArea: false, lips: false },
      inBath: true,
      adultsOnly: false,
      ifraCategory: '9',
      markets: ['US'],
      unitMassGrams: 150,
      netQuantity: { amount: 150, unit: 'g' },
    },
  },
};
const identity: ProductIdentityInput = {
  productName: 'Bench Fizzer',
  productCode: 'BF-01',
  shelfLifeMonths: 12,
  directions: 'Drop into a warm bath.',
  usAdverseEventContact: { phone: '1-800-555-0199' },
};
const formula = await call('POST', '/api/formulas', formulaBody);
const formulaId = formula['id'] as string;
await call('POST', `/api/formulas/${formulaId}/versions/1/release`, {});
await call('PUT', `/api/formulas/${formulaId}/identity`, identity);
const runBody: LabelRunCreate = {
  formulaId,
  version: 1,
  markets: ['US'],
  stockId: 'letter-4x3.333in-6',
  copies: 1,
  lotCode: 'BENCH-1',
};
const run = await call('POST', '/api/label-runs', runBody);
const page = (run['publicPage'] as { path: string }).path;

/** Latencies of READERS clients each making READS_EACH requests one after another. */
async function underLoad(route: string) {
  const times: number[] = [];
  await Promise.all(
    Array.from({ length: READERS }, async () => {
      for (let i = 0; i < READS_EACH; i++) {
        const start = performance.now();
        const res = await fetch(base + route);
        await res.text();
        if (res.status !== 200) throw new Error(`${route} answered ${res.status}`);
        times.push(performance.now() - start);
      }
    }),
  );
  times.sort((a, b) => a - b);
  const p = (q: number) => times[Math.min(times.length - 1, Math.ceil(q * times.length) - 1)]!;
  return { p50: p(0.5), p95: p(0.95) };
}

const ms = (n: number) => `${n.toFixed(1).padStart(6)} ms`;
await underLoad(page); // warm-up
const health = await underLoad('/api/health');
const publicPage = await underLoad(page);
console.log(
  `${`GET /api/health, ${READERS} concurrent readers`.padEnd(56)} p50 ${ms(health.p50)}  p95 ${ms(health.p95)}`,
);
console.log(
  `${`GET /p/:token, ${READERS} concurrent readers`.padEnd(56)} p50 ${ms(publicPage.p50)}  p95 ${ms(publicPage.p95)} = ${(publicPage.p95 / health.p95).toFixed(1)}× health  (target < ${TARGET_P95_MS} ms and ≤ ${TARGET_RATIO}× health: ${publicPage.p95 < TARGET_P95_MS && publicPage.p95 <= TARGET_RATIO * health.p95 ? 'within' : 'OVER'})`,
);
await bench.close();
