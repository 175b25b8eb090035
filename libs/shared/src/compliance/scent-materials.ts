import { euAnnexIiiAllergens } from '../reference-data/eu-annex-iii-allergens';
import { CA_ALLERGEN_LABELLING_FROM } from '../reference-data/eu-annex-iii-allergen-row';
import { essentialOilHints } from '../reference-data/essential-oil-hints';
import type { EssentialOilHint } from '../reference-data/essential-oil-hint-row';
import type { ComplianceMarket } from '../reference-data/reference-row';
import type { EvaluationInput, MaterialInput } from './evaluation-input-schema';
import type { ComplianceFinding } from './evaluation-result-schema';
import { makeFinding } from './finding-builder';
import { fragranceWordOf, normaliseName } from './ingredient-names';

const hintByName = new Map<string, EssentialOilHint>();
const hintByCas = new Map<string, EssentialOilHint>();
for (const hint of essentialOilHints) {
  for (const name of hint.inciNames) hintByName.set(normaliseName(name), hint);
  for (const cas of hint.cas) hintByCas.set(cas, hint);
}

/** Annex III entries that are natural extracts (oils, absolutes, extracts), by CAS and by listed name. */
const naturalByCas = new Map<string, string>();
const naturalByName = new Map<string, string>();
for (const row of euAnnexIiiAllergens) {
  for (const substance of row.substances) {
    if (!/\b(oil|oils|extract|extracts|absolute|balsam|resinoid)\b/i.test(substance.name)) continue;
    if (substance.cas) naturalByCas.set(substance.cas, row.labelName);
    naturalByName.set(normaliseName(substance.name), row.labelName);
  }
}

const SCENT_FUNCTION = /fragranc|perfum|parfum|flavou?r|\baroma\b|odou?r|scent/i;

/** Why a material (or a blend component) counts as fragrant, or null when it does not. */
export interface ScentReason {
  readonly why: string;
  /** The typical allergens hint, when the table knows the oil. */
  readonly hint: EssentialOilHint | null;
}

function reasonFor(part: {
  inci: string;
  cas?: string | undefined;
  functions?: readonly string[] | undefined;
}): ScentReason | null {
  const hint =
    (part.cas ? hintByCas.get(part.cas) : undefined) ??
    hintByName.get(normaliseName(part.inci)) ??
    null;
  if (fragranceWordOf(part.inci)) return { why: `its INCI name is "${part.inci}"`, hint };
  if (part.functions?.some((f) => SCENT_FUNCTION.test(f)))
    return { why: 'its function is fragrance or flavour', hint };
  if (hint) return { why: `${hint.name} is known to carry labelled fragrance allergens`, hint };
  const annex =
    (part.cas ? naturalByCas.get(part.cas) : undefined) ??
    naturalByName.get(normaliseName(part.inci));
  if (annex) return { why: `it is listed in Annex III (${annex})`, hint: null };
  return null;
}

/**
 * Whether a material is a fragrance, flavour, essential oil, absolute or extract whose allergens the
 * label may have to name: by its category, function or INCI name, by the essential-oil hint table, or
 * because Annex III (as amended by Regulation (EU) 2023/1545) lists it; a blend counts when one of its
 * components does.
 */
export function scentReasonOf(material: MaterialInput): ScentReason | null {
  if (material.fragrance) return { why: 'it carries fragrance data', hint: null };
  if (material.category === 'fragrance' || material.category === 'essential-oil') {
    const own = reasonFor(material);
    return {
      why: `it is filed as ${material.category === 'fragrance' ? 'a fragrance' : 'an essential oil'}`,
      hint: own?.hint ?? null,
    };
  }
  if (material.components) {
    for (const component of material.components) {
      const reason = reasonFor(component);
      if (reason)
        return { why: `its component ${component.inci}: ${reason.why}`, hint: reason.hint };
    }
    return null;
  }
  return reasonFor(material);
}

const EU_SOURCE = 'Regulation (EC) No 1223/2009, Art. 19(1)(g) and Annex III (labelled allergens)';
const SOURCES: Record<Exclude<ComplianceMarket, 'US'>, string> = {
  EU: EU_SOURCE,
  UK: 'UK Cosmetics Regulation (retained Regulation (EC) No 1223/2009), Art. 19(1)(g) and Annex III',
  CA: 'Cosmetic Regulations as amended by SOR/2024-63 (fragrance allergens)',
};

/**
 * Fragrant materials without the supplier's allergen breakdown: the EU, UK and (from its start date)
 * Canadian ingredient lists cannot be right without it, so those markets are blocked, with what to ask
 * the supplier for and, where known, the allergens such an oil typically carries (a hint, never a
 * substitute for the supplier's sheet).
 */
export function allergenDataFindings(
  input: EvaluationInput,
  markets: readonly ComplianceMarket[],
): ComplianceFinding[] {
  const missing = new Map<string, { name: string; lines: number[]; reason: ScentReason }>();
  input.lines.forEach((line, index) => {
    if (line.grams <= 0) return;
    const { material } = line;
    if (material.fragrance?.allergensDeclared) return;
    const reason = scentReasonOf(material);
    if (!reason) return;
    const key = normaliseName(material.name);
    const entry = missing.get(key);
    if (entry) entry.lines.push(index);
    else missing.set(key, { name: material.name, lines: [index], reason });
  });
  const findings: ComplianceFinding[] = [];
  for (const market of markets) {
    if (market === 'US') continue;
    const upcoming = market === 'CA' && input.asOf < CA_ALLERGEN_LABELLING_FROM;
    for (const { name, lines, reason } of missing.values()) {
      const hint = reason.hint
        ? ` As a hint only: ${reason.hint.name} typically carries ${reason.hint.typicalAllergens.join(', ')} (${reason.hint.source}); only the supplier's figures for this lot's oil can be used.`
        : '';
      findings.push(
        makeFinding({
          code: 'FRAGRANCE_ALLERGEN_DATA_MISSING',
          severity: upcoming ? 'warn' : 'block',
          market,
          subject: name,
          message: `${name} is fragrant (${reason.why}) but has no allergen declaration, so the ${market} ingredient list cannot name the fragrance allergens above 0.001 % (leave-on) or 0.01 % (rinse-off)${upcoming ? ` that Canada requires from ${CA_ALLERGEN_LABELLING_FROM}` : ''}. Ask the supplier for its allergen declaration (each labelled allergen as a percentage of the oil) and enter it on the material.${hint}`,
          source: SOURCES[market],
          status: market === 'EU' ? 'C' : 'C2',
          lines,
        }),
      );
    }
  }
  return findings;
}
