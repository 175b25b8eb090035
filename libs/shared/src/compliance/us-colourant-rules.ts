import type { UsColourMatch } from './colourant-matching';
import {
  amountText,
  verdictOf,
  verdictTools,
  type VerdictBase,
  type VerdictWithFindings,
} from './colourant-verdict-types';
import type { ProductInput } from './evaluation-input-schema';
import type { ComplianceFinding } from './evaluation-result-schema';
import { impliedContact, PRODUCT_TYPE_NAMES, productTypeFitsListing } from './product-types';

const EXTERNALLY_APPLIED = '21 CFR 82.3(n)';
const EYE_AREA = '21 CFR 70.5(a)';

/**
 * US verdict for the product's exposure. The eye area needs a listing that provides for it (70.5(a));
 * a listing that names the products it may be used in allows those only (74.2052(c)); lips need
 * "generally" or a lip-product listing, whose maximum applies to the colour's total over its forms
 * (74.2333(c) "total color"); a product used in the bath touches mucous membranes — Batchproof's
 * reading, labelled as such — so a colour listed only for externally applied cosmetics (82.3(n)) is
 * not permitted there.
 */
export function usColourantVerdict(
  base: VerdictBase,
  match: UsColourMatch,
  product: ProductInput,
): VerdictWithFindings {
  const { finding, notListed, notPermitted: block } = verdictTools(base, 'US');

  if (match.kind === 'none') {
    return notListed(
      'COLOURANT_NOT_LISTED',
      `${base.subject}: not in Batchproof's list of US colour additives. In the US a colour additive may be used only if it is listed for that use; check its listing with your supplier.`,
      '21 CFR Parts 73 and 74',
      null,
    );
  }
  if (match.kind === 'ambiguous') {
    const names = match.rows.map((r) => r.name).join(' and ');
    return notListed(
      'COLOURANT_AMBIGUOUS',
      `${base.subject}: this CI number matches ${names}, which have different permitted uses. Enter the US name on the material so Batchproof can check it.`,
      'FDA/ICMAD regulatory information sheet (CI numbers are not unique US keys)',
      'C',
    );
  }
  if (match.kind === 'not-permitted') {
    return block(
      match.row.name,
      match.row.status,
      `not permitted in US cosmetics — ${match.row.reason}`,
      match.row.source,
    );
  }

  const { row, lake } = match;
  const source = `21 CFR ${row.cfrSection}`;
  const notPermitted = (why: string, ruleSource: string, interpretation = false) =>
    block(row.name, row.status, why, ruleSource, interpretation);
  const { uses } = row;
  const implied = impliedContact(product.type);
  const eyeArea = product.contact.eyeArea || implied.eyeArea;
  const lips = product.contact.lips || implied.lips;
  const typeName = PRODUCT_TYPE_NAMES[product.type];
  const conditions: string[] = [];
  const findings: ComplianceFinding[] = [];

  if (eyeArea && (!uses.eyeArea || (lake && !uses.eyeAreaIncludesLake))) {
    const what = lake
      ? `its lake is not listed for the area of the eye`
      : `it is not listed for the area of the eye`;
    return notPermitted(
      `not permitted in the US for products used near the eyes — ${what} (${source}; ${EYE_AREA}).`,
      `${source}; ${EYE_AREA}`,
    );
  }
  let listedForThisProduct = false;
  if (uses.restrictedTo) {
    const list = uses.restrictedTo.join(', ');
    const fit = productTypeFitsListing(product.type, uses.restrictedTo);
    if (fit === 'no') {
      return notPermitted(
        `not permitted in the US in a ${typeName} — ${source} allows it only in ${list}.`,
        source,
      );
    }
    conditions.push(`Only in ${list}`);
    listedForThisProduct = fit === 'yes';
    findings.push(
      finding({
        code: 'COLOURANT_CONDITION',
        severity: fit === 'yes' ? 'info' : 'warn',
        message:
          fit === 'yes'
            ? `${base.subject}: permitted in the US only in ${list} (${source}); a ${typeName} is one of them.`
            : `${base.subject}: permitted in the US only in ${list} (${source}); check this ${typeName} is one of them.`,
        source,
        status: row.status,
      }),
    );
  }
  if (lips && !uses.generally && !listedForThisProduct) {
    if (uses.lipProductsMaxPercent === undefined) {
      return notPermitted(
        `not permitted in the US for lip products — ${source} lists it for externally applied cosmetics, which excludes the lips (${EXTERNALLY_APPLIED}).`,
        `${source}; ${EXTERNALLY_APPLIED}`,
      );
    }
    const max = uses.lipProductsMaxPercent;
    if (base.totalPercent > max * (1 + 1e-9)) {
      return notPermitted(
        `${amountText(base)}, above the ${max} % maximum (total colour, by weight) for lip products in ${source}.`,
        source,
      );
    }
    conditions.push(`Lip products: at most ${max} % of the finished product`);
    findings.push(
      finding({
        code: 'COLOURANT_CONDITION',
        severity: 'info',
        message: `${base.subject}: ${amountText(base)}, within the ${max} % maximum for lip products in ${source}.`,
        source,
        status: row.status,
      }),
    );
  } else if (!lips && !uses.generally && !listedForThisProduct) {
    const statedMucous = product.contact.mucousMembranes;
    if (statedMucous || product.inBath) {
      const where = statedMucous
        ? 'products that touch mucous membranes'
        : 'products used in the bath';
      const why = statedMucous
        ? ''
        : ' Batchproof treats bath water as reaching mucous membranes, as makers\u2019 guidance does; the regulation does not name bath products.';
      return notPermitted(
        `not permitted in the US for ${where} — ${source} lists it for externally applied cosmetics only, which excludes lips and mucous membranes (${EXTERNALLY_APPLIED}).${why}`,
        `${source}; ${EXTERNALLY_APPLIED}`,
        !statedMucous,
      );
    }
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
