import type { LabelStock } from '@batchproof/shared';
import { calibrationDocument } from './calibration-document';
import { labelSheetDocument } from './label-sheet-document';
import type { LabelSheetRequest } from './label-sheet-plan';
import { renderPdf } from './pdfmake-runner';

/** A PDF to draw, as the worker receives it. */
export type LabelPdfJob =
  | { readonly kind: 'sheet'; readonly request: LabelSheetRequest }
  | { readonly kind: 'calibration'; readonly stock: LabelStock }
  /** Any other document in the label font (a batch's weigh sheet): a plain pdfmake definition. */
  | { readonly kind: 'document'; readonly definition: object };

/** Messages from the worker. */
export type LabelPdfMessage =
  | {
      readonly id: number;
      readonly type: 'progress';
      readonly done: number;
      readonly total: number;
    }
  | { readonly id: number; readonly type: 'done'; readonly pdf: Uint8Array }
  | { readonly id: number; readonly type: 'failed'; readonly message: string };

/**
 * Draws one job's PDF. Progress counts labels: laying out and drawing the pages is by far the
 * longest part, and pdfmake reports it as the share of page items drawn.
 */
export async function runLabelPdfJob(
  job: LabelPdfJob,
  onProgress: (done: number, total: number) => void,
): Promise<Buffer> {
  if (job.kind === 'calibration') return renderPdf(calibrationDocument(job.stock));
  if (job.kind === 'document') return renderPdf(job.definition);
  const { definition, labelCount } = await labelSheetDocument(job.request);
  onProgress(0, labelCount);
  let reported = 0;
  const pdf = await renderPdf(definition, (fraction) => {
    const done = Math.floor(fraction * labelCount);
    // At most one message per label, and none for a fraction that did not move the count.
    if (done > reported) {
      reported = done;
      onProgress(done, labelCount);
    }
  });
  if (reported < labelCount) onProgress(labelCount, labelCount);
  return pdf;
}
