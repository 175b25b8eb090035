import { createRequire } from 'node:module';

/**
 * Lot barcodes (GS1 DataMatrix, GS1-128) and the small label's QR code, drawn with bwip-js as PNGs
 * at the printer's resolution: every module is a whole number of 600 dpi dots, with a white
 * background and its quiet zone inside the image, so a scanner (or a test's decoder) reads it
 * as printed.
 */

const require = createRequire(import.meta.url);
interface BwipOptions {
  bcid: string;
  text: string;
  scale?: number;
  height?: number;
  padding?: number;
  paddingwidth?: number;
  paddingheight?: number;
  backgroundcolor?: string;
  parsefnc?: boolean;
  dontlint?: boolean;
}
const bwip = require('bwip-js') as {
  raw(options: BwipOptions): { pixx?: number; pixy?: number; sbs?: number[] }[];
  toBuffer(options: BwipOptions): Promise<Buffer>;
};

/** Which code a label carries. */
export type BarcodeKind = 'gs1-datamatrix' | 'gs1-128' | 'qrcode';

/** Resolution the PNGs are drawn at; common office and thermal printers print 600 or 300 dpi. */
const DOTS_PER_INCH = 600; // common practice, no published source
const MM_PER_DOT = 25.4 / DOTS_PER_INCH;

interface Symbology {
  readonly bcid: string;
  /** Whether the code is a matrix (bwip-js draws 2 units per module) or linear (1 unit). */
  readonly matrix: boolean;
  /** Dots per module at {@link DOTS_PER_INCH}. */
  readonly dotsPerModule: number;
  /** Quiet zone on each side, in modules. */
  readonly quietModules: number;
  /** Bar height of a linear code, in millimetres. */
  readonly barHeightMm?: number;
}

const SYMBOLOGIES: Record<BarcodeKind, Symbology> = {
  // X = 8/600 in = 0.339 mm; GS1 General Specifications allow 0.255–0.615 mm for GS1 DataMatrix
  // outside retail point of sale (from memory). Quiet zone 1X in ISO/IEC 16022; 2X here for slack
  // (common practice, no published source).
  'gs1-datamatrix': { bcid: 'gs1datamatrix', matrix: true, dotsPerModule: 8, quietModules: 2 },
  // X = 6/600 in = 0.254 mm, just over the 0.250 mm minimum of GS1-128 (GS1 General
  // Specifications, from memory); quiet zone 10X each side (same source, from memory).
  'gs1-128': {
    bcid: 'gs1-128',
    matrix: false,
    dotsPerModule: 6,
    quietModules: 10,
    barHeightMm: 6.35, // common practice, no published source
  },
  // Quiet zone 4X (ISO/IEC 18004, from memory).
  qrcode: { bcid: 'qrcode', matrix: true, dotsPerModule: 8, quietModules: 4 },
};

/** Height of the human-readable line printed under a GS1-128 code, as a font size in points. */
export const HRI_FONT_SIZE_PT = 6; // common practice, no published source

/** The size a code takes on the label, known without drawing it. */
export interface BarcodeMeasure {
  readonly kind: BarcodeKind;
  readonly text: string;
  /** Image size including the quiet zone, in millimetres. */
  readonly widthMm: number;
  readonly heightMm: number;
  /** Whether a human-readable line goes under the image (GS1-128). */
  readonly hri: boolean;
}

/**
 * Without a GTIN the engine's element string is (17) or (15) with (10): GS1 asks for (01) beside
 * them, so it is an internal code (the engine says so in its warnings), and bwip-js's GS1 checks
 * would refuse to draw it. Those checks are left out only then; a string with (01) is checked.
 */
const lintOption = (kind: BarcodeKind, text: string) =>
  kind !== 'qrcode' && !text.startsWith('(01)') ? { dontlint: true } : {};

function options(kind: BarcodeKind, text: string): BwipOptions {
  const s = SYMBOLOGIES[kind];
  const unitsPerModule = s.matrix ? 2 : 1;
  const base: BwipOptions = {
    bcid: s.bcid,
    text,
    backgroundcolor: 'FFFFFF',
    ...lintOption(kind, text),
  };
  if (s.matrix) {
    return {
      ...base,
      scale: s.dotsPerModule / unitsPerModule,
      padding: s.quietModules * unitsPerModule,
    };
  }
  // bwip-js draws a linear module 1 pt wide at scale 1 and takes the bar height in millimetres of
  // that space; the module printed here is dotsPerModule dots, so the height is scaled to match.
  const moduleMm = s.dotsPerModule * MM_PER_DOT;
  return {
    ...base,
    scale: s.dotsPerModule,
    height: ((s.barHeightMm ?? 0) * (25.4 / 72)) / moduleMm,
    paddingwidth: s.quietModules,
    paddingheight: 1,
  };
}

/**
 * Recent measures and images: a run is checked, then drawn, and often drawn again (a preview,
 * then the print), always with the same few codes. Small, and emptied when full.
 */
const CACHE_SIZE = 64;
const measures = new Map<string, BarcodeMeasure>();
const images = new Map<string, Promise<Buffer>>();
function remember<T>(cache: Map<string, T>, key: string, make: () => T): T {
  let value = cache.get(key);
  if (value === undefined) {
    if (cache.size >= CACHE_SIZE) cache.clear();
    value = make();
    cache.set(key, value);
  }
  return value;
}

/** Measures a code from bwip-js's module matrix, synchronously (no image is drawn). */
export function measureBarcode(kind: BarcodeKind, text: string): BarcodeMeasure {
  return remember(measures, `${kind}\n${text}`, () => measure(kind, text));
}

function measure(kind: BarcodeKind, text: string): BarcodeMeasure {
  const s = SYMBOLOGIES[kind];
  const moduleMm = s.dotsPerModule * MM_PER_DOT;
  const [raw] = bwip.raw({ bcid: s.bcid, text, ...lintOption(kind, text) });
  if (!raw) throw new Error(`bwip-js drew no ${kind} for ${text}`);
  if (s.matrix) {
    return {
      kind,
      text,
      widthMm: ((raw.pixx ?? 0) + 2 * s.quietModules) * moduleMm,
      heightMm: ((raw.pixy ?? raw.pixx ?? 0) + 2 * s.quietModules) * moduleMm,
      hri: false,
    };
  }
  const modules = (raw.sbs ?? []).reduce((a, b) => a + b, 0);
  return {
    kind,
    text,
    widthMm: (modules + 2 * s.quietModules) * moduleMm,
    heightMm: (s.barHeightMm ?? 0) + 2 * moduleMm,
    hri: true,
  };
}

/** Draws a code as a PNG; its pixel size is exactly the measured size at 600 dpi. */
export function barcodePng(kind: BarcodeKind, text: string): Promise<Buffer> {
  const key = `${kind}\n${text}`;
  const png = remember(images, key, () => bwip.toBuffer(options(kind, text)));
  // A failed drawing is not kept.
  png.catch(() => images.delete(key));
  return png;
}
