/**
 * TEMPORARY stand-in for the label content builder (libs/shared/src/labels, helper "content") and
 * the PDF renderer (apps/api/src/labels/pdf, helper "renderer") while they are being written. The
 * label-run domain imports them from here only, so swapping in the real ones is this file's
 * re-exports. Signatures are the agreed ones.
 */
import {
  missingForMarket,
  netQuantityStatement,
  type ComplianceMarket,
  type EvaluationResult,
  type LabelAreas,
  type LabelContent,
  type LabelField,
  type LabelFieldKey,
  type LabelFitProblem,
  type LabelLayout,
  type LabelPanel,
  type LabelStock,
  type LotBarcode,
  type MissingLabelElementRecord,
  type ProductIdentity,
} from '@batchproof/shared';

export interface LabelContentInput {
  market: ComplianceMarket;
  evaluation: EvaluationResult;
  identity: ProductIdentity;
  workshop: { name: string; address: string | null };
  netQuantity: { amount: number; unit: 'g' | 'mL' } | null;
  lotCode: string | null;
  expiresOn: string | null;
  madeOn: string;
  areas: LabelAreas;
}

export interface LabelSheetRequest {
  stock: LabelStock;
  startPosition: number;
  layout: LabelLayout;
  placement: Partial<Record<LabelFieldKey, LabelPanel>>;
  barcode: LotBarcode;
  contents: LabelContent[];
  copies: number;
  publicUrl: string | null;
}

const SQ_MM_PER_SQ_IN = 25.4 * 25.4;

export function labelAreas(stock: LabelStock, layout: LabelLayout): LabelAreas {
  const one = (stock.labelWidthMm * stock.labelHeightMm) / SQ_MM_PER_SQ_IN;
  return { pdpAreaSqIn: one, labellingAreaSqIn: layout === 'panels' ? one * 2 : one };
}

const minimum = { mm: 1.59, inches: 1 / 16, label: '1/16 in (1.59 mm)', source: '21 CFR 740.2(a)' };

function field(key: LabelFieldKey, name: string, text: string, bold = false): LabelField {
  return {
    key,
    name,
    text,
    bold,
    allowedPanels: ['front', 'back'],
    defaultPanel: 'back',
    bottomThirtyPercent: key === 'netQuantity',
    minimum,
    onSmallLabel: ['productName', 'netQuantity', 'business', 'lot', 'durability'].includes(key),
  };
}

export function buildLabelContent(input: LabelContentInput): LabelContent {
  const { market, evaluation, identity, workshop } = input;
  const fields: LabelField[] = [field('productName', 'Product name', identity.productName)];
  if (input.netQuantity)
    fields.push(
      field(
        'netQuantity',
        'Net quantity',
        netQuantityStatement({ ...input.netQuantity, pdpAreaSqIn: input.areas.pdpAreaSqIn })
          .byMarket[market],
      ),
    );
  fields.push(field('ingredients', 'Ingredients', evaluation.declarations[market]?.text ?? ''));
  const warnings = evaluation.warnings[market] ?? [];
  if (warnings.length > 0) fields.push(field('warnings', 'Warnings', warnings.join(' '), true));
  if (identity.directions) fields.push(field('directions', 'Directions', identity.directions));
  fields.push(
    field('business', 'Maker', [workshop.name, workshop.address].filter(Boolean).join(', ')),
  );
  if (input.lotCode) fields.push(field('lot', 'Lot', `Lot ${input.lotCode}`));
  return { market, fields, barcode: null };
}

export function missingLabelElements(input: LabelContentInput): MissingLabelElementRecord[] {
  const missing: MissingLabelElementRecord[] = missingForMarket(input.identity, input.market, {
    englishWarnings: input.evaluation.warnings[input.market] ?? [],
  }).map((m) => ({ market: input.market, ...m, field: `identity.${m.field}` }));
  if (!input.workshop.address)
    missing.push({
      market: input.market,
      field: 'workshop.address',
      item: 'The business address',
      source: '21 CFR 701.12',
    });
  if (!input.lotCode)
    missing.push({
      market: input.market,
      field: 'lotCode',
      item: 'A lot code',
      source: 'Regulation (EC) No 1223/2009, Art. 19(1)(e)',
    });
  return missing;
}

/** Labels per page of the stock. */
const perPage = (stock: LabelStock) => (stock.kind === 'sheet' ? stock.across * stock.down : 1);

export function countLabels(req: LabelSheetRequest): { labelCount: number; pageCount: number } {
  const labelCount = req.contents.length * req.copies * (req.layout === 'panels' ? 2 : 1);
  const pageCount = Math.ceil((req.startPosition - 1 + labelCount) / perPage(req.stock));
  return { labelCount, pageCount };
}

export function checkLabelFit(req: LabelSheetRequest): LabelFitProblem[] {
  const { stock } = req;
  if (stock.labelWidthMm * stock.labelHeightMm >= 400) return [];
  return req.contents.map((c) => ({
    market: c.market,
    label: `label (${stock.labelWidthMm} × ${stock.labelHeightMm} mm)`,
    field: 'ingredients' as const,
    fieldName: 'Ingredients',
    message: 'The ingredients do not fit at 1/16 in',
    minimumMm: minimum.mm,
    source: minimum.source,
  }));
}

export async function renderLabelSheet(
  req: LabelSheetRequest,
  onProgress?: (done: number, total: number) => void,
): Promise<Buffer> {
  const { labelCount } = countLabels(req);
  onProgress?.(labelCount, labelCount);
  const text = req.contents.flatMap((c) => c.fields.map((f) => f.text)).join(' ');
  return Buffer.from(`%PDF-1.4\n% stand-in ${text.length}\n%%EOF\n`);
}
