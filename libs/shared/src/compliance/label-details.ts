import type { ProductInput } from './evaluation-input-schema';
import type { ComplianceFinding } from './evaluation-result-schema';
import { makeFinding } from './finding-builder';

/**
 * What a label will need from the product profile: the net quantity (21 CFR 701.13; Regulation (EC)
 * No 1223/2009, Art. 19(1)(b)) and the unit mass a batch is scaled by. Missing ones are a Check that
 * names them, so a version is not released with nothing to print.
 */
export function labelDetailFindings(product: ProductInput): ComplianceFinding[] {
  const missing: string[] = [];
  if (!product.netQuantity) missing.push('net quantity');
  if (product.unitMassGrams === undefined) missing.push('unit mass');
  if (missing.length === 0) return [];
  return [
    makeFinding({
      code: 'LABEL_DETAILS_MISSING',
      severity: 'warn',
      market: null,
      subject: product.name,
      message: `Enter the ${missing.join(' and ')} in the product profile: labels will not print without ${missing.length > 1 ? 'them' : 'it'}, and every market requires the net quantity on the pack.`,
      source: '21 CFR 701.13; Regulation (EC) No 1223/2009, Art. 19(1)(b)',
      status: 'C2',
      lines: [],
    }),
  ];
}
