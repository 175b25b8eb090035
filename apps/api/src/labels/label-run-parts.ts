/**
 * TEMPORARY stand-in for the PDF renderer (apps/api/src/labels/pdf, helper "renderer") while it
 * is being written. The label-run domain imports the label parts from here only: the content
 * builder from the shared library, the renderer from this stand-in until it lands.
 */
import type {
  LabelFitProblem,
  LabelLayout,
  LabelContent,
  LabelFieldKey,
  LabelPanel,
  LabelStock,
  LotBarcode,
} from '@batchproof/shared';

export {
  buildLabelContent,
  labelAreas,
  missingLabelElements,
  type LabelContentInput,
} from '@batchproof/shared';

export interface LabelSheetRequest {
  stock: LabelStock;
  startPosition: number;
  layout: LabelLayout;
  placement: Partial<Record<LabelFieldKey, LabelPanel>>;
  barcode: LotBarcode;
  contents: LabelContent[];
  copies: number;
  publicUrl: string | null;
}

const minimum = { mm: 1.59, source: '21 CFR 740.2(a)' };

/** Labels per page of the stock. */
const perPage = (stock: LabelStock) => (stock.kind === 'sheet' ? stock.across * stock.down : 1);

export function countLabels(req: LabelSheetRequest): { labelCount: number; pageCount: number } {
  const labelCount = req.contents.length * req.copies * (req.layout === 'panels' ? 2 : 1);
  const pageCount = Math.ceil((req.startPosition - 1 + labelCount) / perPage(req.stock));
  return { labelCount, pageCount };
}

export function checkLabelFit(req: LabelSheetRequest): LabelFitProblem[] {
  const { stock } = req;
  if (stock.labelWidthMm * stock.labelHeightMm >= 400) return [];
  return req.contents.map((c) => ({
    market: c.market,
    label: `label (${stock.labelWidthMm} × ${stock.labelHeightMm} mm)`,
    field: 'ingredients' as const,
    fieldName: 'Ingredients',
    message: 'The ingredients do not fit at 1/16 in',
    minimumMm: minimum.mm,
    source: minimum.source,
  }));
}

export async function renderLabelSheet(
  req: LabelSheetRequest,
  onProgress?: (done: number, total: number) => void,
): Promise<Buffer> {
  const { labelCount } = countLabels(req);
  onProgress?.(labelCount, labelCount);
  const text = req.contents.flatMap((c) => c.fields.map((f) => f.text)).join(' ');
  return Buffer.from(`%PDF-1.4\n% stand-in ${text.length}\n%%EOF\n`);
}
