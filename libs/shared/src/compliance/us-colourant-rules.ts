import type { ComplianceMarket } from '../reference-data/reference-row';
import type { UsColourMatch } from './colourant-matching';
import type { VerdictBase, VerdictWithFindings } from './colourant-verdict-types';
import type { ProductInput } from './evaluation-input-schema';
import { DEFER_TO_ASSESSOR, type ComplianceFinding } from './evaluation-result-schema';
import { formatPercent, makeFinding } from './finding-builder';

const EXTERNALLY_APPLIED = '21 CFR 82.3(n)';
const EYE_AREA = '21 CFR 70.5(a)';

/**
 * US verdict for the product's exposure. The eye area needs a listing that provides for it (70.5(a));
 * lips need "generally" or a lip-product listing; a product used in the bath touches mucous membranes,
 * so a colour listed only for externally applied cosmetics (82.3(n)) is not permitted there.
 */
export function usColourantVerdict(
  base: VerdictBase,
  match: UsColourMatch,
  product: ProductInput,
): VerdictWithFindings {
  const market: ComplianceMarket = 'US';
  const finding = (f: Omit<Parameters<typeof makeFinding>[0], 'market' | 'subject' | 'lines'>) =>
    makeFinding({ ...f, market, subject: base.subject, lines: base.lines });

  if (match.kind === 'none') {
    const source = '21 CFR Parts 73 and 74';
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
          message: `${base.subject}: not in Batchproof's list of US colour additives. In the US a colour additive may be used only if it is listed for that use; check its listing with your supplier.`,
          source,
          status: 'C',
        }),
      ],
    };
  }
  if (match.kind === 'ambiguous') {
    const names = match.rows.map((r) => r.name).join(' and ');
    const source = 'FDA/ICMAD regulatory information sheet (CI numbers are not unique US keys)';
    return {
      verdict: {
        ...base,
        listing: null,
        verdict: 'not-listed',
        conditions: [],
        source,
        status: 'C',
      },
      findings: [
        finding({
          code: 'COLOURANT_AMBIGUOUS',
          severity: 'warn',
          message: `${base.subject}: this CI number matches ${names}, which have different permitted uses. Enter the US name on the material so Batchproof can check it.`,
          source,
          status: 'C',
        }),
      ],
    };
  }
  if (match.kind === 'not-permitted') {
    const source = match.row.source;
    return {
      verdict: {
        ...base,
        listing: match.row.name,
        verdict: 'not-permitted',
        conditions: [],
        source,
        status: match.row.status,
      },
      findings: [
        finding({
          code: 'COLOURANT_NOT_PERMITTED',
          severity: 'block',
          message: `${base.subject}: not permitted in US cosmetics — ${match.row.reason} ${DEFER_TO_ASSESSOR}`,
          source,
          status: match.row.status,
        }),
      ],
    };
  }

  const { row, lake } = match;
  const source = `21 CFR ${row.cfrSection}`;
  const notPermitted = (why: string, ruleSource: string): VerdictWithFindings => ({
    verdict: {
      ...base,
      listing: row.name,
      verdict: 'not-permitted',
      conditions: [],
      source: ruleSource,
      status: row.status,
    },
    findings: [
      finding({
        code: 'COLOURANT_NOT_PERMITTED',
        severity: 'block',
        message: `${base.subject}: ${why} ${DEFER_TO_ASSESSOR}`,
        source: ruleSource,
        status: row.status,
      }),
    ],
  });
  const { uses } = row;
  const mucous = product.inBath || product.contact.mucousMembranes;
  const conditions: string[] = [];
  const findings: ComplianceFinding[] = [];

  if (product.contact.eyeArea && (!uses.eyeArea || (lake && !uses.eyeAreaIncludesLake))) {
    const what = lake
      ? `its lake is not listed for the area of the eye`
      : `it is not listed for the area of the eye`;
    return notPermitted(
      `not permitted in the US for products used near the eyes — ${what} (${source}; ${EYE_AREA}).`,
      `${source}; ${EYE_AREA}`,
    );
  }
  if (uses.restrictedTo) {
    const list = uses.restrictedTo.join(', ');
    if (product.inBath) {
      return notPermitted(
        `not permitted in the US for products used in the bath — ${source} allows it only in ${list}.`,
        source,
      );
    }
    conditions.push(`Only in ${list}`);
    findings.push(
      finding({
        code: 'COLOURANT_CONDITION',
        severity: 'warn',
        message: `${base.subject}: permitted in the US only in ${list} (${source}); check this product is one of them.`,
        source,
        status: row.status,
      }),
    );
  }
  if (product.contact.lips && !uses.generally) {
    if (uses.lipProductsMaxPercent === undefined) {
      return notPermitted(
        `not permitted in the US for lip products — ${source} lists it for externally applied cosmetics, which excludes the lips (${EXTERNALLY_APPLIED}).`,
        `${source}; ${EXTERNALLY_APPLIED}`,
      );
    }
    const max = uses.lipProductsMaxPercent;
    if (base.percent > max) {
      return notPermitted(
        `${formatPercent(base.percent)} of this lip product, above the ${max} % maximum for lip products in ${source}.`,
        source,
      );
    }
    conditions.push(`Lip products: at most ${max} % of the finished product`);
    findings.push(
      finding({
        code: 'COLOURANT_CONDITION',
        severity: 'info',
        message: `${base.subject}: ${formatPercent(base.percent)} of this lip product, within the ${max} % maximum in ${source}.`,
        source,
        status: row.status,
      }),
    );
  } else if (mucous && !uses.generally) {
    const where = product.inBath
      ? 'products used in the bath'
      : 'products that touch mucous membranes';
    const why = product.inBath
      ? " Batchproof treats bath water as reaching mucous membranes, as makers' guidance does; your assessor may decide otherwise."
      : '';
    return notPermitted(
      `not permitted in the US for ${where} — ${source} lists it for externally applied cosmetics only, which excludes lips and mucous membranes (${EXTERNALLY_APPLIED}).${why}`,
      `${source}; ${EXTERNALLY_APPLIED}`,
    );
  }
  if (row.certificationRequired || lake) {
    conditions.push('FDA-certified batch');
    findings.push(
      finding({
        code: 'COLOURANT_CERTIFIED_BATCH',
        severity: 'warn',
        message: `${base.subject}: use only an FDA-certified batch and keep the certified lot number from your supplier (${row.certificationRequired ? source : '21 CFR 81.1; lakes are subject to certification'}).`,
        source: row.certificationRequired
          ? `${source}; 21 CFR Part 80`
          : 'FDA Color Additive Status List (all lakes are subject to certification)',
        status: 'C',
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
