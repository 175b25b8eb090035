import { parentPort } from 'node:worker_threads';
import { runLabelPdfJob, type LabelPdfJob, type LabelPdfMessage } from './label-pdf-job';

/**
 * The worker thread that draws label PDFs, so a run of 1,000 labels never holds up other
 * requests. Jobs run one at a time (pdfmake's progress callback is process-wide); the answer is
 * transferred back, not copied.
 */

if (!parentPort) throw new Error('label-pdf-worker runs as a worker thread only');
const port = parentPort;
let queue = Promise.resolve();

port.on('message', ({ id, job }: { id: number; job: LabelPdfJob }) => {
  queue = queue.then(async () => {
    const post = (message: LabelPdfMessage, transfer: ArrayBuffer[] = []) =>
      port.postMessage(message, transfer);
    try {
      const pdf = await runLabelPdfJob(job, (done, total) =>
        post({ id, type: 'progress', done, total }),
      );
      const bytes = new Uint8Array(pdf.buffer, pdf.byteOffset, pdf.byteLength).slice();
      post({ id, type: 'done', pdf: bytes }, [bytes.buffer]);
    } catch (error) {
      // Any failure of one job (a bad request, pdfmake or bwip-js throwing) goes back to its caller.
      post({ id, type: 'failed', message: error instanceof Error ? error.message : String(error) });
    }
  });
});
