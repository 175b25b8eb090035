import type { ComplianceMarket } from '../reference-data/reference-row';
import type { ProductInput } from './evaluation-input-schema';
import type { ComplianceFinding } from './evaluation-result-schema';
import { makeFinding } from './finding-builder';

const SOAP_SOURCE = '21 CFR 701.20(a)';

/** FDA's own reading of "soap", quoted in the finding. */
const SOAP_CONDITIONS =
  'the bulk of its nonvolatile matter is an alkali salt of fatty acids, its detergent properties are due to those compounds, and it is labeled, sold and represented only as soap';

/**
 * A soap the maker sells as soap: in the US it is outside the cosmetic rules when it meets 21 CFR
 * 701.20(a), so US findings that would block are kept as checks (they matter again the moment the
 * label claims to moisturise, deodorise or perfume). Other markets are unchanged: the EU, UK and
 * Canada treat soap as a cosmetic.
 */
export function soapFindings(
  product: ProductInput,
  markets: readonly ComplianceMarket[],
  findings: readonly ComplianceFinding[],
): ComplianceFinding[] {
  if (product.type !== 'soap' || !product.soldAsSoap || !markets.includes('US'))
    return [...findings];
  const note = ` This soap is sold as soap: if ${SOAP_CONDITIONS}, the FDA does not treat it as a cosmetic (${SOAP_SOURCE}), so this is a check rather than a block in the US.`;
  const kept = findings.map((f) =>
    f.market === 'US' && f.severity === 'block'
      ? { ...f, severity: 'warn' as const, message: `${f.message}${note}` }
      : f,
  );
  kept.push(
    makeFinding({
      code: 'SOAP_NOT_A_COSMETIC',
      severity: 'info',
      market: 'US',
      subject: product.name,
      message: `Sold as soap: in the US a product is "soap", not a cosmetic, only if ${SOAP_CONDITIONS} (${SOAP_SOURCE}). Then the Consumer Product Safety Commission's rules apply instead of the FDA's. A claim to moisturise, deodorise or scent the skin makes it a cosmetic again; a synthetic-detergent bar is a cosmetic (701.20(b)). In the EU, UK and Canada it is a cosmetic either way.`,
      source: SOAP_SOURCE,
      status: 'C',
      lines: [],
    }),
  );
  return kept;
}
