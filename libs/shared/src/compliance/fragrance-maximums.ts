import type { EvaluationInput } from './evaluation-input-schema';
import { DEFER_TO_ASSESSOR, type ComplianceFinding } from './evaluation-result-schema';
import { formatPercent, makeFinding } from './finding-builder';
import { normaliseName } from './ingredient-names';
import { scentReasonOf } from './scent-materials';

/** `Category 9`, `cat. 5a`, ` 9 ` → `9`, `5A`: how IFRA category keys are compared. */
export function normaliseIfraCategory(category: string): string {
  return category
    .trim()
    .replace(/^cat(?:egory)?\.?\s*/i, '')
    .replace(/\s+/g, '')
    .toUpperCase();
}

const IFRA_SOURCE =
  "IFRA Standards (51st Amendment) via the supplier's IFRA certificate of conformity";

/**
 * Checks each fragrance's percent of the finished product (summed when the same fragrance is on
 * several lines) against the maximum the user entered from the supplier's IFRA certificate for the
 * product's category. Over the maximum blocks; no certificate, or no maximum for the category, warns.
 * Fragrant materials are recognised as in {@link scentReasonOf} (fragrances, essential oils, extracts).
 */
export function checkFragranceMaximums(
  input: EvaluationInput,
  totalGrams: number,
): ComplianceFinding[] {
  const category = normaliseIfraCategory(input.product.ifraCategory);
  const findings: ComplianceFinding[] = [];
  const fragrances = new Map<
    string,
    { name: string; grams: number; lines: number[]; maxima: Record<string, number> | null }
  >();
  input.lines.forEach((line, index) => {
    const { material } = line;
    if (line.grams <= 0 || scentReasonOf(material) === null) return;
    const key = normaliseName(material.name);
    const entry = fragrances.get(key) ?? { name: material.name, grams: 0, lines: [], maxima: null };
    entry.grams += line.grams;
    entry.lines.push(index);
    if (material.fragrance && Object.keys(material.fragrance.maxPercentByIfraCategory).length > 0) {
      entry.maxima = {};
      for (const [cat, max] of Object.entries(material.fragrance.maxPercentByIfraCategory))
        entry.maxima[normaliseIfraCategory(cat)] = max;
    }
    fragrances.set(key, entry);
  });

  for (const fragrance of fragrances.values()) {
    const percent = (fragrance.grams / totalGrams) * 100;
    const base = { market: null, subject: fragrance.name, lines: fragrance.lines };
    if (!fragrance.maxima) {
      findings.push(
        makeFinding({
          ...base,
          code: 'FRAGRANCE_DATA_MISSING',
          severity: 'warn',
          message: `${fragrance.name}: no IFRA certificate entered, so Batchproof cannot check it against the maximum for Category ${category}. Ask the supplier for its IFRA certificate of conformity and enter the maxima on the material.`,
          source: IFRA_SOURCE,
          status: 'C',
        }),
      );
      continue;
    }
    const max = fragrance.maxima[category];
    if (max === undefined) {
      findings.push(
        makeFinding({
          ...base,
          code: 'FRAGRANCE_NO_MAXIMUM',
          severity: 'warn',
          message: `${fragrance.name} is ${formatPercent(percent)} of the product, but no maximum is entered for IFRA Category ${category}. Enter the maximum from the supplier's IFRA certificate.`,
          source: IFRA_SOURCE,
          status: 'C',
        }),
      );
    } else if (percent > max * (1 + 1e-9)) {
      findings.push(
        makeFinding({
          ...base,
          code: 'FRAGRANCE_OVER_MAXIMUM',
          severity: 'block',
          message: `${fragrance.name} is ${formatPercent(percent)} of the product; its IFRA certificate allows at most ${max} % for Category ${category}. Reduce it to ${max} % or less. Too much fragrance can cause skin reactions. ${DEFER_TO_ASSESSOR}`,
          source: `${IFRA_SOURCE}, Category ${category}`,
          status: 'C',
        }),
      );
    }
  }

  if (input.product.inBath && fragrances.size > 0 && category !== '9') {
    findings.push(
      makeFinding({
        code: 'IFRA_CATEGORY_CHECK',
        severity: 'warn',
        market: null,
        subject: input.product.name,
        message: `This product is used in the bath but is set to IFRA Category ${category}. Bath bombs are in Category 9 (products with body and hand exposure, primarily rinse off); check the category on your supplier's certificate.`,
        source: 'IFRA Standards, 51st Amendment: product categories (bath bombs in Category 9)',
        status: 'C2',
        lines: [...fragrances.values()].flatMap((f) => f.lines),
      }),
    );
  }
  return findings;
}
