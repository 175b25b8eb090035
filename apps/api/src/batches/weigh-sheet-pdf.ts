import type { Batch, BatchLine } from '@batchproof/shared';
import type { AuthUser } from '../auth/authenticate';
import type { Database } from '../db/database';
import { LABEL_FONT_FAMILY, renderDocumentPdf } from '../labels/pdf';
import { findLabelDetails } from '../workshop/workshop-repository';
import { getBatch } from './batches-domain';

/**
 * The printed weigh sheet of a batch (`GET /api/batches/:id/weigh-sheet.pdf`): what to weigh on
 * each line at the scale's step, the suggested lots, and blank boxes for the maker to fill in by
 * hand at the bench (actual weight, lot used, initials), then the conditions, the checks and the
 * signatures. Drawn by the label PDF worker in the label font (Source Sans 3).
 */

/** Grams as the scale shows them: the line's step sets the decimals (0.01 g → 2, 0.1 g → 1, 1 g → 0). */
export function gramsAtStep(grams: number, stepGrams: number): string {
  const decimals = stepGrams >= 1 ? 0 : stepGrams >= 0.1 ? 1 : 2;
  return grams.toFixed(decimals);
}

/** The batch size in words: units × unit mass with the loss allowance, or the total. */
function sizeText(batch: Batch): string {
  const { units, unitMassGrams, lossPercent, batchGrams } = batch.size;
  const loss = lossPercent > 0 ? ` + ${lossPercent} % loss allowance` : '';
  const total = `${gramsAtStep(batchGrams, 0.1)} g`;
  if (units !== null && unitMassGrams !== null)
    return `${units} units × ${unitMassGrams} g${loss} = ${total}`;
  return `${total}${loss ? ` (including a ${lossPercent} % loss allowance)` : ''}`;
}

function suggestedLotsText(line: BatchLine): string {
  const { status, picks, shortGrams } = line.suggestedPicks;
  if (status === 'none') return 'No lot in stock';
  const lots = picks.map(
    (p) =>
      `${p.supplierLotNumber}: ${gramsAtStep(p.grams, line.stepGrams)} g${p.expiresOn ? ` (use by ${p.expiresOn})` : ''}`,
  );
  if (status === 'short') lots.push(`Short by ${gramsAtStep(shortGrams, line.stepGrams)} g`);
  return lots.join('\n');
}

const BOX = 9;
/** A small empty square to tick, followed by its words. */
const tickBox = (label: string) => ({
  columns: [
    {
      width: BOX + 4,
      canvas: [{ type: 'rect', x: 0, y: 1, w: BOX, h: BOX, lineWidth: 0.7 }],
    },
    { width: 'auto', text: label },
  ],
  columnGap: 2,
});

/** A label followed by a line to write on. */
const writeIn = (label: string, width = 90) => ({
  columns: [
    { width: 'auto', text: label },
    {
      width,
      canvas: [{ type: 'line', x1: 2, y1: 11, x2: width, y2: 11, lineWidth: 0.5 }],
    },
  ],
  columnGap: 2,
});

const CHECKS = ['Appearance', 'Hardness', 'Fizz or lather test', 'Unit weights'] as const;

function linesTable(batch: Batch) {
  const header = [
    '#',
    'Material',
    'Substitutes allowed',
    'Target (g)',
    'Suggested lots',
    'Actual (g)',
    'Lot used',
    'Initials',
  ].map((text) => ({ text, bold: true }));
  const rows = batch.lines.map((line) => [
    String(line.lineNumber),
    line.materialName,
    line.substitutes.length === 0 ? 'None' : line.substitutes.map((s) => s.materialName).join('\n'),
    { text: gramsAtStep(line.weighGrams, line.stepGrams), alignment: 'right', bold: true },
    { text: suggestedLotsText(line), fontSize: 9 },
    '',
    '',
    '',
  ]);
  const total = [
    '',
    { text: 'Total', bold: true },
    '',
    {
      text: gramsAtStep(batch.sum.roundedGrams, 0.1),
      alignment: 'right',
      bold: true,
    },
    '',
    '',
    '',
    '',
  ];
  return {
    table: {
      headerRows: 1,
      dontBreakRows: true,
      widths: [16, '*', 90, 58, 130, 62, 70, 44],
      // Room to write by hand in every line's blank boxes.
      heights: ['auto', ...batch.lines.map(() => 26), 'auto'],
      body: [header, ...rows, total],
    },
  };
}

/** The pdfmake definition of a batch's weigh sheet (A4 landscape). */
export function weighSheetDocument(batch: Batch, workshopName: string) {
  const facts: [string, string][] = [
    ['Workshop', workshopName],
    ['Product', `${batch.formulaName}, version ${batch.version}`],
    ['Batch code', batch.batchCode],
    ['Made on', batch.madeOn],
    ['Batch size', sizeText(batch)],
    ['Weighing tolerance', `± ${batch.tolerancePercent} % of each target`],
  ];
  return {
    info: {
      title: `Weigh sheet ${batch.batchCode}`,
      creator: 'Batchproof',
      producer: 'Batchproof',
    },
    pageSize: 'A4',
    pageOrientation: 'landscape',
    pageMargins: [36, 36, 36, 36],
    defaultStyle: { font: LABEL_FONT_FAMILY, fontSize: 10 },
    content: [
      { text: `Weigh sheet ${batch.batchCode}`, fontSize: 18, bold: true, margin: [0, 0, 0, 6] },
      {
        table: {
          widths: [100, '*'],
          body: facts.map(([label, value]) => [{ text: label, bold: true }, value]),
        },
        layout: 'noBorders',
        margin: [0, 0, 0, 10],
      },
      linesTable(batch),
      ...batch.weighSheetNotes.map((note) => ({ text: note, italics: true, margin: [0, 4, 0, 0] })),
      {
        unbreakable: true,
        stack: [
          { text: 'Conditions', bold: true, fontSize: 12, margin: [0, 14, 0, 4] },
          {
            columns: [
              writeIn('Room temperature (°C)', 50),
              writeIn('Humidity (%)', 50),
              writeIn('Mould', 110),
              writeIn('Units made', 50),
            ],
            columnGap: 18,
          },
          {
            columns: [writeIn('Hours in the mould', 50), writeIn('Curing or drying days', 50)],
            columnGap: 18,
            margin: [0, 6, 0, 0],
          },
          { text: 'Checks', bold: true, fontSize: 12, margin: [0, 14, 0, 4] },
          ...CHECKS.map((check) => ({
            columns: [
              { width: 130, text: check },
              tickBox('Pass'),
              tickBox('Fail'),
              tickBox('Not checked'),
              writeIn('Note', 260),
            ],
            columnGap: 14,
            margin: [0, 0, 0, 5],
          })),
          writeIn('pH (where measured)', 60),
          { text: 'Signatures', bold: true, fontSize: 12, margin: [0, 14, 0, 4] },
          {
            columns: [
              writeIn('Weighed by', 150),
              writeIn('Checked by', 150),
              writeIn('Released by', 150),
            ],
            columnGap: 18,
          },
        ],
      },
    ],
  };
}

/** The batch's weigh sheet as a PDF. */
export function renderWeighSheetPdf(batch: Batch, workshopName: string): Promise<Buffer> {
  return renderDocumentPdf(weighSheetDocument(batch, workshopName));
}

/** The weigh sheet of a batch of the caller's workshop (404 for any other), with its file name. */
export async function weighSheetPdf(db: Database, actor: AuthUser, id: string) {
  const batch = await getBatch(db, actor, id);
  const workshop = await findLabelDetails(db, actor.workshopId);
  return {
    pdf: await renderWeighSheetPdf(batch, workshop?.name ?? ''),
    fileName: `Weigh sheet ${batch.batchCode}.pdf`,
  };
}
