import type { ReferenceRow } from './reference-row';

/**
 * An essential oil, absolute or extract that is known to carry labelled fragrance allergens. A hint
 * only: it tells the maker what to ask the supplier for, and is never used in place of the supplier's
 * allergen declaration.
 */
export interface EssentialOilHint extends ReferenceRow {
  /** Common name, e.g. "Lavender oil". */
  readonly name: string;
  /** INCI names it is sold under, e.g. "Lavandula Angustifolia Oil". Matched case-insensitively. */
  readonly inciNames: readonly string[];
  /** CAS numbers it is sold under, when known. */
  readonly cas: readonly string[];
  /** Annex III labelled allergens it typically contains, by label name, main ones first. */
  readonly typicalAllergens: readonly string[];
  /** Typical ranges where the source gives them, e.g. "Linalool 20–45 %". */
  readonly typicalRanges?: readonly string[];
}
