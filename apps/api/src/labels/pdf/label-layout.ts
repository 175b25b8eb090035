import type {
  ComplianceMarket,
  LabelField,
  LabelFieldKey,
  LabelFitProblem,
  LabelShape,
} from '@batchproof/shared';
import { HRI_FONT_SIZE_PT, measureBarcode, type BarcodeKind } from './label-barcodes';
import { labelFontMetrics, type FontMetrics } from './label-fonts';
import { PT_PER_MM, safeArea, type RectMm } from './label-geometry';

/**
 * Lays out one label (a product's single label, its front or back panel, or a small-item label):
 * every field at the font size that gives its letters their minimum height, broken into lines at
 * spaces by the font's own measurements, the net quantity in the bottom 30 %, and the code. A field
 * that cannot fit is a problem naming the field and the label; nothing is shrunk below its minimum.
 */

/** Distance between baselines, in ems. */
const LINE_PITCH_EM = 1.2; // common practice, no published source
/** Baseline below a line's top, in ems: room for Source Sans 3's ascenders and accents. */
const BASELINE_EM = 0.9;
/** Space between two fields, and between text and a code. */
const FIELD_GAP_MM = 0.6; // common practice, no published source
/** How much larger than its minimum the product name is tried first. */
const NAME_SCALES = [1.5, 1.25, 1];
/** The net quantity sits in the bottom 30 % of the principal display panel (21 CFR 701.13). */
const NET_QUANTITY_ZONE = 0.3;

/** One line of text, positioned relative to the label's top-left corner. */
export interface PlacedLine {
  readonly field: LabelFieldKey | 'barcodeText';
  readonly text: string;
  readonly xMm: number;
  readonly baselineMm: number;
  readonly sizePt: number;
  readonly bold: boolean;
}

/** The code's place on the label. */
export interface PlacedBarcode extends RectMm {
  readonly kind: BarcodeKind;
  readonly text: string;
}

/** What one label holds, ready to draw at any position. */
export interface LabelLayout {
  readonly lines: PlacedLine[];
  readonly barcode: PlacedBarcode | null;
}

/** What a label must hold. */
export interface LabelPlan {
  readonly market: ComplianceMarket;
  /** The label in the maker's words: "front label (66.7 × 25.4 mm)". */
  readonly labelName: string;
  readonly widthMm: number;
  readonly heightMm: number;
  readonly shape: LabelShape;
  /** Whether this label is the principal display panel (the net quantity's 30 % rule applies). */
  readonly principal: boolean;
  readonly fields: readonly LabelField[];
  readonly barcode: { kind: BarcodeKind; text: string } | null;
}

/** Font size in points whose x-height is at least `mm`: size = x-height ÷ the font's ratio. */
export function fontSizeForXHeight(mm: number, font: FontMetrics): number {
  return Math.ceil((mm / font.xHeightRatio) * PT_PER_MM * 100) / 100;
}

const sizeMm = (pt: number) => pt / PT_PER_MM;

interface Block {
  field: LabelField;
  font: FontMetrics;
  sizePt: number;
}

/** Width available to a line spanning [top, bottom]: narrower beside a square code. */
type WidthAt = (topMm: number, bottomMm: number) => { xMm: number; widthMm: number };

interface Broken {
  lines: { text: string; topMm: number; xMm: number }[];
  /** A word wider than the label's text area, if any. */
  tooWide?: string;
  /** Where the next field may start. */
  bottomMm: number;
}

/** Breaks a field into lines from `topMm` down, at spaces and at its own line breaks only. */
function breakLines(block: Block, topMm: number, widthAt: WidthAt): Broken {
  const em = sizeMm(block.sizePt);
  const pitch = em * LINE_PITCH_EM;
  const space = block.font.widthEm(' ') * em;
  const lines: Broken['lines'] = [];
  let top = topMm;
  for (const paragraph of block.field.text.split('\n')) {
    const words = paragraph.split(/\s+/).filter(Boolean);
    let current = '';
    let currentWidth = 0;
    let area = widthAt(top, top + pitch);
    for (const word of words) {
      const w = block.font.widthEm(word) * em;
      if (w > area.widthMm) return { lines, tooWide: word, bottomMm: top + pitch };
      if (current && currentWidth + space + w > area.widthMm) {
        lines.push({ text: current, topMm: top, xMm: area.xMm });
        top += pitch;
        area = widthAt(top, top + pitch);
        current = '';
        currentWidth = 0;
        if (w > area.widthMm) return { lines, tooWide: word, bottomMm: top + pitch };
      }
      currentWidth += (current ? space : 0) + w;
      current = current ? `${current} ${word}` : word;
    }
    if (current) {
      lines.push({ text: current, topMm: top, xMm: area.xMm });
      top += pitch;
    }
  }
  return { lines, bottomMm: top };
}

function placed(block: Block, line: Broken['lines'][number]): PlacedLine {
  const em = sizeMm(block.sizePt);
  return {
    field: block.field.key,
    text: line.text,
    xMm: line.xMm,
    baselineMm: line.topMm + BASELINE_EM * em,
    sizePt: block.sizePt,
    bold: block.field.bold,
  };
}

function problem(plan: LabelPlan, field: LabelField, message: string): LabelFitProblem {
  return {
    market: plan.market,
    label: plan.labelName,
    field: field.key,
    fieldName: field.name,
    message,
    minimumMm: field.minimum.mm,
    source: field.minimum.source,
  };
}

const fmt = (mm: number) => `${Math.max(0, Math.round(mm * 10) / 10)} mm`;

/**
 * Lays out one label; `problems` is empty when everything fits at its minimum. The product name
 * is tried larger first; a square code goes in the bottom-right corner, or the top-right one when
 * that lets everything fit (on a principal panel the net quantity then has the whole bottom width).
 */
export function layoutLabel(plan: LabelPlan): { layout: LabelLayout; problems: LabelFitProblem[] } {
  let first: { layout: LabelLayout; problems: LabelFitProblem[] } | undefined;
  for (const scale of NAME_SCALES) {
    for (const codeAtTop of [false, true]) {
      if (codeAtTop && (!plan.barcode || plan.barcode.kind === 'gs1-128')) continue;
      const attempt = layoutAtScale(plan, scale, codeAtTop);
      if (attempt.problems.length === 0) return attempt;
      // The problems reported are those of the usual layout at the minimum size.
      if (scale === 1 && !codeAtTop) first = attempt;
    }
  }
  return first!;
}

function layoutAtScale(plan: LabelPlan, nameScale: number, codeAtTop: boolean) {
  const fonts = labelFontMetrics();
  const problems: LabelFitProblem[] = [];
  const lines: PlacedLine[] = [];
  const safe = safeArea(plan.widthMm, plan.heightMm, plan.shape);
  const safeBottom = safe.yMm + safe.heightMm;
  const blocks: Block[] = plan.fields.map((field) => {
    const font = field.bold ? fonts.bold : fonts.regular;
    const minimum = fontSizeForXHeight(field.minimum.mm, font);
    const sizePt =
      field.key === 'productName' ? Math.ceil(minimum * nameScale * 100) / 100 : minimum;
    return { field, font, sizePt };
  });
  const lotField = plan.fields.find((f) => f.key === 'lot') ?? plan.fields[0];

  // The code: a square one in the bottom-right corner, a linear one across the bottom.
  let barcode: PlacedBarcode | null = null;
  let square: RectMm | null = null;
  let bandHeight = 0;
  const m = plan.barcode && measureOrProblem(plan, plan.barcode, lotField, problems);
  if (m) {
    const hriHeight = m.hri ? sizeMm(HRI_FONT_SIZE_PT) * LINE_PITCH_EM : 0;
    if (m.widthMm > safe.widthMm + 1e-9 || m.heightMm + hriHeight > safe.heightMm + 1e-9) {
      if (lotField) {
        problems.push(
          problem(
            plan,
            lotField,
            `The ${codeName(m.kind)} (${fmt(m.widthMm)} × ${fmt(m.heightMm + hriHeight)}) does not fit on the ${plan.labelName}, which has ${fmt(safe.widthMm)} × ${fmt(safe.heightMm)} inside its margins.${m.kind === 'gs1-128' ? ' Choose GS1 DataMatrix or a wider label.' : ''}`,
          ),
        );
      }
    } else if (m.hri) {
      bandHeight = m.heightMm + hriHeight;
      barcode = {
        kind: m.kind,
        text: m.text,
        xMm: safe.xMm,
        yMm: 0,
        widthMm: m.widthMm,
        heightMm: m.heightMm,
      };
    } else {
      square = {
        xMm: safe.xMm + safe.widthMm - m.widthMm,
        yMm: codeAtTop ? safe.yMm : safeBottom - m.heightMm,
        widthMm: m.widthMm,
        heightMm: m.heightMm,
      };
      barcode = { kind: m.kind, text: m.text, ...square };
    }
  }
  const widthAt: WidthAt = (top, bottom) =>
    square && bottom > square.yMm - FIELD_GAP_MM && top < square.yMm + square.heightMm
      ? { xMm: safe.xMm, widthMm: square.xMm - FIELD_GAP_MM - safe.xMm }
      : { xMm: safe.xMm, widthMm: safe.widthMm };

  // The bottom: the net quantity on the principal panel, with a linear code above it.
  const anchored = plan.principal ? blocks.filter((b) => b.field.bottomThirtyPercent) : [];
  let bottom = safeBottom;
  for (const block of [...anchored].reverse()) {
    const height = measureHeight(block, widthAt, bottom);
    const top = bottom - height.heightMm;
    const zoneTop = plan.heightMm * (1 - NET_QUANTITY_ZONE);
    if (height.tooWide) {
      problems.push(tooWideProblem(plan, block, height.tooWide));
    } else if (top < zoneTop - 1e-9) {
      problems.push(
        problem(
          plan,
          block.field,
          `${block.field.name} must sit in the bottom 30 % of the ${plan.labelName} (21 CFR 701.13). At its minimum letter height of ${block.field.minimum.label} (${block.field.minimum.source}) it needs ${fmt(height.heightMm)}, and the bottom 30 % leaves ${fmt(bottom - zoneTop)}.`,
        ),
      );
    } else {
      const broken = breakLines(block, top, widthAt);
      lines.push(...broken.lines.map((l) => placed(block, l)));
    }
    bottom = top - FIELD_GAP_MM;
  }
  if (barcode && bandHeight) {
    const top = (anchored.length ? bottom : safeBottom) - bandHeight;
    if (top < safe.yMm - 1e-9 && lotField) {
      problems.push(
        problem(
          plan,
          lotField,
          `The ${codeName(barcode.kind)} and the net quantity together are taller than the ${plan.labelName}.`,
        ),
      );
    }
    barcode = { ...barcode, yMm: top };
    lines.push({
      field: 'barcodeText',
      text: barcode.text,
      xMm:
        barcode.xMm +
        (barcode.widthMm - fonts.regular.widthEm(barcode.text) * sizeMm(HRI_FONT_SIZE_PT)) / 2,
      baselineMm: top + barcode.heightMm + BASELINE_EM * sizeMm(HRI_FONT_SIZE_PT),
      sizePt: HRI_FONT_SIZE_PT,
      bold: false,
    });
    bottom = top - FIELD_GAP_MM;
  }

  // Everything else flows from the top.
  let top = safe.yMm;
  let overflowed = false;
  for (const block of blocks) {
    if (anchored.includes(block)) continue;
    const broken = breakLines(block, top, widthAt);
    if (broken.tooWide) {
      problems.push(tooWideProblem(plan, block, broken.tooWide));
      continue;
    }
    if (overflowed || broken.bottomMm > bottom + 1e-9) {
      overflowed = true;
      problems.push(
        problem(
          plan,
          block.field,
          `${block.field.name} does not fit on the ${plan.labelName} at its minimum letter height of ${block.field.minimum.label} (${block.field.minimum.source}). Move fields to the other label, choose a larger label stock or shorten the text.`,
        ),
      );
      continue;
    }
    lines.push(...broken.lines.map((l) => placed(block, l)));
    top = broken.bottomMm + FIELD_GAP_MM;
  }
  return { layout: { lines, barcode }, problems };
}

function measureHeight(block: Block, widthAt: WidthAt, bottomMm: number) {
  // Lines near the bottom may sit beside a square code: measure where they will go.
  let guess = breakLines(block, bottomMm - sizeMm(block.sizePt) * LINE_PITCH_EM, widthAt);
  for (let i = 0; i < 3; i++) {
    const height = guess.bottomMm - (guess.lines[0]?.topMm ?? guess.bottomMm);
    const again = breakLines(block, bottomMm - height, widthAt);
    if (again.lines.length === guess.lines.length)
      return { heightMm: height, tooWide: again.tooWide };
    guess = again;
  }
  return {
    heightMm: guess.bottomMm - (guess.lines[0]?.topMm ?? guess.bottomMm),
    tooWide: guess.tooWide,
  };
}

/** The code's size, or null with a problem when bwip-js cannot draw the text in that symbology. */
function measureOrProblem(
  plan: LabelPlan,
  code: { kind: BarcodeKind; text: string },
  lotField: LabelField | undefined,
  problems: LabelFitProblem[],
) {
  try {
    return measureBarcode(code.kind, code.text);
  } catch (error) {
    // bwip-js throws an Error (`bwipp.…`) for text its symbology or GS1's rules cannot encode.
    if (lotField) {
      const reason = error instanceof Error ? error.message.replace(/^bwipp\.\w+#\d+: /, '') : '';
      problems.push(
        problem(
          plan,
          lotField,
          `The ${codeName(code.kind)} cannot be drawn for ${code.text}: ${reason}`,
        ),
      );
    }
    return null;
  }
}

function tooWideProblem(plan: LabelPlan, block: Block, word: string): LabelFitProblem {
  return problem(
    plan,
    block.field,
    `${block.field.name} does not fit on the ${plan.labelName}: at its minimum letter height of ${block.field.minimum.label} (${block.field.minimum.source}) the word “${word}” is wider than the label.`,
  );
}

function codeName(kind: BarcodeKind): string {
  return kind === 'gs1-128'
    ? 'GS1-128 lot barcode'
    : kind === 'qrcode'
      ? 'QR code'
      : 'GS1 DataMatrix lot code';
}
