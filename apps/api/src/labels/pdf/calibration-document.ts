import { calibrationPage, type LabelStock } from '@batchproof/shared';
import { LABEL_FONT_FAMILY, labelFontMetrics } from './label-fonts';
import { mmToPt } from './label-geometry';
import { outlineVector } from './label-sheet-document';

/** The reminder every calibration page carries. */
export const ACTUAL_SIZE_REMINDER = "Print at actual size (100 %), not 'fit to page'";

const RULER_FONT_PT = 5; // common practice, no published source
const OUTLINE_WIDTH_PT = 0.5;

/**
 * The calibration page of a stock: every label's outline in its shape, rulers along the top and
 * left edges ticked every 10 mm and numbered, a title and the reminder to print at actual size.
 * Printed on plain paper and held against a sheet of labels, it shows whether the printer shifts
 * or scales the page.
 */
export function calibrationDocument(stock: LabelStock) {
  const page = calibrationPage(stock);
  const widthPt = mmToPt(page.pageWidthMm);
  const heightPt = mmToPt(page.pageHeightMm);
  const nodes: object[] = [];
  for (const box of page.boxes) {
    nodes.push({
      canvas: [
        {
          ...outlineVector(page.shape, mmToPt(box.widthMm), mmToPt(box.heightMm)),
          lineColor: '#555555',
          lineWidth: OUTLINE_WIDTH_PT,
        },
      ],
      absolutePosition: { x: mmToPt(box.xMm), y: mmToPt(box.yMm) },
    });
  }
  const ticks: object[] = [];
  const { regular } = labelFontMetrics();
  for (const tick of page.rulers.top) {
    const x = mmToPt(tick.positionMm);
    ticks.push({ type: 'line', x1: x, y1: 0, x2: x, y2: mmToPt(tick.lengthMm), lineWidth: 0.5 });
    // A number that would run off the page's right edge goes on the tick's left.
    const width = regular.widthEm(tick.label) * RULER_FONT_PT;
    const left = x + 1 + width > widthPt ? x - 1 - width : x + 1;
    nodes.push({
      text: tick.label,
      fontSize: RULER_FONT_PT,
      noWrap: true,
      absolutePosition: { x: left, y: mmToPt(tick.lengthMm) - RULER_FONT_PT },
    });
  }
  for (const tick of page.rulers.left) {
    const y = mmToPt(tick.positionMm);
    ticks.push({ type: 'line', x1: 0, y1: y, x2: mmToPt(tick.lengthMm), y2: y, lineWidth: 0.5 });
    if (tick.positionMm > 0) {
      nodes.push({
        text: tick.label,
        fontSize: RULER_FONT_PT,
        noWrap: true,
        absolutePosition: { x: mmToPt(tick.lengthMm) + 1, y: y + 0.5 },
      });
    }
  }
  nodes.push({ canvas: ticks, absolutePosition: { x: 0, y: 0 } });
  // Title and reminder in the middle of the page, small enough for a roll label's page.
  const size = Math.max(4, Math.min(11, widthPt / 40));
  nodes.push({
    stack: [
      { text: page.title, bold: true, fontSize: size * 1.2 },
      { text: ACTUAL_SIZE_REMINDER, fontSize: size },
    ],
    alignment: 'center',
    absolutePosition: { x: 0, y: heightPt / 2 - size * 1.5 },
  });
  return {
    info: { title: page.title, creator: 'Batchproof', producer: 'Batchproof' },
    pageSize: { width: widthPt, height: heightPt },
    pageMargins: 0,
    defaultStyle: { font: LABEL_FONT_FAMILY, lineHeight: 1 },
    content: nodes,
  };
}
