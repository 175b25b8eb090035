import { caHotlistSubstances } from '../reference-data/ca-hotlist-substances';
import { euRestrictedSubstances } from '../reference-data/eu-restricted-substances';
import type { ComplianceMarket, ReferenceStatus } from '../reference-data/reference-row';
import type {
  RestrictedForm,
  RestrictedSubstance,
  RestrictionLimit,
} from '../reference-data/restricted-substance-row';
import type { EvaluationInput, ProductInput } from './evaluation-input-schema';
import { DEFER_TO_ASSESSOR, type ComplianceFinding } from './evaluation-result-schema';
import { formatPercent, makeFinding } from './finding-builder';
import type { ExpandedIngredient } from './formula-expansion';
import { normaliseName } from './ingredient-names';

/** Something in the product that a restriction may cover: an ingredient, or a constituent of a fragrance. */
interface Occurrence {
  readonly inci: string;
  readonly cas: string | undefined;
  readonly nano: boolean;
  /** Percent of the finished product. */
  readonly percent: number;
  readonly line: number;
  /** Whether it arrives inside a fragrance or essential oil (from the supplier's declaration). */
  readonly inFragrance: boolean;
}

/** One entry's matches, summed in the form its limit is expressed in. */
interface EntryTotal {
  readonly row: RestrictedSubstance;
  /** Percent of the product, expressed as the entry expresses it (e.g. as acid). */
  expressed: number;
  readonly names: Set<string>;
  readonly lines: Set<number>;
  inFragrance: boolean;
}

interface ListIndex {
  byCas: Map<string, { row: RestrictedSubstance; form: RestrictedForm }[]>;
  byName: Map<string, { row: RestrictedSubstance; form: RestrictedForm }[]>;
}

function indexOf(rows: readonly RestrictedSubstance[]): ListIndex {
  const index: ListIndex = { byCas: new Map(), byName: new Map() };
  const add = <K>(
    map: Map<K, { row: RestrictedSubstance; form: RestrictedForm }[]>,
    key: K,
    value: { row: RestrictedSubstance; form: RestrictedForm },
  ) => {
    const list = map.get(key);
    if (list) list.push(value);
    else map.set(key, [value]);
  };
  for (const row of rows) {
    for (const form of row.forms) {
      if (form.cas) add(index.byCas, form.cas, { row, form });
      add(index.byName, normaliseName(form.inci), { row, form });
    }
  }
  return index;
}

const EU_INDEX = indexOf(euRestrictedSubstances);
const CA_INDEX = indexOf(caHotlistSubstances);

/** The entries a substance falls under, each with the matching form: by CAS first, else by name. */
export function matchRestricted(
  market: ComplianceMarket,
  substance: { inci: string; cas?: string | undefined; nano?: boolean },
): { row: RestrictedSubstance; form: RestrictedForm }[] {
  if (market === 'US') return [];
  const index = market === 'CA' ? CA_INDEX : EU_INDEX;
  const nano = substance.nano === true;
  const byCas = substance.cas ? (index.byCas.get(substance.cas) ?? []) : [];
  const byName = index.byName.get(normaliseName(substance.inci)) ?? [];
  const found = byCas.length > 0 ? byCas : byName;
  // A nano form entry covers only nanomaterials; an ordinary entry does not cover the nano form where a
  // nano entry exists for it (preamble to Annexes II to VI).
  const nanoRows = found.filter((m) => m.form.nano === true);
  if (nano && nanoRows.length > 0) return nanoRows;
  return found.filter((m) => m.form.nano !== true);
}

const UK_PREFIX = 'UK Cosmetics Regulation (retained Regulation (EC) No 1223/2009)';

function statusIn(market: ComplianceMarket, row: RestrictedSubstance): ReferenceStatus {
  return market === 'UK' ? (row.ukStatus ?? row.status) : row.status;
}

function sourceIn(market: ComplianceMarket, row: RestrictedSubstance): string {
  const source = row.source;
  if (market !== 'UK') return source;
  return `${source.replace('Regulation (EC) No 1223/2009', UK_PREFIX)}${row.ukNote ? ` (${row.ukNote})` : ''}`;
}

/** The maximum that applies to this product: a rinse-off or leave-on limit beats an "all products" one. */
export function applicableLimit(
  limits: readonly RestrictionLimit[] | undefined,
  use: ProductInput['use'],
): RestrictionLimit | null {
  if (!limits) return null;
  return limits.find((l) => l.scope === use) ?? limits.find((l) => l.scope === 'all') ?? null;
}

/** Gathers what the product contains, directly, in blends and inside fragrances, with its percent. */
function occurrencesOf(
  input: EvaluationInput,
  ingredients: readonly ExpandedIngredient[],
  totalGrams: number,
): Occurrence[] {
  const list: Occurrence[] = ingredients
    .filter((i) => !i.fragranceWord)
    .map((i) => ({
      inci: i.inci,
      cas: i.cas,
      nano: i.nano,
      percent: i.percent,
      line: i.line,
      inFragrance: false,
    }));
  input.lines.forEach((line, index) => {
    if (line.grams <= 0 || !line.material.fragrance) return;
    for (const constituent of line.material.fragrance.allergens) {
      if (constituent.percent <= 0) continue;
      list.push({
        inci: constituent.inci,
        cas: constituent.cas,
        nano: false,
        percent: ((line.grams * constituent.percent) / 100 / totalGrams) * 100,
        line: index,
        inFragrance: true,
      });
    }
  });
  return list;
}

const EPSILON = 1e-9;

/**
 * Prohibited (Annex II) and restricted (Annexes III and V) substances for the EU and UK, and Health
 * Canada's Cosmetic Ingredient Hotlist for Canada: each substance is matched by CAS number or INCI name
 * on its own line, inside blends and inside fragrances (from the supplier's declaration); forms of one
 * entry are summed in the form its maximum is expressed in (e.g. as acid); a combined maximum (parabens)
 * is applied to the sum of its group. Returns the findings and the label warnings the entries require.
 */
export function checkRestrictedSubstances(
  input: EvaluationInput,
  ingredients: readonly ExpandedIngredient[],
  totalGrams: number,
  markets: readonly ComplianceMarket[],
): { findings: ComplianceFinding[]; labelWarnings: Partial<Record<ComplianceMarket, string[]>> } {
  const { product, asOf } = input;
  const findings: ComplianceFinding[] = [];
  const labelWarnings: Partial<Record<ComplianceMarket, string[]>> = {};
  const checked = markets.filter((m) => m !== 'US');
  if (checked.length === 0) return { findings, labelWarnings };
  const occurrences = occurrencesOf(input, ingredients, totalGrams);

  for (const market of checked) {
    const totals = new Map<string, EntryTotal>();
    for (const occurrence of occurrences) {
      for (const { row, form } of matchRestricted(market, occurrence)) {
        let total = totals.get(row.id);
        if (!total) {
          total = { row, expressed: 0, names: new Set(), lines: new Set(), inFragrance: false };
          totals.set(row.id, total);
        }
        total.expressed += occurrence.percent * (form.asFactor ?? 1);
        total.names.add(occurrence.inci);
        total.lines.add(occurrence.line);
        total.inFragrance ||= occurrence.inFragrance;
      }
    }
    const warnings: string[] = [];
    for (const total of totals.values()) {
      findings.push(...entryFindings(market, total, product, asOf, warnings));
    }
    findings.push(...groupFindings(market, [...totals.values()], product, asOf));
    labelWarnings[market] = warnings;
  }
  return { findings, labelWarnings };
}

function describe(total: EntryTotal): string {
  const names = [...total.names].join(', ');
  return normaliseName(names) === normaliseName(total.row.name)
    ? names
    : `${names} (${total.row.name})`;
}

function entryFindings(
  market: ComplianceMarket,
  total: EntryTotal,
  product: ProductInput,
  asOf: string,
  warnings: string[],
): ComplianceFinding[] {
  const { row } = total;
  const status = statusIn(market, row);
  const source = sourceIn(market, row);
  const subject = describe(total);
  const lines = [...total.lines];
  const where = total.inFragrance ? ' (declared inside a fragrance or essential oil)' : '';
  const entry = row.entryRef ? ` entry ${row.entryRef}` : '';
  const base = { market, subject, source, status, lines };
  const upcoming = row.placingFrom !== undefined && asOf < row.placingFrom;
  const findings: ComplianceFinding[] = [];
  const amount = `${formatPercent(total.expressed)} of the product${row.expressedAs ? ` (as ${row.expressedAs})` : ''}`;

  if (row.prohibited) {
    if (upcoming) {
      findings.push(
        makeFinding({
          ...base,
          code: 'PROHIBITED_UPCOMING',
          severity: 'warn',
          message: `${subject}${where} will be prohibited (${row.list}${entry}): products containing it may not be placed on the market from ${row.placingFrom}${row.availableFrom ? ` nor made available from ${row.availableFrom}` : ''}. Reformulate before then.`,
        }),
      );
    } else {
      const stock =
        row.availableFrom && asOf < row.availableFrom
          ? ` Products already placed on the market may be made available until the day before ${row.availableFrom}.`
          : '';
      findings.push(
        makeFinding({
          ...base,
          code: 'PROHIBITED_SUBSTANCE',
          severity: 'block',
          message: `${subject}${where} is prohibited in cosmetic products (${row.list}${entry}${row.amendedBy ? `, ${row.amendedBy}` : ''}). Ask your supplier for a replacement without it.${stock} ${DEFER_TO_ASSESSOR}`,
        }),
      );
    }
    return findings;
  }

  if (row.notAllowedIn && row.notAllowedIn === product.use) {
    findings.push(
      makeFinding({
        ...base,
        code: upcoming ? 'RESTRICTED_UPCOMING' : 'RESTRICTED_NOT_ALLOWED',
        severity: upcoming ? 'warn' : 'block',
        message: upcoming
          ? `${subject}${where}: from ${row.placingFrom} not allowed in ${product.use} products (${row.list}${entry}).`
          : `${subject}${where} is not allowed in ${product.use} products (${row.list}${entry}). ${DEFER_TO_ASSESSOR}`,
      }),
    );
    return findings;
  }

  const limit = applicableLimit(row.limits, product.use);
  if (limit && total.expressed > limit.maxPercent * (1 + EPSILON)) {
    findings.push(
      makeFinding({
        ...base,
        code: upcoming ? 'RESTRICTED_UPCOMING' : 'RESTRICTED_OVER_MAXIMUM',
        severity: upcoming ? 'warn' : 'block',
        message: upcoming
          ? `${subject}${where} is ${amount}; from ${row.placingFrom} the maximum is ${limit.maxPercent} % (${limit.wording}; ${row.list}${entry}).`
          : `${subject}${where} is ${amount}, above the ${limit.maxPercent} % maximum for ${limit.wording.toLowerCase()} (${row.list}${entry}). ${DEFER_TO_ASSESSOR}`,
      }),
    );
  }
  const shown = [
    ...(limit
      ? [
          `at most ${limit.maxPercent} %${row.expressedAs ? ` as ${row.expressedAs}` : ''} (${limit.wording})`,
        ]
      : []),
    ...(row.conditions ?? []),
  ];
  if (row.labelWarning && !row.labelWarningFor) {
    warnings.push(row.labelWarning);
    shown.push(`label must say: "${row.labelWarning}"`);
  } else if (row.labelWarning) {
    shown.push(`for ${row.labelWarningFor}, the label must say: "${row.labelWarning}"`);
  }
  if (shown.length > 0 && !findings.some((f) => f.severity === 'block')) {
    findings.push(
      makeFinding({
        ...base,
        code: 'RESTRICTED_CONDITION',
        severity: row.labelWarning || (row.conditions?.length ?? 0) > 0 ? 'warn' : 'info',
        message: `${subject}${where}: ${amount}, restricted by ${row.list}${entry} — ${shown.join('; ')}.${row.labelWarning && !row.labelWarningFor ? ' Batchproof adds the warning to this market\u2019s label.' : ''}${(row.conditions?.length ?? 0) > 0 ? ' Batchproof cannot check the conditions it lists: confirm them with your safety assessor.' : ''}`,
      }),
    );
  }
  return findings;
}

function groupFindings(
  market: ComplianceMarket,
  totals: readonly EntryTotal[],
  product: ProductInput,
  asOf: string,
): ComplianceFinding[] {
  const byGroup = new Map<string, EntryTotal[]>();
  for (const total of totals) {
    if (!total.row.group || !total.row.groupLimit) continue;
    const list = byGroup.get(total.row.group);
    if (list) list.push(total);
    else byGroup.set(total.row.group, [total]);
  }
  const findings: ComplianceFinding[] = [];
  for (const members of byGroup.values()) {
    if (members.length < 2) continue;
    const limit = members[0]!.row.groupLimit!;
    if (limit.scope !== 'all' && limit.scope !== product.use) continue;
    const sum = members.reduce((s, m) => s + m.expressed, 0);
    if (sum <= limit.maxPercent * (1 + EPSILON)) continue;
    const first = members[0]!.row;
    const upcoming = first.placingFrom !== undefined && asOf < first.placingFrom;
    findings.push(
      makeFinding({
        code: upcoming ? 'RESTRICTED_UPCOMING' : 'RESTRICTED_OVER_MAXIMUM',
        severity: upcoming ? 'warn' : 'block',
        market,
        subject: members.map(describe).join(' + '),
        message: `${members.map(describe).join(' + ')} together are ${formatPercent(sum)} of the product${first.expressedAs ? ` (as ${first.expressedAs})` : ''}, above the combined maximum of ${limit.maxPercent} % (${limit.wording}; ${first.list}${first.entryRef ? ` entry ${first.entryRef}` : ''}). ${DEFER_TO_ASSESSOR}`,
        source: sourceIn(market, first),
        status: members.some((m) => statusIn(market, m.row) === 'M')
          ? 'M'
          : statusIn(market, first),
        lines: members.flatMap((m) => [...m.lines]),
      }),
    );
  }
  return findings;
}
