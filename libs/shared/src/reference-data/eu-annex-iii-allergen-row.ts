import type { ReferenceRow, ReferenceStatus } from './reference-row';

/** Regulation that made an Annex III entry a labelled fragrance allergen. */
export type AllergenListOrigin = 'original-26' | 'EU 2023/1545';

/** A substance an Annex III entry covers, as named in the official export. */
export interface AnnexIiiSubstance {
  /** Chemical or botanical name as listed. */
  readonly name: string;
  /** CAS number, when the export gives one. */
  readonly cas: string | null;
}

/** One Annex III entry whose presence must be labelled above 0.001 % (leave-on) / 0.01 % (rinse-off). */
export interface EuAnnexIiiAllergen extends ReferenceRow {
  /** Annex III reference number. */
  readonly annexRef: string;
  /** Glossary/INCI name to use in the ingredient list. */
  readonly labelName: string;
  /** How sure we are of the label name (the substances and CAS numbers are confirmed). */
  readonly labelNameStatus: ReferenceStatus;
  /** Substances and CAS numbers covered by the entry. */
  readonly substances: readonly AnnexIiiSubstance[];
  /** Whether labelling dates from the original list or was added by Regulation (EU) 2023/1545. */
  readonly origin: AllergenListOrigin;
  /** Whether the entry carries the 2023/1545 transition footnote (31 Jul 2026 / 31 Jul 2028). */
  readonly transitionFootnote: boolean;
  /** Maximum concentration Annex III also sets for non-oral cosmetic products, when it does. */
  readonly maxPercent?: number;
  /** Whether a peroxide value limit also applies (not checked by Batchproof). */
  readonly peroxideLimit?: boolean;
}

/**
 * Products that do not name the 2023/1545 allergens may be placed on the EU market until this day,
 * and made available until {@link EU_ALLERGEN_AVAILABILITY_DEADLINE}. Regulation (EU) 2023/1545,
 * Annex III footnote (*).
 */
export const EU_ALLERGEN_PLACING_DEADLINE = '2026-07-31';
/** Last day products not naming the 2023/1545 allergens may be made available in the EU. */
export const EU_ALLERGEN_AVAILABILITY_DEADLINE = '2028-07-31';
/** Day Regulation (EU) 2023/1545 entered into force. */
export const EU_2023_1545_IN_FORCE = '2023-08-16';
/** Day Canada's fragrance-allergen labelling applies (SOR/2024-63). */
export const CA_ALLERGEN_LABELLING_FROM = '2026-04-12';
/** Annex III labelling thresholds, percent of the finished product; the obligation applies when exceeded. */
export const ALLERGEN_LABELLING_THRESHOLD_PERCENT = {
  'leave-on': 0.001,
  'rinse-off': 0.01,
} as const;

const EXPORT =
  'Regulation (EC) No 1223/2009, Annex III, as amended by Regulation (EU) 2023/1545 (ECHA/EC export 16/05/2024)';

type Sub = readonly [string, string | null];

/** Builds one Annex III allergen row (internal to the reference data). */
export function entry(
  annexRef: string,
  labelName: string,
  labelNameStatus: ReferenceStatus,
  origin: AllergenListOrigin,
  transitionFootnote: boolean,
  substances: readonly Sub[],
  extra: { maxPercent?: number; peroxideLimit?: boolean; note?: string } = {},
): EuAnnexIiiAllergen {
  return {
    id: `eu-annex-iii-${annexRef}`,
    annexRef,
    labelName,
    labelNameStatus,
    substances: substances.map(([name, cas]) => ({ name, cas })),
    origin,
    transitionFootnote,
    source: EXPORT,
    status: 'C',
    ...(origin === 'EU 2023/1545' ? { effectiveFrom: EU_2023_1545_IN_FORCE } : {}),
    ...extra,
  };
}

/** Origin shorthand: the original 26 (24 still labelled). */
export const O = 'original-26' as const;
/** Origin shorthand: added by Regulation (EU) 2023/1545. */
export const N = 'EU 2023/1545' as const;
/** Extra for entries with a peroxide value limit. */
export const PEROXIDE = { peroxideLimit: true } as const;
