import type { LabelLayout, LabelRunRecord, LotBarcode } from '@batchproof/shared';

/** The layouts in the maker's words. */
export const LAYOUT_NAMES: Record<LabelLayout, string> = {
  single: 'One label',
  panels: 'Front and back',
  small: 'Small item with QR code',
};

/** The barcode kinds in the maker's words. */
export const BARCODE_NAMES: Record<LotBarcode, string> = {
  'gs1-datamatrix': 'GS1 DataMatrix (square)',
  'gs1-128': 'GS1-128 (linear)',
};

/** A run's state in one word with its icon, so it never rests on colour. */
export function runStatus(run: LabelRunRecord): { icon: string; word: string } {
  switch (run.status) {
    case 'rendering':
      return { icon: 'hourglass_top', word: 'Rendering' };
    case 'failed':
      return { icon: 'error_outline', word: 'Failed' };
    case 'ready':
      return { icon: 'check_circle', word: 'Ready' };
  }
}

/** The text a run's list filter matches against. */
export function runSearchText(run: LabelRunRecord): string {
  return [run.formulaName, run.lotCode ?? '', run.stock.name, run.createdBy.name, ...run.markets]
    .join(' ')
    .toLowerCase();
}
