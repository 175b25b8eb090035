import type { LabelFitProblem, LabelStock } from '@batchproof/shared';
import { renderInWorker } from './label-pdf-worker-pool';
import {
  firstSlot,
  labelsPerPage,
  labelsPerProduct,
  layoutProducts,
  type LabelSheetRequest,
} from './label-sheet-plan';

/**
 * Label PDFs: sheets and rolls of labels at 100 % scale with Source Sans 3 embedded, and the
 * calibration page of a stock. See docs/labels.md, "Label PDFs".
 */

export type { LabelSheetRequest } from './label-sheet-plan';

/**
 * The fields that cannot fit at their minimum letter height, per market and label; empty when the
 * sheet can be printed. Synchronous and fast: it lays out one product per market, not every copy.
 */
export function checkLabelFit(req: LabelSheetRequest): LabelFitProblem[] {
  firstSlot(req);
  return layoutProducts(req).flatMap((product) => product.problems);
}

/** How many labels and pages the request prints. */
export function countLabels(req: LabelSheetRequest): { labelCount: number; pageCount: number } {
  const labelCount = req.contents.length * req.copies * labelsPerProduct(req.layout);
  const slots = firstSlot(req) + labelCount;
  return { labelCount, pageCount: Math.ceil(slots / labelsPerPage(req.stock)) };
}

/**
 * The sheet's PDF, drawn in a worker thread so other requests go on meanwhile; `onProgress`
 * hears labels done out of the total. Rejects when a label does not fit (see `checkLabelFit`).
 */
export function renderLabelSheet(
  req: LabelSheetRequest,
  onProgress?: (done: number, total: number) => void,
): Promise<Buffer> {
  firstSlot(req);
  return renderInWorker({ kind: 'sheet', request: req }, onProgress);
}

/** The stock's calibration page: outlines, rulers every 10 mm, and the actual-size reminder. */
export function renderCalibrationPdf(stock: LabelStock): Promise<Buffer> {
  return renderInWorker({ kind: 'calibration', stock });
}

/**
 * Any other PDF in the label font (Source Sans 3, family `LABEL_FONT_FAMILY`), drawn in the same
 * worker: `definition` is a plain pdfmake document definition (no functions, as it crosses to the
 * worker), e.g. a batch's weigh sheet.
 */
export function renderDocumentPdf(definition: object): Promise<Buffer> {
  return renderInWorker({ kind: 'document', definition });
}

export { LABEL_FONT_FAMILY } from './label-fonts';
