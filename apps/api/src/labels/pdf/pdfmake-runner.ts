import { createRequire } from 'node:module';
import path from 'node:path';
import { fontDirectory, pdfmakeFonts } from './label-fonts';

/**
 * pdfmake on the server, set up once per process: the label font from the repository's own files,
 * no URL ever fetched, and no file read outside the font folder.
 */

const require = createRequire(import.meta.url);

/** The part of pdfmake's server API used here (it ships no types). */
interface Pdfmake {
  addFonts(fonts: object): void;
  setUrlAccessPolicy(policy: (url: string) => boolean): void;
  setLocalAccessPolicy(policy: (file: string) => boolean): void;
  setProgressCallback(callback: ((fraction: number) => void) | undefined): void;
  createPdf(definition: object): { getBuffer(): Promise<Buffer> };
}

let configured: Pdfmake | undefined;

/** What pdfmake's PDFDocument and pdfkit's EmbeddedFont expose that the font reuse below needs. */
interface EmbeddedFont {
  readonly font: { postscriptName: string };
  readonly name: string;
  constructor: new (document: PdfDocument, font: object, id: string) => EmbeddedFont;
}
interface PdfDocument {
  fontCache: Record<string, Record<string, EmbeddedFont>>;
  _fontFamilies: Record<string, EmbeddedFont>;
  _fontCount: number;
  getFontType(bold: boolean, italics: boolean): string;
  getFontFile(family: string, bold: boolean, italics: boolean): string | null;
}

/**
 * Parsing a TTF (its glyph, kerning and substitution tables) is most of a small PDF's time, and
 * pdfkit parses every font again for every document. The parsed fontkit font is kept per file and
 * each new document gets its own pdfkit EmbeddedFont around it (its own subset and widths), as
 * pdfkit's `font()` would build. Anything unexpected falls back to pdfmake's own path.
 */
function reuseParsedFonts(): void {
  const PdfmakeDocument = (require('pdfmake/js/PDFDocument') as { default: { prototype: object } })
    .default.prototype as PdfDocument & {
    provideFont(family: string, bold: boolean, italics: boolean): EmbeddedFont;
  };
  const original = PdfmakeDocument.provideFont;
  const parsed = new Map<string, EmbeddedFont>();
  PdfmakeDocument.provideFont = function (this: PdfDocument, family, bold, italics) {
    const file = this.getFontFile(family, bold, italics);
    const type = this.getFontType(bold, italics);
    const cached = this.fontCache[family]?.[type];
    if (cached) return cached;
    const first = file ? parsed.get(file) : undefined;
    if (!first || typeof file !== 'string') {
      const font = original.call(this, family, bold, italics);
      if (typeof file === 'string' && font?.font && typeof font.constructor === 'function') {
        parsed.set(file, font);
      }
      return font;
    }
    const font = new first.constructor(this, first.font, `F${++this._fontCount}`);
    this.fontCache[family] = { ...this.fontCache[family], [type]: font };
    this._fontFamilies[font.name] = font;
    return font;
  };
}

function pdfmake(): Pdfmake {
  if (configured) return configured;
  const instance = require('pdfmake') as Pdfmake;
  reuseParsedFonts();
  const fonts = fontDirectory();
  instance.addFonts(pdfmakeFonts());
  instance.setUrlAccessPolicy(() => false);
  instance.setLocalAccessPolicy((file) => {
    const resolved = path.resolve(file);
    return resolved.startsWith(fonts + path.sep);
  });
  configured = instance;
  return instance;
}

/** Renders a pdfmake document definition; `onProgress` hears the drawing's share done (0–1). */
export async function renderPdf(
  definition: object,
  onProgress?: (fraction: number) => void,
): Promise<Buffer> {
  const instance = pdfmake();
  instance.setProgressCallback(onProgress);
  try {
    return await instance.createPdf(definition).getBuffer();
  } finally {
    instance.setProgressCallback(undefined);
  }
}
