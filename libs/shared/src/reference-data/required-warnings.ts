import type { ComplianceMarket, ReferenceRow } from './reference-row';

/** A warning statement a regulation requires on the label of some products. */
export interface RequiredWarning extends ReferenceRow {
  /** Market whose law requires it. */
  readonly market: ComplianceMarket;
  /** The statement to print. */
  readonly text: string;
  /** Which products need it. */
  readonly appliesTo: string;
  /** When a product is exempt, if ever. */
  readonly exemption?: string;
  /** Whether `evaluateFormula` decides this warning itself (otherwise it is listed for reference). */
  readonly appliedByEngine: boolean;
}

/** The 21 CFR 740.17 caution, as printed in the FDA Q&A (1992, updated 1996). */
export const US_FOAMING_BATH_CAUTION =
  'Caution: Use only as directed. Excessive use or prolonged exposure may cause irritation to skin and urinary tract. Discontinue use if rash, redness, or itching occurs. Consult your physician if irritation persists.';

/** Required warning statements Batchproof knows (21 CFR Part 740, Subpart B). */
export const requiredWarnings: readonly RequiredWarning[] = [
  {
    id: 'us-740-17-foaming-detergent-bath',
    market: 'US',
    text: US_FOAMING_BATH_CAUTION,
    appliesTo:
      'Foaming detergent bath products: any product intended to be added to a bath for the purpose of producing foam that contains a surface-active agent serving as a detergent or foaming ingredient.',
    exemption:
      'Products clearly labelled as intended for use exclusively by adults, e.g. "For adult use only" or "Keep out of reach of children".',
    appliedByEngine: true,
    source: '21 CFR 740.17; FDA Cosmetic Labeling Guide',
    status: 'C',
    effectiveFrom: '1987-06-05',
    note: 'Text confirmed in FDA Q&A; exact regulatory punctuation from memory. Effective date C2 (AP, 5 June 1986).',
  },
  {
    id: 'us-740-10-safety-not-determined',
    market: 'US',
    text: 'Warning--The safety of this product has not been determined.',
    appliesTo: 'A cosmetic whose safety has not been adequately substantiated before marketing.',
    appliedByEngine: false,
    source: '21 CFR 740.10',
    status: 'C2',
  },
];
