/**
 * The pieces every CSV import shares (materials, deliveries): reading a file into a header and
 * rows with papaparse, refusing UTF-16, undoing the export's formula guard, and keeping a
 * preview's answer small. Pure: the caller hands in papaparse itself (see {@link CsvParser}).
 */

/**
 * The part of papaparse an import uses. The library is passed in (`import Papa from 'papaparse'`,
 * then `readCsv(text, Papa, …)`) rather than imported here: its type definitions reference Node's
 * types, and importing it in this library would let `Buffer` and `process` typecheck here.
 */
export interface CsvParser {
  parse<T>(
    text: string,
    config: {
      header?: boolean;
      preview?: number;
      skipEmptyLines?: boolean | 'greedy';
      transformHeader?: (header: string) => string;
      chunkSize?: number;
      step?: (
        row: { data: T; errors: { type: string; message: string }[] },
        parser: { abort(): void },
      ) => void;
    },
  ): { data: T[] };
}

/** One data row's cells by column header. */
export type CsvCells = Record<string, string | undefined>;

/** Most file-level parse messages listed; a broken file would otherwise give one per row. */
export const MAX_PARSE_MESSAGES = 20;
/** Most messages kept for one row. */
export const MAX_ROW_MESSAGES = 10;
/** Characters of the file handed to the parser at a time. */
const PARSE_CHUNK_CHARS = 64 * 1024;

/** The text cut to `max` characters, with an ellipsis when it was longer. */
export const clip = (text: string, max: number) =>
  text.length > max ? `${text.slice(0, max - 1)}…` : text;

/** Spreadsheet formula guard: export prefixes risky cells with an apostrophe; import drops it. */
export const unescapeFormula = (v: string) => (/^'[=+\-@\t\r]/.test(v) ? v.slice(1) : v);

/** Bytes looked at for NULs: a UTF-16 file has one in every other byte of plain text. */
const SNIFF_BYTES = 4096;

/**
 * Whether a file was saved as UTF-16 (what Excel calls "Unicode text"): a byte-order mark, or NUL
 * bytes, which UTF-8 text never holds. Takes the bytes (a Node Buffer is a Uint8Array) or text
 * already decoded as UTF-8, where the mark reads as two replacement characters and the NULs stay.
 */
export function isUtf16(content: Uint8Array | string): boolean {
  if (typeof content === 'string') {
    return content.startsWith('\uFFFD\uFFFD') || content.slice(0, SNIFF_BYTES).includes('\u0000');
  }
  return (
    (content[0] === 0xff && content[1] === 0xfe) ||
    (content[0] === 0xfe && content[1] === 0xff) ||
    content.subarray(0, SNIFF_BYTES).includes(0)
  );
}

/** What a UTF-16 file is told, as one sentence and as the step to take. */
export const UTF16_REFUSAL =
  'This file is saved as UTF-16 ("Unicode text"), which the import cannot read. Save it as CSV UTF-8 and choose it again.';
export const UTF16_HELP =
  'Save it as CSV UTF-8 and choose it again: in Excel, Save As "CSV UTF-8 (Comma delimited)"; in LibreOffice, Save As CSV with the character set "Unicode (UTF-8)".';

/** A file read into its header and data rows. */
export interface CsvTable {
  /** Column headers as written, trimmed. */
  headers: string[];
  rows: CsvCells[];
  /** Lines the parser could not read, as `Line 4: …`. */
  problems: string[];
  /** Whether another row follows the last one kept (the file is over the cap). */
  more: boolean;
}

/**
 * Reads CSV text (a leading UTF-8 byte-order mark dropped) into its header and at most `maxRows`
 * data rows; parsing stops at the next row, however long the file. Synchronous: for an import of
 * a few thousand short rows, as the delivery import takes.
 */
export function readCsv(text: string, parser: CsvParser, maxRows: number): CsvTable {
  const source = text.replace(/^\uFEFF/, '');
  // Only the file's start: Papa splits all it is given into lines, even to read one.
  const header = parser.parse<string[]>(source.slice(0, PARSE_CHUNK_CHARS), { preview: 1 }).data[0];
  const rows: CsvCells[] = [];
  const problems: string[] = [];
  let more = false;
  parser.parse<CsvCells>(source, {
    header: true,
    skipEmptyLines: 'greedy',
    transformHeader: (h) => h.trim(),
    // In pieces: unchunked, Papa splits the whole text into lines before the first row.
    chunkSize: PARSE_CHUNK_CHARS,
    step: (row, running) => {
      if (rows.length === maxRows) {
        more = true;
        running.abort();
        return;
      }
      rows.push(row.data);
      for (const e of row.errors) {
        if (e.type !== 'FieldMismatch') problems.push(`Line ${rows.length + 1}: ${e.message}`);
      }
    },
  });
  return { headers: (header ?? []).map((h) => h.trim()), rows, problems, more };
}

/** The parser's messages as file errors, at most {@link MAX_PARSE_MESSAGES} of them. */
export function parseProblems(problems: readonly string[]): string[] {
  const out = problems.slice(0, MAX_PARSE_MESSAGES);
  if (problems.length > MAX_PARSE_MESSAGES) {
    out.push(`…and ${problems.length - MAX_PARSE_MESSAGES} more lines that cannot be read`);
  }
  return out;
}

/** At most {@link MAX_ROW_MESSAGES} messages for a row, each of a readable length. */
export function boundedErrors(errors: Record<string, string[]>) {
  const out: Record<string, string[]> = {};
  let left = MAX_ROW_MESSAGES;
  for (const [field, messages] of Object.entries(errors)) {
    if (left === 0) break;
    const kept = messages.slice(0, left).map((m) => clip(m, 300));
    out[clip(field, 100)] = kept;
    left -= kept.length;
  }
  return out;
}

/**
 * The rows a preview sends back: those needing attention first, then ready ones, at most `max`,
 * in line order.
 */
export function shownRows<R extends { line: number; valid: boolean }>(rows: R[], max: number) {
  const invalid = rows.filter((r) => !r.valid);
  const valid = rows.filter((r) => r.valid);
  const shown = [...invalid, ...valid].slice(0, max);
  return shown.sort((a, b) => a.line - b.line);
}
