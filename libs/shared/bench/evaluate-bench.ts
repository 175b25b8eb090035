// Benchmark: time to evaluate a 40-line formula for four markets (target < 2 ms per evaluation on
// one core; reported, not asserted). Run with `npx tsx libs/shared/bench/evaluate-bench.ts`.
import { evaluateFormula } from '../src/compliance/evaluate-formula';
import {
  evaluationInputSchema,
  type EvaluationInputDraft,
} from '../src/compliance/evaluation-input-schema';

type LineDraft = EvaluationInputDraft['lines'][number];

const plain = [
  'Sodium Bicarbonate',
  'Citric Acid',
  'Magnesium Sulfate',
  'Zea Mays Starch',
  'Kaolin',
  'Sodium Chloride',
  'Cocos Nucifera Oil',
  'Butyrospermum Parkii Butter',
  'Polysorbate 80',
  'Glycerin',
];
const allergens = [
  { inci: 'Limonene', cas: '5989-27-5', percent: 22 },
  { inci: 'Linalool', cas: '78-70-6', percent: 8 },
  { inci: 'Citral', percent: 1.5 },
  { inci: 'Benzaldehyde', cas: '100-52-7', percent: 0.4 },
  { inci: 'Coumarin', percent: 0.2 },
  { inci: 'Linalyl Acetate', percent: 3 },
];

function line(i: number): LineDraft {
  switch (i % 4) {
    case 0:
      return {
        grams: 20 + i,
        material: { name: `Raw ${i}`, inci: plain[i % plain.length]!, functions: [] },
      };
    case 1:
      return {
        grams: 0.3,
        material: {
          name: `Mica Blend ${i}`,
          inci: 'Mica Blend',
          functions: ['colourant'],
          components: [
            { inci: 'Mica', colourIndex: '77019', percent: 60 },
            { inci: 'CI 77891', colourIndex: '77891', percent: 25 },
            { inci: 'CI 77007', colourIndex: '77007', percent: 15 },
          ],
        },
      };
    case 2:
      return {
        grams: 0.8,
        material: {
          name: `Fragrance ${i}`,
          inci: 'Parfum',
          functions: ['fragrance'],
          fragrance: { maxPercentByIfraCategory: { '9': 4, '5A': 1.5 }, allergens },
        },
      };
    default:
      return {
        grams: 3,
        material: {
          name: `Surfactant ${i}`,
          inci: 'Sodium Lauryl Sulfoacetate',
          functions: ['surfactant - cleansing'],
        },
      };
  }
}

const input = evaluationInputSchema.parse({
  asOf: '2026-09-01',
  markets: ['US', 'EU', 'UK', 'CA'],
  product: {
    name: 'Benchmark Fizz',
    use: 'rinse-off',
    contact: { mucousMembranes: false, eyeArea: false, lips: false },
    inBath: true,
    adultsOnly: false,
    ifraCategory: '9',
  },
  lines: Array.from({ length: 40 }, (_, i) => line(i)),
});

const WARM_UP = 500;
const RUNS = 5000;
let sink = 0;
for (let i = 0; i < WARM_UP; i += 1) sink += evaluateFormula(input).findings.length;
const times: number[] = [];
for (let i = 0; i < RUNS; i += 1) {
  const start = performance.now();
  sink += evaluateFormula(input).findings.length;
  times.push(performance.now() - start);
}
times.sort((a, b) => a - b);
const mean = times.reduce((a, b) => a + b, 0) / times.length;
const p95 = times[Math.floor(times.length * 0.95)]!;
console.log(
  `evaluateFormula, 40 lines, 4 markets, ${RUNS} runs after ${WARM_UP} warm-up (findings checksum ${sink})`,
);
console.log(`mean ${mean.toFixed(3)} ms, p95 ${p95.toFixed(3)} ms (target < 2 ms)`);
