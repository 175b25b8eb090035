import type { ComplianceMarket } from '../reference-data/reference-row';
import { matchEuColourant, matchUsColourant } from './colourant-matching';
import type { ColourantVerdict, ComplianceFinding } from './evaluation-result-schema';
import type { ProductInput } from './evaluation-input-schema';
import { makeFinding } from './finding-builder';
import type { ExpandedIngredient } from './formula-expansion';
import { normaliseName } from './ingredient-names';
import type { VerdictWithFindings } from './colourant-verdict-types';
import { euColourantVerdict } from './eu-colourant-rules';
import { usColourantVerdict } from './us-colourant-rules';

/** A colourant summed over every line it arrives through. */
export interface ColourantOccurrence {
  readonly subject: string;
  readonly inci: string;
  readonly usName: string | undefined;
  readonly colourIndex: string | undefined;
  readonly percent: number;
  readonly lines: number[];
}

/** Gathers every colourant, including those inside blends, summing the same colourant across lines. */
export function collectColourants(
  ingredients: readonly ExpandedIngredient[],
): ColourantOccurrence[] {
  const byKey = new Map<string, { first: ExpandedIngredient; percent: number; lines: number[] }>();
  for (const ingredient of ingredients) {
    if (!ingredient.isColourant) continue;
    const key = `${ingredient.colourIndex ?? ''}|${normaliseName(ingredient.usName ?? ingredient.inci)}`;
    const entry = byKey.get(key);
    if (entry) {
      entry.percent += ingredient.percent;
      entry.lines.push(ingredient.line);
    } else
      byKey.set(key, { first: ingredient, percent: ingredient.percent, lines: [ingredient.line] });
  }
  return [...byKey.values()].map(({ first, percent, lines }) => {
    const label = first.usName ?? first.inci;
    const ci = first.colourIndex;
    const subject = ci !== undefined && !label.includes(ci) ? `${label} (CI ${ci})` : label;
    return { subject, inci: first.inci, usName: first.usName, colourIndex: ci, percent, lines };
  });
}

const UK_PREFIX = 'UK Cosmetics Regulation (retained Regulation (EC) No 1223/2009)';

/** Colourant verdicts and findings for every market, against the product's exposure. */
export function evaluateColourants(
  colourants: readonly ColourantOccurrence[],
  product: ProductInput,
  markets: readonly ComplianceMarket[],
  asOf: string,
): {
  verdicts: Partial<Record<ComplianceMarket, ColourantVerdict[]>>;
  findings: ComplianceFinding[];
} {
  const verdicts: Partial<Record<ComplianceMarket, ColourantVerdict[]>> = {};
  const findings: ComplianceFinding[] = [];
  for (const market of markets) {
    const list: ColourantVerdict[] = [];
    for (const colourant of colourants) {
      const result = verdictFor(market, colourant, product, asOf);
      list.push(result.verdict);
      findings.push(...result.findings);
    }
    if (market === 'CA' && colourants.length > 0) {
      findings.push(
        makeFinding({
          code: 'COLOURANT_NOT_CHECKED',
          severity: 'info',
          market,
          subject: 'Colourants',
          message:
            "Batchproof does not yet hold Canada's colourant rules: check each colourant against Health Canada's Cosmetic Ingredient Hotlist.",
          source: 'Cosmetic Regulations (C.R.C., c. 869); Cosmetic Ingredient Hotlist',
          status: 'C2',
          lines: colourants.flatMap((c) => c.lines),
        }),
      );
    }
    verdicts[market] = list;
  }
  return { verdicts, findings };
}

function verdictFor(
  market: ComplianceMarket,
  colourant: ColourantOccurrence,
  product: ProductInput,
  asOf: string,
): VerdictWithFindings {
  const base = {
    subject: colourant.subject,
    colourIndex: colourant.colourIndex ?? null,
    percent: colourant.percent,
    lines: colourant.lines,
  };
  if (market === 'CA') {
    return {
      verdict: {
        ...base,
        listing: null,
        verdict: 'not-checked',
        conditions: [],
        source: 'Cosmetic Ingredient Hotlist',
        status: null,
      },
      findings: [],
    };
  }
  if (market === 'US') return usColourantVerdict(base, matchUsColourant(colourant, asOf), product);
  const row = matchEuColourant(colourant, asOf);
  const result = euColourantVerdict(base, row, product, market);
  if (market !== 'UK') return result;
  const ukSource = (source: string) => source.replace('Regulation (EC) No 1223/2009', UK_PREFIX);
  return {
    verdict: { ...result.verdict, source: ukSource(result.verdict.source) },
    findings: result.findings.map((f) => ({ ...f, source: ukSource(f.source) })),
  };
}
