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

function pdfmake(): Pdfmake {
  if (configured) return configured;
  const instance = require('pdfmake') as Pdfmake;
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
