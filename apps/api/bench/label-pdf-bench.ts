// Benchmark: label PDFs. Times a full 30-label sheet (US Letter 2⅝ × 1 in, small-item labels with
// their QR codes) and a run of 1,000 labels (front and back on 4 × 2 in sheets, GS1 DataMatrix),
// each drawn in the worker thread as the API does, and the main thread's longest stall meanwhile.
// Prints the times against their targets; never asserts. Every run draws its own codes (a lot and
// page address of its own), so the renderer's small cache of codes does not flatter the times. Run: npx tsx apps/api/bench/label-pdf-bench.ts
import { monitorEventLoopDelay } from 'node:perf_hooks';
import { renderLabelSheet, type LabelSheetRequest } from '../src/labels/pdf';
import { builtInStock, fizzerContent } from '../../../tests/support/label-pdf-samples';

const SHEET_TARGET_MS = 300;
const THOUSAND_TARGET_MS = 5_000;
const RUNS = 5;

const smallStock = builtInStock('letter-2.625x1in-30');
const sheet: LabelSheetRequest = {
  stock: smallStock,
  startPosition: 1,
  layout: 'small',
  placement: {},
  barcode: 'gs1-datamatrix',
  contents: [fizzerContent('US', smallStock, 'small'), fizzerContent('EU', smallStock, 'small')],
  copies: 15,
  publicUrl: 'https://batchproof.example/p/7bq2JxW9tLm4aRk8VfZ3nC',
};
const panelStock = builtInStock('letter-4x2in-10');
const thousand: LabelSheetRequest = {
  ...sheet,
  stock: panelStock,
  layout: 'panels',
  contents: [fizzerContent('US', panelStock, 'panels'), fizzerContent('EU', panelStock, 'panels')],
  copies: 250,
  publicUrl: null,
};

const ms = (n: number) => `${n.toFixed(1).padStart(8)} ms`;

let run = 0;
/** The request with a lot and page address of its own, so no drawn code is reused between runs. */
function fresh(req: LabelSheetRequest): LabelSheetRequest {
  run++;
  return {
    ...req,
    publicUrl: req.publicUrl && `${req.publicUrl}${run}`,
    contents: req.contents.map((c) => ({
      ...c,
      barcode: c.barcode && { ...c.barcode, hri: `${c.barcode.hri}${run}` },
    })),
  };
}

/** Renders `req` `runs` times; answers the times and the main thread's longest stall. */
async function time(req: LabelSheetRequest, runs: number) {
  const stalls = monitorEventLoopDelay({ resolution: 5 });
  const times: number[] = [];
  stalls.enable();
  for (let i = 0; i < runs; i++) {
    const request = fresh(req);
    const start = performance.now();
    await renderLabelSheet(request);
    times.push(performance.now() - start);
  }
  stalls.disable();
  return { times: times.sort((a, b) => a - b), stallMs: stalls.max / 1e6 };
}

function report(label: string, result: { times: number[]; stallMs: number }, target: number) {
  const median = result.times[Math.floor(result.times.length / 2)]!;
  const verdict = median < target ? 'met' : 'MISSED';
  console.log(
    `${label.padEnd(44)} median ${ms(median)}  max ${ms(result.times.at(-1)!)}  main-thread stall max ${ms(result.stallMs)}  (target < ${target} ms: ${verdict})`,
  );
}

// The first render starts the worker and loads pdfmake and the fonts; it is reported apart.
const cold = performance.now();
await renderLabelSheet(sheet);
console.log(`${'first PDF (starts the worker)'.padEnd(44)} ${ms(performance.now() - cold)}`);
report('30-label sheet (30-up, QR codes)', await time(sheet, RUNS), SHEET_TARGET_MS);
report('1,000 labels (100 sheets, DataMatrix)', await time(thousand, 3), THOUSAND_TARGET_MS);
