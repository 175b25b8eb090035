/**
 * Small pdfmake blocks shared by the documents drawn in the label font (the safety packet, the
 * recall summary): plain definitions, no functions, as they cross to the PDF worker.
 */

/** A table cell: plain text or a styled text. */
export type DocumentCell =
  string | { text: string; bold?: boolean; color?: string; italics?: boolean };

/**
 * A table with a bold header row and light lines between rows; `empty` (italic) in its place when
 * there are no rows.
 */
export function dataTable(
  headers: string[],
  rows: DocumentCell[][],
  widths: (string | number)[],
  empty = 'None.',
) {
  if (rows.length === 0) return { text: empty, italics: true, margin: [0, 0, 0, 6] };
  return {
    table: {
      headerRows: 1,
      widths,
      body: [headers.map((h) => ({ text: h, bold: true })), ...rows],
    },
    layout: 'lightHorizontalLines',
    fontSize: 9,
    margin: [0, 0, 0, 6],
  };
}

/** A timestamp as day and minute in UTC, the same whoever prints it. */
export const utcMinute = (iso: string) => `${iso.slice(0, 10)} ${iso.slice(11, 16)} UTC`;
