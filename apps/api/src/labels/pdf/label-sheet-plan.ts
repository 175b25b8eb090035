import {
  labelPositions,
  type LabelContent,
  type LabelField,
  type LabelFieldKey,
  type LabelFitProblem,
  type LabelLayout as LayoutChoice,
  type LabelPanel,
  type LabelStock,
  type LotBarcode,
} from '@batchproof/shared';
import { AppError } from '../../core/app-error';
import { mmForName } from './label-geometry';
import { layoutLabel, type LabelLayout, type LabelPlan } from './label-layout';

/** What to print: the agreed request of `renderLabelSheet` and `checkLabelFit`. */
export interface LabelSheetRequest {
  stock: LabelStock;
  /** First position to print on, from 1 (top left), on the first sheet; ignored for a roll. */
  startPosition: number;
  layout: LayoutChoice;
  /** Fields moved off their default panel in the `panels` layout. */
  placement: Partial<Record<LabelFieldKey, LabelPanel>>;
  barcode: LotBarcode;
  /** One per market, in order; each printed `copies` times (panels: 2 labels each). */
  contents: LabelContent[];
  copies: number;
  /**
   * Absolute URL of the public page; the QR code of `small` labels leads to it with the label's
   * market (`?market=EU`), so a buyer sees the declaration of the label in their hand.
   */
  publicUrl: string | null;
}

/** The public page's address for one market's label. */
export function marketPageUrl(publicUrl: string, market: LabelContent['market']): string {
  const url = new URL(publicUrl);
  url.searchParams.set('market', market);
  return url.toString();
}

/** One market's labels for one product, laid out once and repeated for every copy. */
export interface ProductLabels {
  readonly labels: { plan: LabelPlan; layout: LabelLayout }[];
  readonly problems: LabelFitProblem[];
}

const dims = (stock: LabelStock) =>
  `${mmForName(stock.labelWidthMm)} × ${mmForName(stock.labelHeightMm)} mm`;

/** A field's panel: the maker's placement when the rules allow it, else its default. */
function panelOf(field: LabelField, placement: LabelSheetRequest['placement']): LabelPanel {
  return placement[field.key] ?? field.defaultPanel;
}

/** The labels one product carries in one market, before layout. */
function plansFor(
  req: LabelSheetRequest,
  content: LabelContent,
): {
  plans: LabelPlan[];
  problems: LabelFitProblem[];
} {
  const { stock } = req;
  const base = {
    market: content.market,
    widthMm: stock.labelWidthMm,
    heightMm: stock.labelHeightMm,
    shape: stock.shape,
  };
  const code = content.barcode ? { kind: req.barcode, text: content.barcode.hri } : null;
  if (req.layout === 'small') {
    return {
      plans: [
        {
          ...base,
          labelName: `small-item label (${dims(stock)})`,
          principal: true,
          fields: content.fields.filter((f) => f.onSmallLabel),
          barcode: req.publicUrl
            ? { kind: 'qrcode', text: marketPageUrl(req.publicUrl, content.market) }
            : null,
        },
      ],
      problems: [],
    };
  }
  if (req.layout === 'single') {
    return {
      plans: [
        {
          ...base,
          labelName: `label (${dims(stock)})`,
          principal: true,
          fields: content.fields,
          barcode: code,
        },
      ],
      problems: [],
    };
  }
  const problems: LabelFitProblem[] = [];
  for (const field of content.fields) {
    const panel = panelOf(field, req.placement);
    if (!field.allowedPanels.includes(panel)) {
      problems.push({
        market: content.market,
        label: `${panel} label (${dims(stock)})`,
        field: field.key,
        fieldName: field.name,
        message: `${field.name} must go on the ${field.allowedPanels.join(' or ')} label (${field.minimum.source}).`,
        minimumMm: field.minimum.mm,
        source: field.minimum.source,
      });
    }
  }
  const on = (panel: LabelPanel) =>
    content.fields.filter((f) => {
      const chosen = panelOf(f, req.placement);
      return (f.allowedPanels.includes(chosen) ? chosen : f.defaultPanel) === panel;
    });
  const front = on('front');
  const back = on('back');
  const codePanel: LabelPanel = front.some((f) => f.key === 'lot') ? 'front' : 'back';
  return {
    plans: [
      {
        ...base,
        labelName: `front label (${dims(stock)})`,
        principal: true,
        fields: front,
        barcode: codePanel === 'front' ? code : null,
      },
      {
        ...base,
        labelName: `back label (${dims(stock)})`,
        principal: false,
        fields: back,
        barcode: codePanel === 'back' ? code : null,
      },
    ],
    problems,
  };
}

/** Lays out each market's labels once; every copy of a market prints the same layout. */
export function layoutProducts(req: LabelSheetRequest): ProductLabels[] {
  return req.contents.map((content) => {
    const { plans, problems } = plansFor(req, content);
    const labels = plans.map((plan) => {
      const { layout, problems: found } = layoutLabel(plan);
      problems.push(...found);
      return { plan, layout };
    });
    return { labels, problems };
  });
}

/** Labels per product: two (front and back) in the `panels` layout, else one. */
export const labelsPerProduct = (layout: LayoutChoice) => (layout === 'panels' ? 2 : 1);

/** Labels on one page: the sheet's grid, or one for a roll. */
export const labelsPerPage = (stock: LabelStock) => labelPositions(stock).length;

/** The first label's slot on the first page, from 0; a start beyond the sheet is a 400. */
export function firstSlot(req: Pick<LabelSheetRequest, 'stock' | 'startPosition'>): number {
  if (req.stock.kind === 'roll') return 0;
  const perPage = labelsPerPage(req.stock);
  if (
    !Number.isInteger(req.startPosition) ||
    req.startPosition < 1 ||
    req.startPosition > perPage
  ) {
    throw new AppError(400, 'validation_failed', 'The first position is not on this sheet.', {
      startPosition: [`This sheet has positions 1 to ${perPage}`],
    });
  }
  return req.startPosition - 1;
}
