import type { ReferenceRow, ReferenceStatus } from './reference-row';

/** Cosmetic uses a US colour additive listing allows (21 CFR Parts 73, 74, 82). */
export interface UsColourAdditiveUses {
  /** Whether it is listed for cosmetics generally (includes lips and mucous membranes, not the eye area). */
  readonly generally: boolean;
  /** Whether the listing specifically provides for the area of the eye (21 CFR 70.5(a)). */
  readonly eyeArea: boolean;
  /** Whether eye-area use extends to the aluminium lake (lakes need their own eye-area listing). */
  readonly eyeAreaIncludesLake?: boolean;
  /** Whether it is listed for externally applied cosmetics: not lips, not mucous membranes (21 CFR 82.3(n)). */
  readonly externallyApplied: boolean;
  /** Lip products allowed up to this percent of the finished product, for colours not listed "generally". */
  readonly lipProductsMaxPercent?: number;
  /** The only product types the listing allows, when it names them. */
  readonly restrictedTo?: readonly string[];
}

/** One US colour additive listed for cosmetics, with its permitted uses. */
export interface UsColourAdditive extends ReferenceRow {
  /** The FDA listed name, e.g. `FD&C Blue No. 1`. */
  readonly name: string;
  /** Other names makers and suppliers use for it (lower-case matching). */
  readonly aliases: readonly string[];
  /** Colour Index numbers, e.g. `77491` or `15850:1`; empty when it has none. Not unique US keys. */
  readonly colourIndex: readonly string[];
  /** How sure we are of the CI number pairing. */
  readonly colourIndexStatus: ReferenceStatus;
  /** The 21 CFR section listing it for cosmetics. */
  readonly cfrSection: string;
  /** Whether every batch must be FDA-certified (Part 74 colours and all lakes). */
  readonly certificationRequired: boolean;
  /** What the listing allows. */
  readonly uses: UsColourAdditiveUses;
}

/** Uses shorthand: generally, eye area and external. */
export const ALL = { generally: true, eyeArea: true, externallyApplied: true } as const;
/** Uses shorthand: generally (incl. lips), not the eye area. */
export const GENERAL_NOT_EYE = {
  generally: true,
  eyeArea: false,
  externallyApplied: true,
} as const;
/** Uses shorthand: externally applied, including the eye area. */
export const EXTERNAL_AND_EYE = {
  generally: false,
  eyeArea: true,
  externallyApplied: true,
} as const;
/** Uses shorthand: externally applied only. */
export const EXTERNAL_ONLY = { generally: false, eyeArea: false, externallyApplied: true } as const;
/** Source wording for the FDA summary table. */
export const FDA_TABLE_2019 = 'FDA, Color Additives Permitted for Use in Cosmetics (2019 copy)';

/** Builds a Part 73 (certification-exempt) row. */
export function exempt(
  id: string,
  name: string,
  colourIndex: string[],
  cfrSection: string,
  uses: UsColourAdditiveUses,
  status: ReferenceStatus,
  colourIndexStatus: ReferenceStatus,
  extra: { aliases?: string[]; source?: string; note?: string } = {},
): UsColourAdditive {
  return {
    id,
    name,
    aliases: extra.aliases ?? [],
    colourIndex,
    colourIndexStatus,
    cfrSection,
    certificationRequired: false,
    uses,
    source: extra.source ?? `21 CFR ${cfrSection}`,
    status,
    ...(extra.note === undefined ? {} : { note: extra.note }),
  };
}

/** Builds a Part 74 (certified) row. */
export function certified(
  id: string,
  name: string,
  colourIndex: string[],
  cfrSection: string,
  uses: UsColourAdditiveUses,
  status: ReferenceStatus,
  colourIndexStatus: ReferenceStatus,
  extra: { aliases?: string[]; source?: string; note?: string } = {},
): UsColourAdditive {
  return {
    ...exempt(id, name, colourIndex, cfrSection, uses, status, colourIndexStatus, extra),
    certificationRequired: true,
  };
}
