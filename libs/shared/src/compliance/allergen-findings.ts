import type { ComplianceMarket } from '../reference-data/reference-row';
import type { AllergenTotal } from './allergen-declarations';
import type { ComplianceFinding } from './evaluation-result-schema';
import { formatPercent, makeFinding } from './finding-builder';

/** The note that the US has no allergen labelling rule yet. */
export function noUsRuleFinding(totals: readonly AllergenTotal[]): ComplianceFinding {
  return makeFinding({
    code: 'ALLERGEN_NO_US_RULE',
    severity: 'info',
    market: 'US',
    subject: 'Fragrance allergens',
    message:
      'No US rule requires naming fragrance allergens yet: FDA has not issued the rule MoCRA asks for (RIN 0910-AI90). They stay under "Fragrance" on US labels.',
    source: 'FD&C Act 609(b) (MoCRA); Unified Agenda RIN 0910-AI90',
    status: 'C',
    lines: totals.flatMap((t) => t.lines),
  });
}

/** Asks the assessor to confirm rinse-off vs leave-on when it decides what to name. */
export function classificationFinding(
  market: ComplianceMarket,
  totals: readonly AllergenTotal[],
  threshold: number,
): ComplianceFinding {
  const names = totals.map((t) => `${t.name} (${formatPercent(t.percent)})`).join(', ');
  return makeFinding({
    code: 'ALLERGEN_CLASSIFICATION_CHECK',
    severity: 'warn',
    market,
    subject: 'Rinse-off or leave-on',
    message: `${names} would have to be named if this bath product counted as leave-on (0.001 %), but not at the rinse-off threshold (${threshold} %) Batchproof used. How bath products are classed is not settled: confirm with your qualified safety assessor.`,
    source: 'Regulation (EC) No 1223/2009, Annex III (labelling thresholds)',
    status: 'C',
    lines: totals.flatMap((t) => t.lines),
  });
}
