import { labelPositions, pageSizeMm, type LabelShape } from '@batchproof/shared';
import { barcodePng } from './label-barcodes';
import { LABEL_FONT_FAMILY, labelFontMetrics } from './label-fonts';
import { mmToPt } from './label-geometry';
import type { LabelLayout } from './label-layout';
import {
  firstSlot,
  labelsPerPage,
  layoutProducts,
  type LabelSheetRequest,
} from './label-sheet-plan';

/**
 * The pdfmake document of a label sheet: every label at its template position at 100 % scale,
 * starting at the chosen position of the first sheet. Each label begins with its outline filled
 * white: nothing prints on white stock, but the PDF itself then records where every label is, so
 * its geometry can be checked against the template without printing an outline on the labels.
 */

/** The outline of a label of `shape`, as a pdfmake canvas vector at (0, 0). */
export function outlineVector(shape: LabelShape, widthPt: number, heightPt: number) {
  if (shape.kind === 'circle' || shape.kind === 'oval') {
    return { type: 'ellipse', x: widthPt / 2, y: heightPt / 2, r1: widthPt / 2, r2: heightPt / 2 };
  }
  const r = shape.kind === 'rounded-rectangle' ? mmToPt(shape.cornerRadiusMm) : 0;
  return { type: 'rect', x: 0, y: 0, w: widthPt, h: heightPt, ...(r ? { r } : {}) };
}

/** One label's drawing at (xMm, yMm) on its page. */
function labelNodes(
  layout: LabelLayout,
  shape: LabelShape,
  at: { xMm: number; yMm: number; widthMm: number; heightMm: number },
  imageKey: string | null,
): object[] {
  const { regular, bold } = labelFontMetrics();
  const x = mmToPt(at.xMm);
  const y = mmToPt(at.yMm);
  const nodes: object[] = [
    {
      canvas: [
        { ...outlineVector(shape, mmToPt(at.widthMm), mmToPt(at.heightMm)), color: 'white' },
      ],
      absolutePosition: { x, y },
    },
  ];
  for (const line of layout.lines) {
    const ascent = (line.bold ? bold : regular).ascentRatio * line.sizePt;
    nodes.push({
      text: line.text,
      bold: line.bold,
      fontSize: line.sizePt,
      noWrap: true,
      absolutePosition: { x: x + mmToPt(line.xMm), y: y + mmToPt(line.baselineMm) - ascent },
    });
  }
  if (layout.barcode && imageKey) {
    nodes.push({
      image: imageKey,
      width: mmToPt(layout.barcode.widthMm),
      height: mmToPt(layout.barcode.heightMm),
      absolutePosition: { x: x + mmToPt(layout.barcode.xMm), y: y + mmToPt(layout.barcode.yMm) },
    });
  }
  return nodes;
}

/** Builds the sheet's document; throws when a label does not fit (check with `checkLabelFit`). */
export async function labelSheetDocument(req: LabelSheetRequest) {
  const products = layoutProducts(req);
  const problems = products.flatMap((p) => p.problems);
  if (problems.length > 0) {
    throw new Error(`Labels do not fit: ${problems.map((p) => p.message).join(' ')}`);
  }
  const images: Record<string, string> = {};
  const keys = new Map<string, string>();
  for (const product of products) {
    for (const { layout } of product.labels) {
      const code = layout.barcode;
      if (!code) continue;
      const id = `${code.kind}|${code.text}`;
      if (keys.has(id)) continue;
      const key = `code${keys.size}`;
      keys.set(id, key);
      const png = await barcodePng(code.kind, code.text);
      images[key] = `data:image/png;base64,${png.toString('base64')}`;
    }
  }
  const boxes = labelPositions(req.stock);
  const perPage = labelsPerPage(req.stock);
  const pages: object[][] = [];
  let slot = firstSlot(req);
  let total = 0;
  for (const product of products) {
    for (let copy = 0; copy < req.copies; copy++) {
      for (const { layout } of product.labels) {
        const page = Math.floor(slot / perPage);
        const box = boxes[slot % perPage]!;
        while (pages.length <= page) pages.push([]);
        const code = layout.barcode;
        const key = code ? (keys.get(`${code.kind}|${code.text}`) ?? null) : null;
        pages[page]!.push(...labelNodes(layout, req.stock.shape, box, key));
        slot++;
        total++;
      }
    }
  }
  const { widthMm, heightMm } = pageSizeMm(req.stock);
  return {
    labelCount: total,
    definition: {
      info: { title: `Labels: ${req.stock.name}`, creator: 'Batchproof', producer: 'Batchproof' },
      pageSize: { width: mmToPt(widthMm), height: mmToPt(heightMm) },
      pageMargins: 0,
      images,
      defaultStyle: { font: LABEL_FONT_FAMILY, lineHeight: 1 },
      content: pages.map((nodes, i) => ({
        stack: nodes,
        ...(i > 0 ? { pageBreak: 'before' } : {}),
      })),
    },
  };
}
