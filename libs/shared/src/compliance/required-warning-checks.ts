import { requiredWarnings, US_FOAMING_BATH_CAUTION } from '../reference-data/required-warnings';
import type { ComplianceMarket } from '../reference-data/reference-row';
import type { ProductInput } from './evaluation-input-schema';
import type { ComplianceFinding } from './evaluation-result-schema';
import { makeFinding } from './finding-builder';
import type { ExpandedIngredient } from './formula-expansion';
import { foamingSurfactants } from '../reference-data/foaming-surfactants';
import {
  isDetergentOrFoamingFunction,
  isUnqualifiedSurfactant,
  normaliseName,
} from './ingredient-names';

const FOAMING_INCI = new Set(
  foamingSurfactants.flatMap((row) => row.inciNames.map((name) => normaliseName(name))),
);

/** Whether an ingredient serves as a detergent or foaming surfactant, by its function or its INCI name. */
export function isFoamingSurfactant(ingredient: {
  inci: string;
  functions: readonly string[];
}): boolean {
  return (
    isDetergentOrFoamingFunction(ingredient.functions) ||
    FOAMING_INCI.has(normaliseName(ingredient.inci))
  );
}

/** FPLA/21 CFR 740.17 directions reminder; the paragraph requiring directions is from memory. */
const DIRECTIONS_SOURCE = '21 CFR 740.17 (directions for safe use; paragraph from memory)';

const CAUTION_ROW = requiredWarnings.find((w) => w.id === 'us-740-17-foaming-detergent-bath')!;

/**
 * Label warnings per market. US: the 21 CFR 740.17 caution on a bath product containing a surfactant
 * serving as a detergent or foaming ingredient, unless the label says it is for adults only.
 */
export function checkRequiredWarnings(
  product: ProductInput,
  ingredients: readonly ExpandedIngredient[],
  markets: readonly ComplianceMarket[],
  asOf: string,
): { warnings: Partial<Record<ComplianceMarket, string[]>>; findings: ComplianceFinding[] } {
  const warnings: Partial<Record<ComplianceMarket, string[]>> = {};
  const findings: ComplianceFinding[] = [];
  for (const market of markets) warnings[market] = [];
  if (!markets.includes('US') || !product.inBath || asOf < (CAUTION_ROW.effectiveFrom ?? ''))
    return { warnings, findings };

  const foaming = ingredients.filter((i) => isFoamingSurfactant(i));
  const unclear = ingredients.filter(
    (i) => !isFoamingSurfactant(i) && isUnqualifiedSurfactant(i.functions),
  );
  const base = { market: 'US' as const, source: CAUTION_ROW.source, status: CAUTION_ROW.status };
  if (foaming.length > 0) {
    const names = [...new Set(foaming.map((i) => i.usName ?? i.inci))].join(', ');
    findings.push(
      // from memory: that 740.17 asks for adequate directions for safe use is not yet confirmed.
      makeFinding({
        code: 'WARNING_FOAMING_BATH_DIRECTIONS',
        severity: 'info',
        market: 'US',
        subject: product.name,
        message: `Foaming bath product (${names}): print directions for safe use on the label (how much to use, how long to soak), as well as any caution.`,
        source: DIRECTIONS_SOURCE,
        status: 'M',
        lines: foaming.map((i) => i.line),
      }),
    );
    if (product.adultsOnly) {
      findings.push(
        makeFinding({
          ...base,
          code: 'WARNING_FOAMING_BATH_ADULTS_ONLY',
          severity: 'info',
          subject: product.name,
          message: `No 740.17 caution added because the product is labelled for adults only. The label must say so clearly, e.g. "For adult use only" or "Keep out of reach of children".`,
          lines: foaming.map((i) => i.line),
        }),
      );
    } else {
      warnings.US!.push(US_FOAMING_BATH_CAUTION);
      findings.push(
        makeFinding({
          ...base,
          code: 'WARNING_FOAMING_BATH_CAUTION',
          severity: 'info',
          subject: product.name,
          message: `Foaming detergent bath product (${names}): the US label needs the 21 CFR 740.17 caution, which Batchproof has added. Bubble baths can irritate skin and the urinary tract, especially in children.`,
          lines: foaming.map((i) => i.line),
        }),
      );
    }
  } else if (unclear.length > 0) {
    const names = [...new Set(unclear.map((i) => i.usName ?? i.inci))].join(', ');
    findings.push(
      makeFinding({
        ...base,
        code: 'WARNING_SURFACTANT_ROLE_CHECK',
        severity: 'warn',
        subject: product.name,
        message: `${names} is marked "surfactant" without saying what it does. If it serves as a detergent or foaming ingredient, this bath product needs the 21 CFR 740.17 caution: mark its function as cleansing or foaming, or as emulsifying or solubilising if it is not.`,
        lines: unclear.map((i) => i.line),
      }),
    );
  }
  return { warnings, findings };
}
