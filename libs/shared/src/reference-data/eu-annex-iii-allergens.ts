import type { EuAnnexIiiAllergen } from './eu-annex-iii-allergen-row';
import { euAnnexIii2023Allergens } from './eu-annex-iii-allergens-2023-1545';
import { euAnnexIiiOriginalAllergens } from './eu-annex-iii-allergens-original';

export type {
  AllergenListOrigin,
  AnnexIiiSubstance,
  EuAnnexIiiAllergen,
} from './eu-annex-iii-allergen-row';
export {
  ALLERGEN_LABELLING_THRESHOLD_PERCENT,
  CA_ALLERGEN_LABELLING_FROM,
  EU_2023_1545_IN_FORCE,
  EU_ALLERGEN_AVAILABILITY_DEADLINE,
  EU_ALLERGEN_PLACING_DEADLINE,
} from './eu-annex-iii-allergen-row';

/**
 * Annex III entries carrying the fragrance-allergen labelling condition (Regulation (EC) No 1223/2009, Annex III, as amended by Regulation (EU) 2023/1545).
 * Substances and CAS numbers are confirmed from the official export; label names are C2 or, where
 * marked, from memory — for those the engine uses the supplier's INCI name instead.
 */
export const euAnnexIiiAllergens: readonly EuAnnexIiiAllergen[] = [
  ...euAnnexIiiOriginalAllergens,
  ...euAnnexIii2023Allergens,
].sort((a, b) => Number(a.annexRef) - Number(b.annexRef));
