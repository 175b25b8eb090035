import * as z from 'zod';
import {
  complianceFindingSchema,
  type ComplianceFinding,
} from '../compliance/evaluation-result-schema';
import { complianceMarketSchema, type ComplianceMarket } from '../reference-data/reference-row';
import type { FormulaVersion } from './formula-schema';

/** How one material's line changed between two versions. */
export const lineChangeSchema = z.object({
  materialId: z.string(),
  materialName: z.string(),
  change: z.enum(['added', 'removed', 'changed', 'unchanged']),
  fromGrams: z.number().nullable(),
  toGrams: z.number().nullable(),
  fromPercent: z.number().nullable(),
  toPercent: z.number().nullable(),
  /**
   * Whether the line's share of the batch moved although its own grams did not (another line
   * changed): shown beside the line, never flagged as a change.
   */
  percentMoved: z.boolean(),
});
export type LineChange = z.infer<typeof lineChangeSchema>;

/** How one market's declaration and findings changed. */
export const marketChangeSchema = z.object({
  market: complianceMarketSchema,
  fromDeclaration: z.string().nullable(),
  toDeclaration: z.string().nullable(),
  /** Whether the printed declaration differs. */
  declarationChanged: z.boolean(),
  ingredientsAdded: z.array(z.string()),
  ingredientsRemoved: z.array(z.string()),
  findingsAdded: z.array(complianceFindingSchema),
  findingsRemoved: z.array(complianceFindingSchema),
});
export type MarketChange = z.infer<typeof marketChangeSchema>;

/** Output of the compare route. */
export const versionComparisonSchema = z.object({
  from: z.number().int(),
  to: z.number().int(),
  lines: z.array(lineChangeSchema),
  markets: z.array(marketChangeSchema),
});
export type VersionComparison = z.infer<typeof versionComparisonSchema>;

type Comparable = Pick<FormulaVersion, 'number' | 'lines' | 'evaluation'>;

/** Grams and percent per material (a material on two lines counts once, summed). */
function byMaterial(v: Comparable) {
  const map = new Map<string, { name: string; grams: number; percent: number }>();
  for (const l of v.lines) {
    const e = map.get(l.materialId) ?? { name: l.materialName, grams: 0, percent: 0 };
    e.grams += l.grams;
    e.percent += l.percent;
    map.set(l.materialId, e);
  }
  return map;
}

// A finding is "the same" across versions when its rule, market and subject match; the message
// carries percentages that move with every gram, so it is left out of the key.
// A substitute's finding is its own finding: the same rule for another material on another line.
const findingKey = (f: ComplianceFinding) =>
  `${f.code}|${f.market ?? '*'}|${f.subject}` +
  (f.substitute ? `|${f.substitute.lineNumber}|${f.substitute.materialId}` : '');
const round = (n: number) => Math.round(n * 10_000) / 10_000;

/**
 * Compares two versions: which lines were added, removed or changed (a line changed when its grams
 * did; a share that moved only because another line changed is reported as `percentMoved`), and per
 * market how the declaration and the findings moved. Findings without a market (IFRA maxima) are
 * reported under every market compared.
 */
export function compareVersions(from: Comparable, to: Comparable): VersionComparison {
  const a = byMaterial(from);
  const b = byMaterial(to);
  const lines: LineChange[] = [];
  for (const id of new Set([...a.keys(), ...b.keys()])) {
    const x = a.get(id);
    const y = b.get(id);
    const change = !x
      ? 'added'
      : !y
        ? 'removed'
        : round(x.grams) === round(y.grams)
          ? 'unchanged'
          : 'changed';
    lines.push({
      materialId: id,
      materialName: (y ?? x)!.name,
      change,
      fromGrams: x ? round(x.grams) : null,
      toGrams: y ? round(y.grams) : null,
      fromPercent: x ? round(x.percent) : null,
      toPercent: y ? round(y.percent) : null,
      percentMoved: change === 'unchanged' && round(x!.percent) !== round(y!.percent),
    });
  }

  const markets = new Set<ComplianceMarket>([
    ...(from.evaluation?.markets ?? []),
    ...(to.evaluation?.markets ?? []),
  ]);
  const findingsOf = (v: Comparable, m: ComplianceMarket) =>
    (v.evaluation?.findings ?? []).filter((f) => f.market === m || f.market === null);
  const marketChanges: MarketChange[] = [...markets].map((market) => {
    const fromDecl = from.evaluation?.declarations[market];
    const toDecl = to.evaluation?.declarations[market];
    const fromNames = new Set(fromDecl?.ingredients ?? []);
    const toNames = new Set(toDecl?.ingredients ?? []);
    const fromFindings = findingsOf(from, market);
    const toFindings = findingsOf(to, market);
    const fromKeys = new Set(fromFindings.map(findingKey));
    const toKeys = new Set(toFindings.map(findingKey));
    return {
      market,
      fromDeclaration: fromDecl?.text ?? null,
      toDeclaration: toDecl?.text ?? null,
      declarationChanged: (fromDecl?.text ?? null) !== (toDecl?.text ?? null),
      ingredientsAdded: [...toNames].filter((n) => !fromNames.has(n)),
      ingredientsRemoved: [...fromNames].filter((n) => !toNames.has(n)),
      findingsAdded: toFindings.filter((f) => !fromKeys.has(findingKey(f))),
      findingsRemoved: fromFindings.filter((f) => !toKeys.has(findingKey(f))),
    };
  });
  return { from: from.number, to: to.number, lines, markets: marketChanges };
}
