import path from 'node:path';

/**
 * Control characters (C0, DEL, C1), bidirectional controls (which can make `cod.exe` display as
 * `exe.doc`), line and paragraph separators, and the characters a header or a folder cannot
 * carry. Unicode TR #9 lists the bidi controls.
 */
const UNSAFE = /[\p{Cc}\u061c\u200e\u200f\u202a-\u202e\u2066-\u2069\u2028\u2029"\\/]/gu;

/** A file name safe to store, show and send in Content-Disposition: no path, no controls. */
export function safeFilename(original: string, fallbackExt: string): string {
  const base = path.posix.basename(original.replace(/\\/g, '/')).normalize('NFC');
  const cleaned = base.replace(UNSAFE, '').trim();
  return cleaned || `document.${fallbackExt}`;
}

/**
 * `Content-Disposition` with the name twice, as RFC 6266 section 4.3 advises: an ASCII
 * `filename` for old clients and an RFC 5987 `filename*=UTF-8''…` that keeps every letter.
 * `inline` lets the browser show it (a PDF preview); `attachment` saves it.
 */
export function contentDisposition(
  filename: string,
  disposition: 'attachment' | 'inline' = 'attachment',
): string {
  const ascii = filename.replace(/[^\x20-\x7e]|["\\%]/g, '_');
  // RFC 5987 attr-char leaves out ' ( ) * which encodeURIComponent keeps.
  const encoded = encodeURIComponent(filename).replace(
    /['()*]/g,
    (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`,
  );
  return `${disposition}; filename="${ascii}"; filename*=UTF-8''${encoded}`;
}

/** `Content-Disposition: attachment` for a download (see {@link contentDisposition}). */
export const attachmentDisposition = (filename: string) => contentDisposition(filename);
