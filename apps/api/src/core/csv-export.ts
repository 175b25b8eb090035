import Papa from 'papaparse';
import type { Response } from 'express';

/**
 * CSV text for a spreadsheet: a header row, then each row's cells in the header's order, quoted
 * where needed (RFC 4180) with CRLF line ends. A cell that a spreadsheet would run as a formula
 * (starting with =, +, -, @, a tab or a carriage return) is prefixed with an apostrophe; the
 * imports drop it again (`unescapeFormula`).
 */
export function csvText<K extends string>(
  fields: readonly K[],
  rows: readonly Record<K, string>[],
): string {
  return Papa.unparse(
    { fields: [...fields], data: rows.map((row) => fields.map((k) => row[k])) },
    { escapeFormulae: true, newline: '\r\n' },
  );
}

/** Sends CSV text as a download named `filename`. */
export function sendCsv(res: Response, filename: string, text: string) {
  res.set('Content-Type', 'text/csv; charset=utf-8');
  res.attachment(filename);
  res.send(text);
}
