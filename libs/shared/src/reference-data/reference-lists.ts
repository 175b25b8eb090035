import { caHotlistSubstances } from './ca-hotlist-substances';
import { essentialOilHints } from './essential-oil-hints';
import { euAnnexIiiAllergens } from './eu-annex-iii-allergens';
import { euRestrictedSubstances } from './eu-restricted-substances';
import { foamingSurfactants } from './foaming-surfactants';
import { usLabelNames } from './us-label-names';
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
    key: 'eu-restricted-substances',
    title: 'EU and UK prohibited and restricted substances',
    description:
      'Annex II prohibitions and Annex III and V restrictions (preservatives, maxima, rinse-off only) of Regulation (EC) No 1223/2009 that reach bath and body products, with their dates.',
    rows: euRestrictedSubstances,
  },
  {
    key: 'ca-hotlist-substances',
    title: 'Canada: Cosmetic Ingredient Hotlist entries',
    description:
      "Health Canada's prohibited and restricted cosmetic ingredients that Batchproof checks, where the entry could be confirmed.",
    rows: caHotlistSubstances,
  },
  {
    key: 'essential-oil-hints',
    title: 'Essential oils and the allergens they typically carry',
    description:
      "A hint for what to ask the supplier for; never used in place of the supplier's allergen declaration.",
    rows: essentialOilHints,
  },
  {
    key: 'us-label-names',
    title: 'US names for EU glossary names',
    description:
      'Latin or EU-only ingredient names that a US label prints by their US name (Aqua as Water).',
    rows: usLabelNames,
  },
  {
    key: 'foaming-surfactants',
    title: 'Foaming and cleansing surfactants',
    description:
      'Surfactants that make a bath product a foaming detergent bath product (21 CFR 740.17) whatever function is typed.',
    rows: foamingSurfactants,
  },
  {
    key: 'required-warnings',
    title: 'Required warning statements',
    description: 'Label warnings a regulation requires for some products.',
    rows: requiredWarnings,
  },
];
