import type { EuAnnexIvColourant } from '../reference-data/eu-annex-iv-colourants';
import type { ComplianceMarket } from '../reference-data/reference-row';
import {
  amountText,
  verdictOf,
  verdictTools,
  type VerdictBase,
  type VerdictWithFindings,
} from './colourant-verdict-types';
import type { ProductInput } from './evaluation-input-schema';
import type { ComplianceFinding } from './evaluation-result-schema';
import { impliedContact } from './product-types';

const FIELD_TEXT = {
  'not-eye': 'Not to be used in eye products',
  'not-mucous-membranes': 'Not to be used in products applied on mucous membranes',
  'rinse-off-only': 'Rinse-off products only',
} as const;

/**
 * EU (and UK) verdict against an Annex IV entry's field of application and maximum. Maxima apply to the
 * colourant's total over its salts and lakes (Annex IV preamble). A product used in the bath counts as
 * applied on mucous membranes, as in the US: Batchproof's reading, labelled as an interpretation.
 * A nanomaterial is covered only where Annex IV names the nano form.
 */
export function euColourantVerdict(
  base: VerdictBase,
  row: EuAnnexIvColourant | null,
  product: ProductInput,
  market: ComplianceMarket,
): VerdictWithFindings {
  const { finding, notListed, notPermitted: block } = verdictTools(base, market);
  if (!row) {
    const nanoNote = base.nano
      ? ' Annex IV covers the nano form of a colourant only where an entry names it (preamble to Annexes II to VI); ask your supplier which entry its nano grade falls under.'
      : '';
    return notListed(
      'COLOURANT_NOT_LISTED',
      `${base.subject}: not in Batchproof's Annex IV list. Only colourants in Annex IV may be used; check the entry and its conditions.${nanoNote}`,
      'Regulation (EC) No 1223/2009, Annex IV',
      null,
    );
  }
  const source = `${row.source}${row.annexRef ? `, entry ${row.annexRef}` : ''}`;
  const notPermitted = (why: string, interpretation = false) =>
    block(row.name, row.status, why, source, interpretation);
  const implied = impliedContact(product.type);
  const lips = product.contact.lips || implied.lips;
  const eyeArea = product.contact.eyeArea || implied.eyeArea;
  const statedMucous = product.contact.mucousMembranes || lips;
  if (row.field === 'not-eye' && eyeArea)
    return notPermitted(`not permitted in eye products — "${FIELD_TEXT['not-eye']}" (${source}).`);
  if (row.field === 'not-mucous-membranes' && (statedMucous || product.inBath)) {
    if (statedMucous)
      return notPermitted(
        `not permitted in products applied on mucous membranes — "${FIELD_TEXT['not-mucous-membranes']}" (${source}).`,
      );
    return notPermitted(
      `not permitted in products used in the bath, which Batchproof treats as applied on mucous membranes — "${FIELD_TEXT['not-mucous-membranes']}" (${source}).`,
      true,
    );
  }
  if (row.field === 'rinse-off-only' && product.use === 'leave-on')
    return notPermitted(`allowed in rinse-off products only (${source}).`);
  const conditions: string[] = [];
  const findings: ComplianceFinding[] = [];
  if (row.maxPercent !== undefined) {
    if (base.totalPercent > row.maxPercent * (1 + 1e-9)) {
      return notPermitted(
        `${amountText(base)}, above the ${row.maxPercent} % maximum in ${source}.`,
      );
    }
    conditions.push(`At most ${row.maxPercent} % of the finished product`);
  }
  if (row.lipstick && lips) {
    const max = row.lipstick.maxPercent;
    if (max !== undefined && base.totalPercent > max * (1 + 1e-9)) {
      return notPermitted(
        `${amountText(base)}, above the ${max} % Annex IV allows in lip products — "${row.lipstick.wording}" (${source}).`,
      );
    }
    conditions.push(row.lipstick.wording);
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
    verdict: verdictOf(base, {
      listing: row.name,
      verdict: conditions.length > 0 ? 'permitted-with-conditions' : 'permitted',
      conditions,
      source,
      status: row.status,
    }),
    findings,
  };
}
