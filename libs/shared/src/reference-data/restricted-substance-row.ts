import type { ReferenceRow, ReferenceStatus } from './reference-row';

/**
 * Which list a restricted or prohibited substance row comes from: the EU annexes of Regulation (EC)
 * No 1223/2009 (the UK's retained copy follows them unless a row says otherwise), or Health Canada's
 * Cosmetic Ingredient Hotlist.
 */
export type RestrictionList = 'EU Annex II' | 'EU Annex III' | 'EU Annex V' | 'CA Hotlist';

/** One form of a substance an entry covers (the acid, a salt, an ester), matched by INCI name or CAS. */
export interface RestrictedForm {
  /** INCI or glossary name as it appears on materials and supplier sheets. */
  readonly inci: string;
  /** CAS number, when known. */
  readonly cas?: string;
  /**
   * Multiplier from this form's weight to the weight the limit is expressed in: a limit "expressed as
   * acid" counts sodium benzoate as 122.12 / 144.10 of its weight. 1 (the default) when the limit is on
   * the form itself. Derived from molar masses; the tests check it with a molar-mass library.
   */
  readonly asFactor?: number;
  /** Molecular formula of this form, when `asFactor` is derived from it (e.g. `C7H5NaO2`). */
  readonly formula?: string;
  /** Molecular formula of what the limit is expressed as (e.g. `C7H6O2`, or `(C7H6O3)2` for two per form). */
  readonly asFormula?: string;
  /** Whether this form is the nanomaterial (Art. 2(1)(k)); an entry for the nano form matches only nano. */
  readonly nano?: boolean;
}

/** Which products a maximum or a ban applies to. */
export type RestrictionScope = 'all' | 'rinse-off' | 'leave-on';

/** One maximum concentration in the ready-for-use preparation. */
export interface RestrictionLimit {
  /** Products the maximum applies to. */
  readonly scope: RestrictionScope;
  /** Maximum percent of the finished product, in the form the entry expresses it in. */
  readonly maxPercent: number;
  /** The entry's own words for this product type, e.g. "Rinse-off products". */
  readonly wording: string;
}

/**
 * A substance an annex prohibits or restricts, with the conditions the engine can check (maxima by
 * rinse-off/leave-on, rinse-off-only use, prohibition and its dates) and the ones it can only show.
 */
export interface RestrictedSubstance extends ReferenceRow {
  readonly list: RestrictionList;
  /** Entry (reference) number in the annex, when known. */
  readonly entryRef?: string;
  /** Name of the entry as the annex gives it. */
  readonly name: string;
  /** The forms it covers. */
  readonly forms: readonly RestrictedForm[];
  /** What the maximum is expressed as, e.g. "acid"; absent when it is the substance itself. */
  readonly expressedAs?: string;
  /** Prohibited outright (Annex II, Hotlist prohibited). */
  readonly prohibited?: boolean;
  /** Prohibited in these products only (e.g. MI in leave-on products): scope where use is not allowed. */
  readonly notAllowedIn?: Exclude<RestrictionScope, 'all'>;
  /** Maximum concentrations; several entries (parabens) also set a combined maximum, see `group`. */
  readonly limits?: readonly RestrictionLimit[];
  /**
   * Rows sharing a group id are also summed against `groupLimit` (e.g. "0,8 % (as acid) for mixtures
   * of esters").
   */
  readonly group?: string;
  readonly groupLimit?: RestrictionLimit;
  /** Conditions Batchproof shows but cannot check (children under three, sprays, purity). */
  readonly conditions?: readonly string[];
  /** Warning the label must carry, word for word, when the annex requires one. */
  readonly labelWarning?: string;
  /**
   * The products the warning is for, when the annex limits it (e.g. "products which might be used for
   * children under three"): Batchproof cannot tell, so it asks instead of printing the warning.
   */
  readonly labelWarningFor?: string;
  /**
   * Day from which products not meeting the entry may no longer be placed on the market. Before it the
   * engine reports the entry as coming, not as a block.
   */
  readonly placingFrom?: string;
  /** Day from which such products may no longer be made available (sold from stock). */
  readonly availableFrom?: string;
  /** The amending regulation that introduced or changed the entry, e.g. "Regulation (EU) 2021/1902". */
  readonly amendedBy?: string;
  /** How sure we are that the UK's retained list carries the same entry (EU rows only). */
  readonly ukStatus?: ReferenceStatus;
  /** What differs in the UK, or where the UK date comes from. */
  readonly ukNote?: string;
}
