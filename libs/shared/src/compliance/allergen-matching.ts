import {
  euAnnexIiiAllergens,
  type EuAnnexIiiAllergen,
} from '../reference-data/eu-annex-iii-allergens';
import { normaliseName } from './ingredient-names';

const byCas = new Map<string, EuAnnexIiiAllergen>();
const byName = new Map<string, EuAnnexIiiAllergen>();
for (const row of euAnnexIiiAllergens) {
  byName.set(normaliseName(row.labelName), row);
  for (const substance of row.substances) {
    if (substance.cas) byCas.set(substance.cas, row);
    if (!byName.has(normaliseName(substance.name))) byName.set(normaliseName(substance.name), row);
  }
}
/** The Annex III entry for a substance, by CAS number first, then by name; null when it is not listed. */
export function matchAnnexIiiAllergen(substance: {
  inci: string;
  cas?: string | undefined;
}): EuAnnexIiiAllergen | null {
  if (substance.cas) {
    const row = byCas.get(substance.cas);
    if (row) return row;
  }
  return byName.get(normaliseName(substance.inci)) ?? null;
}
