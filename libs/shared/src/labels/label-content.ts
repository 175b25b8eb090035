import type { ComplianceMarket, ReferenceStatus } from '../reference-data/reference-row';

/**
 * Label content: what one market's label carries, taken from the engine's result (declaration,
 * warnings, net quantity statement, GS1 element string) and the formula's product identity, never
 * re-derived. The PDF renderer lays these fields out; the public ingredients page shows the same
 * fields and nothing else.
 */

/** Every field a label can carry, in the order a single label prints them. */
export const LABEL_FIELD_KEYS = [
  'productName',
  'productNameFr',
  'netQuantity',
  'ingredients',
  'warnings',
  'warningsFr',
  'directions',
  'directionsFr',
  'business',
  'adverseEventContact',
  'responsiblePerson',
  'lot',
  'durability',
  'productCode',
] as const;
/** One field of a label. */
export type LabelFieldKey = (typeof LABEL_FIELD_KEYS)[number];

/** Which panel a field sits on when a product has a principal display panel and an information panel. */
export type LabelPanel = 'front' | 'back';

/**
 * How sure Batchproof is of a minimum letter height: a reference status (`C`, `C2`, `CALC`, `M`),
 * or `house` when no published rule gives a number and Batchproof's own minimum applies (common
 * practice, no published source).
 */
export type LetterHeightStatus = ReferenceStatus | 'house';

/** The smallest height the letters of a field may have, and the rule that sets it. */
export interface LetterHeightMinimum {
  /** Height of the lower-case letters (the "o"), in millimetres. */
  readonly mm: number;
  /** The same in inches, as US rules state it. */
  readonly inches: number;
  /** As shown to the maker, e.g. `1/16 in (1.59 mm)`. */
  readonly label: string;
  /** The rule, e.g. `21 CFR 740.2(a)`, or `common practice, no published source`. */
  readonly source: string;
  /** How sure we are of the rule (set by `letterHeightMinimum`). */
  readonly status?: LetterHeightStatus;
}

/** One field of one market's label. */
export interface LabelField {
  readonly key: LabelFieldKey;
  /** The field's name in the UI's words, used in fit errors: "Warnings". */
  readonly name: string;
  /** The text to print, exactly; a renderer never rewrites it. */
  readonly text: string;
  /** Warnings print in bold (21 CFR 740.2(a) asks for bold type). */
  readonly bold: boolean;
  /** Where the rules let it go: `front` only, or either panel. */
  readonly allowedPanels: readonly LabelPanel[];
  /** Where it goes unless the maker moves it. */
  readonly defaultPanel: LabelPanel;
  /** The net quantity sits in the bottom 30 % of the principal display panel (21 CFR 701.13). */
  readonly bottomThirtyPercent: boolean;
  /** Smallest letter height allowed for this field on this label. */
  readonly minimum: LetterHeightMinimum;
  /** Also carried on a small-item label (the rest goes on the outer pack and the public page). */
  readonly onSmallLabel: boolean;
  /** What the maker or the renderer should know about the text, e.g. that `12M` is the PAO symbol's text. */
  readonly note?: string;
}

/** A lot barcode's content (GS1 element string from the engine). */
export interface LabelBarcode {
  /** Human-readable form printed under the code, e.g. `(01)09521234543213(17)270131(10)RF-0412`. */
  readonly hri: string;
  /** Warnings the engine gave (no GTIN: an internal code). */
  readonly warnings: readonly string[];
}

/** Everything one market's label carries. */
export interface LabelContent {
  readonly market: ComplianceMarket;
  readonly fields: readonly LabelField[];
  /** Null when there is no lot code to encode. */
  readonly barcode: LabelBarcode | null;
}

/** The area figures the minimum letter heights depend on. */
export interface LabelAreas {
  /** Area of the principal display panel in square inches (the front label's area). */
  readonly pdpAreaSqIn: number;
  /** Area of all the labels one product carries, in square inches (21 CFR 701.3(b)'s 12 sq in). */
  readonly labellingAreaSqIn: number;
}

export * from './label-minimums';
export * from './label-content-builder';
export * from './label-missing-elements';
