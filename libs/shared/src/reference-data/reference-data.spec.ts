import { describe, expect, it } from 'vitest';
import { parseColourIndex } from '../compliance/ingredient-names';
import {
  euAnnexIiiAllergens,
  EU_ALLERGEN_AVAILABILITY_DEADLINE,
  EU_ALLERGEN_PLACING_DEADLINE,
  CA_ALLERGEN_LABELLING_FROM,
} from './eu-annex-iii-allergens';
import { euAnnexIvColourants } from './eu-annex-iv-colourants';
import { referenceLists } from './reference-lists';
import { referenceStatusSchema } from './reference-row';
import { usColourAdditives, usNotPermittedColourants } from './us-colour-additives';

describe('reference lists', () => {
  const rows = referenceLists.flatMap((list) => list.rows);

  it('give every row a stable unique id, a source and a status', () => {
    expect(new Set(rows.map((r) => r.id)).size).toBe(rows.length);
    for (const row of rows) {
      expect(row.source.length).toBeGreaterThan(5);
      expect(referenceStatusSchema.safeParse(row.status).success).toBe(true);
    }
  });

  it('write effective dates as YYYY-MM-DD', () => {
    for (const row of rows) {
      for (const date of [row.effectiveFrom, row.effectiveTo])
        if (date !== undefined) expect(date).toMatch(/^\d{4}-\d{2}-\d{2}$/);
    }
  });

  it('give colourants well-formed Colour Index numbers', () => {
    const cis = [
      ...usColourAdditives.flatMap((r) => r.colourIndex),
      ...usNotPermittedColourants.flatMap((r) => r.colourIndex),
      ...euAnnexIvColourants.map((r) => r.colourIndex).filter(Boolean),
    ];
    for (const ci of cis) expect(parseColourIndex(ci)).toBe(ci);
  });

  it('key the EU colourants on a base CI number, never a salt suffix', () => {
    // Annex IV preamble: an entry covers its salts and lakes
    for (const row of euAnnexIvColourants) expect(row.colourIndex).not.toContain(':');
  });
});

describe('EU Annex III allergen list', () => {
  it('holds the 24 original labelled allergens (26 less the two now prohibited)', () => {
    // Regulation (EU) 2023/1545, recital [C2]: "only 24 fragrance allergens necessitated individual labelling"
    expect(euAnnexIiiAllergens.filter((r) => r.origin === 'original-26')).toHaveLength(24);
  });

  it('maps each CAS number to one entry only', () => {
    const cas = euAnnexIiiAllergens.flatMap((r) => [
      ...new Set(r.substances.map((s) => s.cas).filter((c): c is string => c !== null)),
    ]);
    expect(new Set(cas).size).toBe(cas.length);
  });

  it('carries the 2023/1545 and Canadian dates', () => {
    // Regulation (EU) 2023/1545, Annex III footnote (*); SOR/2024-63
    expect(EU_ALLERGEN_PLACING_DEADLINE).toBe('2026-07-31');
    expect(EU_ALLERGEN_AVAILABILITY_DEADLINE).toBe('2028-07-31');
    expect(CA_ALLERGEN_LABELLING_FROM).toBe('2026-04-12');
    for (const row of euAnnexIiiAllergens.filter((r) => r.origin === 'EU 2023/1545'))
      expect(row.transitionFootnote).toBe(true);
  });
});
