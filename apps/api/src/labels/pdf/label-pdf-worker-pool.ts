import { createRequire } from 'node:module';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { Worker } from 'node:worker_threads';
import type { LabelPdfJob, LabelPdfMessage } from './label-pdf-job';

/**
 * One long-lived worker thread for label PDFs, started on first use and unreferenced, so it never
 * keeps the process alive. From source (tsx in development, vitest in tests) the worker is the
 * TypeScript file loaded through tsx; in the production bundle it is `dist/api/label-pdf-worker.js`,
 * a second entry of `scripts/build-api.mjs` beside `main.js`.
 */

interface Pending {
  resolve(pdf: Buffer): void;
  reject(error: Error): void;
  onProgress?: (done: number, total: number) => void;
}

let worker: Worker | undefined;
let nextId = 1;
const pending = new Map<number, Pending>();

/**
 * From source the worker is loaded through tsx's `tsImport` (a `--import` hook in a worker's
 * execArgv does not reach the worker's own entry on Node 20); the bundle's worker is plain
 * JavaScript.
 */
function workerFromSource(): Worker {
  const require = createRequire(import.meta.url);
  const tsxApi = path.join(
    path.dirname(require.resolve('tsx/package.json')),
    'dist/esm/api/index.mjs',
  );
  const entry = new URL('./label-pdf-worker.ts', import.meta.url).href;
  const code = `import(${JSON.stringify(pathToFileURL(tsxApi).href)}).then(({ tsImport }) => tsImport(${JSON.stringify(entry)}, ${JSON.stringify(import.meta.url)}))`;
  return new Worker(code, { eval: true });
}

function startWorker(): Worker {
  const started = import.meta.url.endsWith('.ts')
    ? workerFromSource()
    : new Worker(new URL('./label-pdf-worker.js', import.meta.url));
  started.unref();
  started.on('message', (message: LabelPdfMessage) => {
    const job = pending.get(message.id);
    if (!job) return;
    if (message.type === 'progress') {
      job.onProgress?.(message.done, message.total);
      return;
    }
    pending.delete(message.id);
    if (message.type === 'done')
      job.resolve(Buffer.from(message.pdf.buffer, message.pdf.byteOffset, message.pdf.byteLength));
    else job.reject(new Error(message.message));
    if (pending.size === 0) started.unref();
  });
  const fail = (error: Error) => {
    if (worker === started) worker = undefined;
    for (const job of pending.values()) job.reject(error);
    pending.clear();
  };
  started.on('error', fail);
  started.on('exit', (code) => fail(new Error(`The label PDF worker stopped (exit code ${code})`)));
  return started;
}

/** Draws a PDF in the worker thread; the caller's event loop stays free meanwhile. */
export function renderInWorker(
  job: LabelPdfJob,
  onProgress?: (done: number, total: number) => void,
): Promise<Buffer> {
  worker ??= startWorker();
  const id = nextId++;
  const running = worker;
  // Referenced while a job runs, so a script awaiting a PDF does not exit early.
  running.ref();
  return new Promise((resolve, reject) => {
    pending.set(id, { resolve, reject, onProgress });
    running.postMessage({ id, job });
  });
}
