import { existsSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

/**
 * The label typeface, Source Sans 3 (SIL Open Font License, `apps/api/assets/fonts/LICENSE.md`),
 * read from the TTFs shipped in the repository: nothing is fetched at run time. The same files
 * give pdfmake its glyphs and this module its measurements, so a line measured here is the line
 * pdfmake draws.
 */

const require = createRequire(import.meta.url);

/** The subset of fontkit's font object these labels use. */
interface FontkitFont {
  readonly unitsPerEm: number;
  readonly ascent: number;
  readonly descent: number;
  /** OS/2 sxHeight: height of the lower-case "x" in font units. */
  readonly xHeight: number;
  layout(text: string): { advanceWidth: number };
}
const fontkit = require('fontkit') as { openSync(file: string): FontkitFont };

const FONT_FILES = {
  normal: 'SourceSans3-Regular.ttf',
  bold: 'SourceSans3-Bold.ttf',
  italics: 'SourceSans3-It.ttf',
  bolditalics: 'SourceSans3-BoldIt.ttf',
} as const;
/** Where the fonts live inside the repository. */
const FONT_DIR_IN_REPO = path.join('apps', 'api', 'assets', 'fonts');

/**
 * The font folder, found by walking up from this module: the source tree
 * (`apps/api/src/labels/pdf`) and the production bundle (`dist/api`) both sit below the repository
 * root that holds `apps/api/assets/fonts`.
 */
export function fontDirectory(): string {
  let dir = path.dirname(fileURLToPath(import.meta.url));
  for (;;) {
    const candidate = path.join(dir, FONT_DIR_IN_REPO);
    if (existsSync(path.join(candidate, FONT_FILES.normal))) return candidate;
    const parent = path.dirname(dir);
    if (parent === dir)
      throw new Error(`Label fonts not found above ${fileURLToPath(import.meta.url)}`);
    dir = parent;
  }
}

/** The family name pdfmake knows the label font by. */
export const LABEL_FONT_FAMILY = 'SourceSans3';

/** pdfmake's font table: the four styles of the label font, by absolute path. */
export function pdfmakeFonts(): Record<string, Record<string, string>> {
  const dir = fontDirectory();
  return {
    [LABEL_FONT_FAMILY]: {
      normal: path.join(dir, FONT_FILES.normal),
      bold: path.join(dir, FONT_FILES.bold),
      italics: path.join(dir, FONT_FILES.italics),
      bolditalics: path.join(dir, FONT_FILES.bolditalics),
    },
  };
}

/** Measurements of one weight of the label font, in units of the font size (1 = one em). */
export interface FontMetrics {
  /** Whether this is the bold weight. */
  readonly bold: boolean;
  /** x-height / em, read from the font's OS/2 table (486/1000 for Source Sans 3 Regular). */
  readonly xHeightRatio: number;
  /** Ascent / em (hhea), where pdfmake puts the baseline below a line's top. */
  readonly ascentRatio: number;
  /** Descent / em (hhea), positive. */
  readonly descentRatio: number;
  /** Width of `text` in ems, with the font's kerning, as pdfkit lays it out. */
  widthEm(text: string): number;
}

function loadMetrics(file: string, bold: boolean): FontMetrics {
  const font = fontkit.openSync(path.join(fontDirectory(), file));
  const em = font.unitsPerEm;
  if (!(font.xHeight > 0)) throw new Error(`${file} has no x-height in its OS/2 table`);
  const widths = new Map<string, number>();
  return {
    bold,
    xHeightRatio: font.xHeight / em,
    ascentRatio: font.ascent / em,
    descentRatio: Math.abs(font.descent) / em,
    widthEm(text) {
      let width = widths.get(text);
      if (width === undefined) {
        width = font.layout(text).advanceWidth / em;
        if (widths.size < 50_000) widths.set(text, width);
      }
      return width;
    },
  };
}

let cache: { regular: FontMetrics; bold: FontMetrics } | undefined;

/** The regular and bold weights' metrics, read once per process (or worker). */
export function labelFontMetrics(): { regular: FontMetrics; bold: FontMetrics } {
  cache ??= {
    regular: loadMetrics(FONT_FILES.normal, false),
    bold: loadMetrics(FONT_FILES.bold, true),
  };
  return cache;
}
