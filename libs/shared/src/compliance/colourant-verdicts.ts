import type { ComplianceMarket } from '../reference-data/reference-row';
import { matchEuColourant, matchUsColourant } from './colourant-matching';
import type { ColourantVerdict, ComplianceFinding } from './evaluation-result-schema';
import type { ProductInput } from './evaluation-input-schema';
import { makeFinding } from './finding-builder';
import type { ExpandedIngredient } from './formula-expansion';
import { baseColourIndex, normaliseName } from './ingredient-names';
import { verdictOf, type VerdictWithFindings } from './colourant-verdict-types';
import { euColourantVerdict } from './eu-colourant-rules';
import { usColourantVerdict } from './us-colourant-rules';

/** A colourant summed over every line it arrives through. */
export interface ColourantOccurrence {
  readonly subject: string;
  readonly inci: string;
  readonly usName: string | undefined;
  readonly colourIndex: string | undefined;
  readonly nano: boolean;
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
    const key = `${ingredient.colourIndex ?? ''}|${normaliseName(ingredient.usName ?? ingredient.inci)}|${ingredient.nano}`;
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
    const named = ci !== undefined && !label.includes(ci) ? `${label} (CI ${ci})` : label;
    const subject = first.nano ? `${named} (nano)` : named;
    return {
      subject,
      inci: first.inci,
      usName: first.usName,
      colourIndex: ci,
      nano: first.nano,
      percent,
      lines,
    };
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
    const groups = groupByColour(market, colourants, asOf);
    for (const colourant of colourants) {
      const group = groups.get(colourant)!;
      const result = verdictFor(market, colourant, group, product, asOf);
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

/** The forms of one colour in a market, summed. */
interface ColourGroup {
  readonly totalPercent: number;
  readonly lines: readonly number[];
}

/**
 * Groups the occurrences that are one colour in a market's eyes, so a limit applies to the colour in
 * total: in the US, every form matching the same listing (a dye and its lakes: 21 CFR 74.2333(c),
 * "3 percent total color by weight"); in the EU and UK, every form with the same CI number, salts and
 * lakes included (Annex IV preamble: "a colorant shall include its salts and lakes"), nano apart.
 */
export function groupByColour(
  market: ComplianceMarket,
  colourants: readonly ColourantOccurrence[],
  asOf: string,
): Map<ColourantOccurrence, ColourGroup> {
  const keyOf = (c: ColourantOccurrence): string => {
    if (market === 'US') {
      const match = matchUsColourant(c, asOf);
      if (match.kind === 'listed') return `us:${match.row.id}`;
      if (match.kind === 'not-permitted') return `us-np:${match.row.id}`;
    } else if (c.colourIndex !== undefined) {
      return `ci:${baseColourIndex(c.colourIndex)}|${c.nano}`;
    }
    return `own:${c.colourIndex ?? ''}|${normaliseName(c.usName ?? c.inci)}|${c.nano}`;
  };
  const byKey = new Map<string, ColourantOccurrence[]>();
  for (const c of colourants) {
    const key = keyOf(c);
    const list = byKey.get(key);
    if (list) list.push(c);
    else byKey.set(key, [c]);
  }
  const groups = new Map<ColourantOccurrence, ColourGroup>();
  for (const members of byKey.values()) {
    const totalPercent = members.reduce((sum, c) => sum + c.percent, 0);
    const lines = [...new Set(members.flatMap((c) => c.lines))].sort((a, b) => a - b);
    for (const c of members) groups.set(c, { totalPercent, lines });
  }
  return groups;
}

function verdictFor(
  market: ComplianceMarket,
  colourant: ColourantOccurrence,
  group: ColourGroup,
  product: ProductInput,
  asOf: string,
): VerdictWithFindings {
  const base = {
    subject: colourant.subject,
    colourIndex: colourant.colourIndex ?? null,
    percent: colourant.percent,
    totalPercent: group.totalPercent,
    otherFormLines: group.lines.filter((l) => !colourant.lines.includes(l)),
    nano: colourant.nano,
    lines: colourant.lines,
  };
  if (market === 'CA') {
    return {
      verdict: verdictOf(base, {
        listing: null,
        verdict: 'not-checked',
        conditions: [],
        source: 'Cosmetic Ingredient Hotlist',
        status: null,
      }),
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
