import type { ComplianceMarket } from '../reference-data/reference-row';
import { evaluateAllergens, sumAllergens } from './allergen-declarations';
import { matchUsColourant } from './colourant-matching';
import { collectColourants, evaluateColourants } from './colourant-verdicts';
import { buildDeclaration } from './declarations';
import type { EvaluationInput } from './evaluation-input-schema';
import type { ComplianceFinding, Declaration, EvaluationResult } from './evaluation-result-schema';
import { makeFinding } from './finding-builder';
import { expandFormula, type ExpandedIngredient } from './formula-expansion';
import { checkFragranceMaximums } from './fragrance-maximums';
import { checkRequiredWarnings } from './required-warning-checks';
import { checkRestrictedSubstances } from './restricted-substances';
import { allergenDataFindings } from './scent-materials';
import { labelDetailFindings } from './label-details';
import { soapFindings } from './soap-rules';

/** Blocks first, then checks, then notes: the order findings are listed in. */
export const SEVERITY_ORDER = { block: 0, warn: 1, info: 2 } as const;

const INCIDENTAL_SOURCE: Record<ComplianceMarket, { source: string; status: 'C2' | 'M' }> = {
  US: { source: '21 CFR 701.3(l)', status: 'C2' },
  EU: {
    source:
      'Regulation (EC) No 1223/2009, Art. 19(1)(g) (impurities and subsidiary technical materials are not ingredients)',
    status: 'M',
  },
  UK: {
    source:
      'UK Cosmetics Regulation, Art. 19(1)(g) (impurities and subsidiary technical materials are not ingredients)',
    status: 'M',
  },
  CA: { source: 'Cosmetic Regulations (C.R.C., c. 869)', status: 'M' },
};

/**
 * Evaluates a formula for every market asked: ingredient declarations, colourant verdicts, fragrance
 * maximums, fragrance allergens and required warnings, each finding naming the rule it comes from.
 * Pure and synchronous. Pass input already parsed by `evaluationInputSchema`; on such input it does
 * not throw.
 */
export function evaluateFormula(input: EvaluationInput): EvaluationResult {
  const { asOf, product } = input;
  const markets = [...new Set(input.markets)];
  const { totalGrams, lines, ingredients } = expandFormula(input);
  const findings: ComplianceFinding[] = [];

  const usListedNames = new Map<ExpandedIngredient, string>();
  if (markets.includes('US')) {
    for (const ingredient of ingredients) {
      if (!ingredient.isColourant || ingredient.usName !== undefined) continue;
      const match = matchUsColourant(ingredient, asOf);
      // from memory: 21 CFR 82.51 names a lake by its straight colour followed by the lake designation.
      if (match.kind === 'listed')
        usListedNames.set(
          ingredient,
          match.lakeName ? `${match.row.name} ${match.lakeName}` : match.row.name,
        );
    }
  }

  const colourants = evaluateColourants(collectColourants(ingredients), product, markets, asOf);
  findings.push(...colourants.findings);
  findings.push(...checkFragranceMaximums(input, totalGrams));
  findings.push(...allergenDataFindings(input, markets));
  const restricted = checkRestrictedSubstances(input, ingredients, totalGrams, markets);
  findings.push(...restricted.findings);
  const allergens = evaluateAllergens(
    sumAllergens(input, ingredients, totalGrams),
    product,
    markets,
    asOf,
  );
  findings.push(...allergens.findings);
  const warnings = checkRequiredWarnings(product, ingredients, markets, asOf);
  findings.push(...warnings.findings);
  for (const market of markets) {
    const list = warnings.warnings[market] ?? [];
    for (const text of restricted.labelWarnings[market] ?? [])
      if (!list.includes(text)) list.push(text);
    warnings.warnings[market] = list;
  }

  const declarations: Partial<Record<ComplianceMarket, Declaration>> = {};
  const incidental = ingredients.filter((i) => i.incidental);
  for (const market of markets) {
    declarations[market] = buildDeclaration(
      market,
      ingredients,
      totalGrams,
      usListedNames,
      allergens.additions[market],
    );
    if (incidental.length > 0) {
      const names = [...new Set(incidental.map((i) => i.inci))].join(', ');
      findings.push(
        makeFinding({
          code: 'DECLARATION_INCIDENTAL_OMITTED',
          severity: 'info',
          market,
          subject: names,
          message: `Left off the ingredient list as incidental (no technical effect in the product): ${names}. If in doubt, declare it.`,
          ...INCIDENTAL_SOURCE[market],
          lines: incidental.map((i) => i.line),
        }),
      );
    }
  }

  findings.push(...labelDetailFindings(product));
  const checked = soapFindings(product, markets, findings);
  checked.sort((a, b) => SEVERITY_ORDER[a.severity] - SEVERITY_ORDER[b.severity]);
  return {
    asOf,
    markets,
    totalGrams,
    lines,
    declarations,
    allergens: allergens.allergens,
    colourants: colourants.verdicts,
    warnings: warnings.warnings,
    findings: checked,
  };
}
