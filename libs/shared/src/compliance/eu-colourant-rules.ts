import type { EuAnnexIvColourant } from '../reference-data/eu-annex-iv-colourants';
import type { ComplianceMarket } from '../reference-data/reference-row';
import type { VerdictBase, VerdictWithFindings } from './colourant-verdict-types';
import type { ProductInput } from './evaluation-input-schema';
import { DEFER_TO_ASSESSOR, type ComplianceFinding } from './evaluation-result-schema';
import { formatPercent, makeFinding } from './finding-builder';

const FIELD_TEXT = {
  'not-eye': 'Not to be used in eye products',
  'not-mucous-membranes': 'Not to be used in products applied on mucous membranes',
  'rinse-off-only': 'Rinse-off products only',
} as const;

/**
 * EU (and UK) verdict against an Annex IV entry's field of application and maximum. A product used in
 * the bath counts as applied on mucous membranes, as in the US (interpretation, shown as such).
 */
export function euColourantVerdict(
  base: VerdictBase,
  row: EuAnnexIvColourant | null,
  product: ProductInput,
  market: ComplianceMarket,
): VerdictWithFindings {
  const finding = (f: Omit<Parameters<typeof makeFinding>[0], 'market' | 'subject' | 'lines'>) =>
    makeFinding({ ...f, market, subject: base.subject, lines: base.lines });
  if (!row) {
    const source = 'Regulation (EC) No 1223/2009, Annex IV';
    return {
      verdict: {
        ...base,
        listing: null,
        verdict: 'not-listed',
        conditions: [],
        source,
        status: null,
      },
      findings: [
        finding({
          code: 'COLOURANT_NOT_LISTED',
          severity: 'warn',
          message: `${base.subject}: not in Batchproof's Annex IV list. Only colourants in Annex IV may be used; check the entry and its conditions.`,
          source,
          status: 'C',
        }),
      ],
    };
  }
  const source = `${row.source}${row.annexRef ? `, entry ${row.annexRef}` : ''}`;
  const notPermitted = (why: string): VerdictWithFindings => ({
    verdict: {
      ...base,
      listing: row.name,
      verdict: 'not-permitted',
      conditions: [],
      source,
      status: row.status,
    },
    findings: [
      finding({
        code: 'COLOURANT_NOT_PERMITTED',
        severity: 'block',
        message: `${base.subject}: ${why} ${DEFER_TO_ASSESSOR}`,
        source,
        status: row.status,
      }),
    ],
  });
  const mucous = product.inBath || product.contact.mucousMembranes || product.contact.lips;
  if (row.field === 'not-eye' && product.contact.eyeArea)
    return notPermitted(`not permitted in eye products — "${FIELD_TEXT['not-eye']}" (${source}).`);
  if (row.field === 'not-mucous-membranes' && mucous) {
    const where = product.inBath
      ? 'products used in the bath (they reach mucous membranes)'
      : 'products applied on mucous membranes';
    return notPermitted(
      `not permitted in ${where} — "${FIELD_TEXT['not-mucous-membranes']}" (${source}).`,
    );
  }
  if (row.field === 'rinse-off-only' && product.use === 'leave-on')
    return notPermitted(`allowed in rinse-off products only (${source}).`);
  const conditions: string[] = [];
  const findings: ComplianceFinding[] = [];
  if (row.maxPercent !== undefined) {
    if (base.percent > row.maxPercent) {
      return notPermitted(
        `${formatPercent(base.percent)} of the product, above the ${row.maxPercent} % maximum in ${source}.`,
      );
    }
    conditions.push(`At most ${row.maxPercent} % of the finished product`);
  }
  if (row.field !== 'all') conditions.push(FIELD_TEXT[row.field]);
  if (row.conditions) conditions.push(row.conditions);
  if (conditions.length > 0) {
    findings.push(
      finding({
        code: 'COLOURANT_CONDITION',
        severity: 'info',
        message: `${base.subject}: permitted with conditions — ${conditions.join('; ')} (${source}). Keep your supplier's specification showing it meets them.`,
        source,
        status: row.status,
      }),
    );
  }
  return {
    verdict: {
      ...base,
      listing: row.name,
      verdict: conditions.length > 0 ? 'permitted-with-conditions' : 'permitted',
      conditions,
      source,
      status: row.status,
    },
    findings,
  };
}
