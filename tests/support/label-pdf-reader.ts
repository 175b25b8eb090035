// Reads a generated label PDF back with general-purpose tools: pdfjs-dist for text, paths and
// images, zxing-wasm to decode barcodes. Everything is converted to millimetres from the page's
// top-left corner, the way label stocks are measured.
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { getDocument, OPS, type PDFPageProxy } from 'pdfjs-dist/legacy/build/pdf.mjs';
import { prepareZXingModule, readBarcodes, type ReadResult } from 'zxing-wasm/reader';

const require = createRequire(import.meta.url);
const MM_PER_PT = 25.4 / 72;

prepareZXingModule({
  overrides: { wasmBinary: readFileSync(require.resolve('zxing-wasm/reader/zxing_reader.wasm')) },
  fireImmediately: true,
});

/** One text run as pdfjs reads it: baseline position and font size, in millimetres. */
export interface PdfText {
  readonly str: string;
  readonly xMm: number;
  readonly baselineMm: number;
  readonly widthMm: number;
  readonly sizeMm: number;
  readonly fontName: string;
}
/** A filled or stroked path's bounding box and its colour. */
export interface PdfShape {
  readonly xMm: number;
  readonly yMm: number;
  readonly widthMm: number;
  readonly heightMm: number;
  readonly fill: string | null;
  readonly stroked: boolean;
  /** Number of curve segments (an ellipse or rounded corners have some). */
  readonly curves: number;
}
/** An image drawn on the page, with its pixels as RGBA. */
export interface PdfImage {
  readonly xMm: number;
  readonly yMm: number;
  readonly widthMm: number;
  readonly heightMm: number;
  readonly pixels: { width: number; height: number; data: Uint8ClampedArray };
}
export interface PdfPage {
  readonly widthMm: number;
  readonly heightMm: number;
  readonly texts: PdfText[];
  readonly shapes: PdfShape[];
  readonly images: PdfImage[];
  /** Names of the fonts the page uses, as embedded. */
  readonly fonts: string[];
}

type Matrix = [number, number, number, number, number, number];
const multiply = (m: Matrix, n: Matrix): Matrix => [
  m[0] * n[0] + m[2] * n[1],
  m[1] * n[0] + m[3] * n[1],
  m[0] * n[2] + m[2] * n[3],
  m[1] * n[2] + m[3] * n[3],
  m[0] * n[4] + m[2] * n[5] + m[4],
  m[1] * n[4] + m[3] * n[5] + m[5],
];
const apply = (m: Matrix, x: number, y: number) =>
  [m[0] * x + m[2] * y + m[4], m[1] * x + m[3] * y + m[5]] as const;

function toRgba(img: {
  width: number;
  height: number;
  data: Uint8Array | Uint8ClampedArray;
  kind: number;
}) {
  const count = img.width * img.height;
  const out = new Uint8ClampedArray(count * 4);
  if (img.kind === 3) out.set(img.data);
  else if (img.kind === 2) {
    for (let i = 0; i < count; i++) {
      out[i * 4] = img.data[i * 3]!;
      out[i * 4 + 1] = img.data[i * 3 + 1]!;
      out[i * 4 + 2] = img.data[i * 3 + 2]!;
      out[i * 4 + 3] = 255;
    }
  } else {
    const rowBytes = Math.ceil(img.width / 8);
    for (let y = 0; y < img.height; y++) {
      for (let x = 0; x < img.width; x++) {
        const bit = (img.data[y * rowBytes + (x >> 3)]! >> (7 - (x & 7))) & 1;
        const v = bit ? 255 : 0;
        out.set([v, v, v, 255], (y * img.width + x) * 4);
      }
    }
  }
  return { width: img.width, height: img.height, data: out };
}

async function readPage(page: PDFPageProxy): Promise<PdfPage> {
  const [, , widthPt, heightPt] = page.view as [number, number, number, number];
  const toMm = (x: number, y: number) => [x * MM_PER_PT, (heightPt - y) * MM_PER_PT] as const;
  const content = await page.getTextContent();
  const texts: PdfText[] = [];
  for (const item of content.items) {
    if (!('str' in item) || item.str.trim() === '') continue;
    const [x, baseline] = toMm(item.transform[4], item.transform[5]);
    texts.push({
      str: item.str,
      xMm: x,
      baselineMm: baseline,
      widthMm: item.width * MM_PER_PT,
      sizeMm: Math.hypot(item.transform[2], item.transform[3]) * MM_PER_PT,
      fontName: item.fontName,
    });
  }
  const ops = await page.getOperatorList();
  // The embedded font's own name (e.g. `ABCDEF+SourceSans3-Bold`), not pdfjs's handle.
  const fontName = (id: string) =>
    page.commonObjs.has(id)
      ? String((page.commonObjs.get(id) as { name?: string }).name ?? id)
      : id;
  for (const t of texts) (t as { fontName: string }).fontName = fontName(t.fontName);
  const shapes: PdfShape[] = [];
  const images: PdfImage[] = [];
  const fonts = new Set<string>();
  let ctm: Matrix = [1, 0, 0, 1, 0, 0];
  let fill: string | null = '#000000';
  const stack: { ctm: Matrix; fill: string | null }[] = [];
  for (let i = 0; i < ops.fnArray.length; i++) {
    const fn = ops.fnArray[i];
    const args = ops.argsArray[i] as unknown[];
    if (fn === OPS.save) stack.push({ ctm, fill });
    else if (fn === OPS.restore) ({ ctm, fill } = stack.pop() ?? { ctm, fill });
    else if (fn === OPS.transform) ctm = multiply(ctm, args as Matrix);
    else if (fn === OPS.setFillRGBColor) fill = String(args[0]);
    else if (fn === OPS.setFont) fonts.add(String(args[0]));
    else if (fn === OPS.constructPath) {
      const [op, data] = args as [number, [Float32Array | null]];
      const path = data[0] ?? new Float32Array();
      let curves = 0;
      const xs: number[] = [];
      const ys: number[] = [];
      for (let k = 0; k < path.length;) {
        const kind = path[k]!;
        const coords = kind === 0 || kind === 1 ? 2 : kind === 2 ? 6 : kind === 3 ? 4 : 0;
        if (kind === 2) curves++;
        for (let c = 0; c < coords; c += 2) {
          const [x, y] = toMm(...apply(ctm, path[k + 1 + c]!, path[k + 2 + c]!));
          xs.push(x);
          ys.push(y);
        }
        k += 1 + coords;
      }
      if (xs.length === 0) continue;
      const [x0, y0, x1, y1] = [Math.min(...xs), Math.min(...ys), Math.max(...xs), Math.max(...ys)];
      const filled =
        op === OPS.fill || op === OPS.eoFill || op === OPS.fillStroke || op === OPS.eoFillStroke;
      const stroked =
        op === OPS.stroke ||
        op === OPS.fillStroke ||
        op === OPS.closeStroke ||
        op === OPS.eoFillStroke;
      shapes.push({
        xMm: x0,
        yMm: y0,
        widthMm: x1 - x0,
        heightMm: y1 - y0,
        fill: filled ? fill : null,
        stroked,
        curves,
      });
    } else if (fn === OPS.paintImageXObject) {
      const id = String(args[0]);
      const obj = await new Promise<{
        width: number;
        height: number;
        data: Uint8Array;
        kind: number;
      }>((resolve) => (id.startsWith('g_') ? page.commonObjs : page.objs).get(id, resolve));
      const [x0, y0] = toMm(...apply(ctm, 0, 1));
      const [x1, y1] = toMm(...apply(ctm, 1, 0));
      images.push({ xMm: x0, yMm: y0, widthMm: x1 - x0, heightMm: y1 - y0, pixels: toRgba(obj) });
    }
  }
  return {
    widthMm: widthPt * MM_PER_PT,
    heightMm: heightPt * MM_PER_PT,
    texts,
    shapes,
    images,
    fonts: [...fonts].map(fontName),
  };
}

/** Every page of a PDF, read back. */
export async function readPdf(pdf: Buffer): Promise<PdfPage[]> {
  const doc = await getDocument({
    data: new Uint8Array(pdf),
    isOffscreenCanvasSupported: false,
    isImageDecoderSupported: false,
    useSystemFonts: false,
    verbosity: 0,
  }).promise;
  try {
    const pages: PdfPage[] = [];
    for (let n = 1; n <= doc.numPages; n++) pages.push(await readPage(await doc.getPage(n)));
    return pages;
  } finally {
    await doc.destroy();
  }
}

/** Text runs whose baseline lies inside a box, joined in reading order with spaces normalised. */
export function textIn(
  page: PdfPage,
  box: { xMm: number; yMm: number; widthMm: number; heightMm: number },
): string {
  return page.texts
    .filter(
      (t) =>
        t.xMm >= box.xMm - 0.01 &&
        t.xMm <= box.xMm + box.widthMm &&
        t.baselineMm >= box.yMm &&
        t.baselineMm <= box.yMm + box.heightMm,
    )
    .sort((a, b) => a.baselineMm - b.baselineMm || a.xMm - b.xMm)
    .map((t) => t.str)
    .join(' ')
    .replace(/\s+/g, ' ')
    .trim();
}

/** Decodes every barcode in an image with zxing. */
export function decodeBarcodes(image: PdfImage): Promise<ReadResult[]> {
  return readBarcodes(image.pixels as unknown as ImageData, { tryHarder: true, formats: [] });
}
