import type {
  EuAnnexIiiAllergen,
  EuProhibitedFragranceSubstance,
} from './eu-annex-iii-allergen-row';
import { euAnnexIii2023Allergens } from './eu-annex-iii-allergens-2023-1545';
import { euAnnexIiiOriginalAllergens } from './eu-annex-iii-allergens-original';

export type {
  AllergenListOrigin,
  AnnexIiiSubstance,
  EuAnnexIiiAllergen,
  EuProhibitedFragranceSubstance,
} from './eu-annex-iii-allergen-row';
export {
  ALLERGEN_LABELLING_THRESHOLD_PERCENT,
  CA_ALLERGEN_LABELLING_FROM,
  EU_2023_1545_IN_FORCE,
  EU_ALLERGEN_AVAILABILITY_DEADLINE,
  EU_ALLERGEN_PLACING_DEADLINE,
} from './eu-annex-iii-allergen-row';

/**
 * Annex III entries carrying the fragrance-allergen labelling condition (regulatory sources file, 2.3).
 * Substances and CAS numbers are confirmed from the official export; label names are C2 or, where
 * marked, from memory — for those the engine uses the supplier's INCI name instead.
 */
export const euAnnexIiiAllergens: readonly EuAnnexIiiAllergen[] = [
  ...euAnnexIiiOriginalAllergens,
  ...euAnnexIii2023Allergens,
].sort((a, b) => Number(a.annexRef) - Number(b.annexRef));

/**
 * Former labelled allergens now prohibited (moved to Annex II). From memory: the CAS numbers and the
 * amending regulations ((EU) 2017/1410, (EU) 2021/1902) are not yet confirmed, so the engine warns.
 */
export const euProhibitedFragranceSubstances: readonly EuProhibitedFragranceSubstance[] = [
  {
    id: 'eu-annex-ii-hicc',
    labelName: 'Hydroxyisohexyl 3-Cyclohexene Carboxaldehyde',
    cas: '31906-04-4',
    formerAnnexRef: '79',
    source:
      'Regulation (EC) No 1223/2009, Annex II (moved from Annex III entry 79; amending regulation (EU) 2017/1410 from memory)',
    status: 'M',
  },
  {
    id: 'eu-annex-ii-butylphenyl-methylpropional',
    labelName: 'Butylphenyl Methylpropional',
    cas: '80-54-6',
    formerAnnexRef: '83',
    source:
      'Regulation (EC) No 1223/2009, Annex II (moved from Annex III entry 83; amending regulation (EU) 2021/1902 from memory)',
    status: 'M',
  },
];
