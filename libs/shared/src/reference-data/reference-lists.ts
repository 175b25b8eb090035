import { euAnnexIiiAllergens, euProhibitedFragranceSubstances } from './eu-annex-iii-allergens';
import { euAnnexIvColourants } from './eu-annex-iv-colourants';
import type { ReferenceRow } from './reference-row';
import { requiredWarnings } from './required-warnings';
import { usColourAdditives, usNotPermittedColourants } from './us-colour-additives';

/** One reference list, for seeding and for the read-only "Reference lists" page. */
export interface ReferenceList {
  /** Stable key, used in `GET /api/reference/:key` and as a seed table discriminator. */
  readonly key: string;
  /** Title to show. */
  readonly title: string;
  /** One sentence on what the list is. */
  readonly description: string;
  /** The rows. */
  readonly rows: readonly ReferenceRow[];
}

/** Every reference list the compliance engine uses, in display order. */
export const referenceLists: readonly ReferenceList[] = [
  {
    key: 'us-colour-additives',
    title: 'US colour additives for cosmetics',
    description:
      'Colour additives listed in 21 CFR Parts 73 and 74 with the cosmetic uses each listing allows.',
    rows: usColourAdditives,
  },
  {
    key: 'us-not-permitted-colourants',
    title: 'Colourants not permitted in US cosmetics',
    description: 'Colourants makers meet that have no US cosmetic listing.',
    rows: usNotPermittedColourants,
  },
  {
    key: 'eu-annex-iv-colourants',
    title: 'EU and UK Annex IV colourants',
    description:
      'Colourants allowed by Annex IV of Regulation (EC) No 1223/2009, with field of application and conditions.',
    rows: euAnnexIvColourants,
  },
  {
    key: 'eu-annex-iii-allergens',
    title: 'Labelled fragrance allergens (EU Annex III, Canada)',
    description:
      'Annex III entries named in the ingredient list above 0.001 % (leave-on) or 0.01 % (rinse-off), as amended by (EU) 2023/1545.',
    rows: euAnnexIiiAllergens,
  },
  {
    key: 'eu-prohibited-fragrance-substances',
    title: 'Former allergens now prohibited in the EU',
    description: 'Former Annex III allergens moved to Annex II.',
    rows: euProhibitedFragranceSubstances,
  },
  {
    key: 'required-warnings',
    title: 'Required warning statements',
    description: 'Label warnings a regulation requires for some products.',
    rows: requiredWarnings,
  },
];
