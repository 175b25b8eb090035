import { runAfterAnswer } from '../core/after-answer';
import type { Database } from '../db/database';
import { renderLabelSheet } from './pdf';
import { publicPagePath } from './label-runs-domain';
import * as repo from './label-runs-repository';

/** Progress is written at most this often while a PDF is made. */
const PROGRESS_EVERY_MS = 250;

/** Runs whose PDF this process is making now. */
const active = new Set<string>();

/**
 * Makes a committed run's PDF in the background from its stored snapshot: progress is written as
 * it goes (throttled), then the PDF is stored and the run marked ready, or failed. A run left
 * `rendering` by a stopped server is started again when someone asks for it
 * ({@link resumeIfStalled}).
 */
export function startRendering(db: Database, workshopId: string, runId: string, appUrl: string) {
  if (active.has(runId)) return;
  active.add(runId);
  runAfterAnswer(`making the PDF of label run ${runId}`, async () => {
    try {
      const run = await repo.findRun(db, workshopId, runId);
      if (!run || run.status !== 'rendering') return;
      let lastWrite = 0;
      let written: Promise<void> = Promise.resolve();
      const pdf = await renderLabelSheet(
        {
          stock: run.stock,
          startPosition: run.startPosition,
          layout: run.layout,
          placement: run.placement,
          barcode: run.barcode,
          contents: run.contents,
          copies: run.copies,
          publicUrl: `${appUrl}${publicPagePath(run.publicToken)}`,
        },
        (done) => {
          const now = Date.now();
          if (now - lastWrite < PROGRESS_EVERY_MS) return;
          lastWrite = now;
          written = written.then(() => repo.raiseProgress(db, workshopId, runId, done));
        },
      );
      await written.catch(() => undefined);
      await repo.storePdf(db, workshopId, runId, pdf);
    } catch (err) {
      await repo.markFailed(db, workshopId, runId).catch(() => undefined);
      throw err;
    } finally {
      active.delete(runId);
    }
  });
}

/** Starts a run's PDF again when it is `rendering` but no one here is making it. */
export function resumeIfStalled(
  db: Database,
  workshopId: string,
  run: { id: string; status: string },
  appUrl: string,
) {
  if (run.status === 'rendering' && !active.has(run.id))
    startRendering(db, workshopId, run.id, appUrl);
}
