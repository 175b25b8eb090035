import {
  ALLERGEN_LABELLING_THRESHOLD_PERCENT,
  CA_ALLERGEN_LABELLING_FROM,
  EU_ALLERGEN_AVAILABILITY_DEADLINE,
  EU_ALLERGEN_PLACING_DEADLINE,
  type EuAnnexIiiAllergen,
} from '../reference-data/eu-annex-iii-allergens';
import { addDays } from '../dates/calendar-day';
import type { ComplianceMarket, ReferenceStatus } from '../reference-data/reference-row';
import { matchAnnexIiiAllergen } from './allergen-matching';
import { matchRestricted } from './restricted-substances';
import type { AllergenAddition } from './declarations';
import type { EvaluationInput, ProductInput } from './evaluation-input-schema';
import {
  DEFER_TO_ASSESSOR,
  type AllergenResult,
  type ComplianceFinding,
} from './evaluation-result-schema';
import { formatPercent, makeFinding } from './finding-builder';
import type { ExpandedIngredient } from './formula-expansion';
import { normaliseName } from './ingredient-names';
import { classificationFinding, noUsRuleFinding } from './allergen-findings';

/** One allergen summed over the formula: through fragrances and as a directly added ingredient. */
export interface AllergenTotal {
  readonly row: EuAnnexIiiAllergen | null;
  readonly name: string;
  readonly cas: string | undefined;
  /** Grams arriving inside fragrances and essential oils (declared under "Parfum" unless named). */
  fragranceGrams: number;
  /** Grams added as an ingredient in their own right (declared anyway). */
  directGrams: number;
  percent: number;
  readonly lines: number[];
}

/** Tolerance so that 0.5 % × 0.2 % = 0.001 % does not "exceed" 0.001 % through float noise. */
const RELATIVE_EPSILON = 1e-9;

/** Whether an amount exceeds a threshold; Annex III says "exceeds", so equal does not trigger. */
export function exceedsThreshold(percent: number, thresholdPercent: number): boolean {
  return percent > thresholdPercent * (1 + RELATIVE_EPSILON);
}

/**
 * Sums each allergen over the formula: percent in product = percent in the fragrance × the line's
 * percent, added up over every line, plus any line or blend component that is the allergen itself.
 */
export function sumAllergens(
  input: EvaluationInput,
  ingredients: readonly ExpandedIngredient[],
  totalGrams: number,
): AllergenTotal[] {
  const totals = new Map<string, AllergenTotal>();
  const entry = (
    row: EuAnnexIiiAllergen | null,
    name: string,
    cas: string | undefined,
  ): AllergenTotal => {
    const key = row ? row.id : `unlisted:${normaliseName(name)}`;
    let total = totals.get(key);
    if (!total) {
      const display = row && row.labelNameStatus !== 'M' ? row.labelName : name;
      total = { row, name: display, cas, fragranceGrams: 0, directGrams: 0, percent: 0, lines: [] };
      totals.set(key, total);
    }
    return total;
  };
  input.lines.forEach((line, index) => {
    if (line.grams <= 0 || !line.material.fragrance) return;
    for (const allergen of line.material.fragrance.allergens) {
      if (allergen.percent <= 0) continue;
      const total = entry(matchAnnexIiiAllergen(allergen), allergen.inci, allergen.cas);
      total.fragranceGrams += (line.grams * allergen.percent) / 100;
      total.lines.push(index);
    }
  });
  for (const ingredient of ingredients) {
    if (ingredient.fragranceWord) continue;
    const row = matchAnnexIiiAllergen({ inci: ingredient.inci });
    if (!row) continue;
    const total = entry(row, ingredient.inci, undefined);
    total.directGrams += ingredient.grams;
    total.lines.push(ingredient.line);
  }
  const list = [...totals.values()];
  for (const total of list)
    total.percent = ((total.fragranceGrams + total.directGrams) / totalGrams) * 100;
  return list.sort((a, b) => b.percent - a.percent || a.name.localeCompare(b.name));
}

interface Requirement {
  required: boolean;
  requiredFrom: string | null;
  source: string;
  status: ReferenceStatus;
}

const EU_SOURCE = 'Regulation (EC) No 1223/2009, Annex III';
const EU_NEW_SOURCE =
  'Regulation (EC) No 1223/2009, Annex III, as amended by Regulation (EU) 2023/1545';
const UK_SOURCE = 'UK Cosmetics Regulation (retained Regulation (EC) No 1223/2009), Annex III';
const CA_SOURCE =
  'Cosmetic Regulations as amended by SOR/2024-63 (EU Annex III incorporated by reference)';

/** First day labels of products placed on the EU market must name the 2023/1545 allergens. */
const EU_NEW_ALLERGENS_FROM = addDays(EU_ALLERGEN_PLACING_DEADLINE, 1);

/** Whether, and from when, a market requires naming an allergen entry. */
function requirementFor(
  market: ComplianceMarket,
  row: EuAnnexIiiAllergen | null,
  asOf: string,
): Requirement {
  const isNew = row?.origin === 'EU 2023/1545';
  switch (market) {
    case 'US':
      return {
        required: false,
        requiredFrom: null,
        source: 'FD&C Act 609(b) (MoCRA): allergen rule not yet made',
        status: 'C',
      };
    case 'EU':
      if (!isNew) return { required: true, requiredFrom: null, source: EU_SOURCE, status: 'C' };
      return {
        required: asOf >= EU_NEW_ALLERGENS_FROM,
        requiredFrom: EU_NEW_ALLERGENS_FROM,
        source: EU_NEW_SOURCE,
        status: 'C',
      };
    case 'UK':
      // from memory: GB adoption of the 2023/1545 list is not confirmed; Batchproof mirrors the EU dates as a precaution.
      if (!isNew) return { required: true, requiredFrom: null, source: UK_SOURCE, status: 'C2' };
      return {
        required: asOf >= EU_NEW_ALLERGENS_FROM,
        requiredFrom: EU_NEW_ALLERGENS_FROM,
        source: `${UK_SOURCE} (EU 2023/1545 dates mirrored)`,
        status: 'M',
      };
    case 'CA': {
      // Secondary sources disagree on 31 Jul vs 1 Aug 2026 for the expanded list; both give 1 Aug 2026 as the first day.
      const from = isNew ? EU_NEW_ALLERGENS_FROM : CA_ALLERGEN_LABELLING_FROM;
      return { required: asOf >= from, requiredFrom: from, source: CA_SOURCE, status: 'C2' };
    }
  }
}

/** Allergen results, label additions and findings for every market. */
export function evaluateAllergens(
  totals: readonly AllergenTotal[],
  product: ProductInput,
  markets: readonly ComplianceMarket[],
  asOf: string,
): {
  allergens: Partial<Record<ComplianceMarket, AllergenResult[]>>;
  additions: Partial<Record<ComplianceMarket, AllergenAddition[]>>;
  findings: ComplianceFinding[];
} {
  const threshold = ALLERGEN_LABELLING_THRESHOLD_PERCENT[product.use];
  const allergens: Partial<Record<ComplianceMarket, AllergenResult[]>> = {};
  const additions: Partial<Record<ComplianceMarket, AllergenAddition[]>> = {};
  const findings: ComplianceFinding[] = [];
  for (const market of markets) {
    const results: AllergenResult[] = [];
    const added: AllergenAddition[] = [];
    const classificationMatters: AllergenTotal[] = [];
    for (const total of totals) {
      const req = requirementFor(market, total.row, asOf);
      const over = exceedsThreshold(total.percent, threshold);
      const declared = req.required && over;
      results.push({
        inci: total.name,
        percent: total.percent,
        declared,
        thresholdPercent: market === 'US' ? null : threshold,
        annexRef: total.row?.annexRef ?? null,
        requiredFrom: req.requiredFrom,
      });
      if (declared) added.push({ name: total.name, grams: total.fragranceGrams });
      if (market === 'US') continue;
      const base = { market, subject: total.name, lines: total.lines };
      if (!req.required && over && req.requiredFrom) {
        findings.push(
          makeFinding({
            ...base,
            code: 'ALLERGEN_UPCOMING',
            severity: 'info',
            message: `${total.name} is ${formatPercent(total.percent)} of the product, above the ${threshold} % threshold: labels must name it from ${req.requiredFrom}${total.row?.origin === 'EU 2023/1545' ? ` (products not naming it may be placed on the market until ${EU_ALLERGEN_PLACING_DEADLINE} and made available until ${EU_ALLERGEN_AVAILABILITY_DEADLINE})` : ''}. You may name it now.`,
            source: req.source,
            status: req.status,
          }),
        );
      }
      if (
        !total.row &&
        declared &&
        !matchRestricted(market, { inci: total.name, cas: total.cas }).some((m) => m.row.prohibited)
      ) {
        findings.push(
          makeFinding({
            ...base,
            code: 'ALLERGEN_NOT_LISTED',
            severity: 'warn',
            message: `${total.name}${total.cas ? ` (CAS ${total.cas})` : ''} is not on Batchproof's Annex III list. It is named on the label as a precaution because it is above ${threshold} %; check its name and CAS number with your supplier.`,
            source: EU_SOURCE,
            status: 'C',
          }),
        );
      }
      const overLeaveOn = exceedsThreshold(
        total.percent,
        ALLERGEN_LABELLING_THRESHOLD_PERCENT['leave-on'],
      );
      if (
        total.row &&
        req.required &&
        !over &&
        overLeaveOn &&
        product.inBath &&
        product.use === 'rinse-off'
      ) {
        classificationMatters.push(total);
      }
      if (
        market !== 'CA' &&
        total.row?.maxPercent !== undefined &&
        total.percent > total.row.maxPercent
      ) {
        findings.push(
          makeFinding({
            ...base,
            code: 'ALLERGEN_OVER_MAXIMUM',
            severity: 'block',
            message: `${total.name} is ${formatPercent(total.percent)} of the product; Annex III entry ${total.row.annexRef} allows at most ${total.row.maxPercent} % in cosmetic products other than oral products. ${DEFER_TO_ASSESSOR}`,
            source: market === 'UK' ? UK_SOURCE : EU_SOURCE,
            status: total.row.status,
          }),
        );
      }
    }
    if (market === 'US' && totals.length > 0) findings.push(noUsRuleFinding(totals));
    if (classificationMatters.length > 0)
      findings.push(classificationFinding(market, classificationMatters, threshold));
    results.sort((a, b) => b.percent - a.percent || a.inci.localeCompare(b.inci));
    allergens[market] = results;
    additions[market] = added;
  }
  return { allergens, additions, findings };
}
