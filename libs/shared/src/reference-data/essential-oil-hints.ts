import type { EssentialOilHint } from './essential-oil-hint-row';

export type { EssentialOilHint } from './essential-oil-hint-row';

/** ISO 3515:2002 (lavender oil, "other origin" profile), as tabulated in Molecules 2022, 27, 3216, Table 2. */
const ISO_3515 =
  'ISO 3515:2002 chromatographic profile, quoted in Molecules 2022;27:3216 (PMC9148000), Table 2';
/** ISO 8902 (lavandin Grosso oil), as tabulated in Molecules 2022, 27, 2152, Table 6. */
const ISO_8902 =
  'ISO 8902 chromatographic profile, quoted in Molecules 2022;27:2152 (PMC9000678), Table 6';
/** ISO 4730 (tea tree oil), as tabulated in PMC5516420, Table 1. */
const ISO_4730 = 'ISO 4730 chromatographic profile, quoted in PMC5516420, Table 1';
/** Rows resting on general published compositions recalled from memory, not re-read. */
const MEMORY = 'Published essential-oil compositions (from memory; not re-read)';
/** CAS numbers Annex III itself gives for the oil, as added by Regulation (EU) 2023/1545. */
const ANNEX_III_CAS = 'CAS as listed in Annex III (Regulation (EU) 2023/1545, official export)';

/**
 * Essential oils small-batch makers commonly use, with the Annex III labelled fragrance allergens each
 * typically contains (label names as in Annex III / INCI; main ones first).
 *
 * A hint for the user, never a substitute for the supplier's declaration: the allergen content of an
 * essential oil varies with origin, chemotype, distillation and age, and only the supplier's allergen
 * declaration (or IFRA/allergen certificate) for the lot in hand may be used to calculate what the
 * label must name. Batchproof uses these rows to tell the maker which allergens to ask the supplier
 * about, and never to compute a label on its own.
 *
 * Since Regulation (EU) 2023/1545 several of these oils are themselves Annex III labelled entries; that
 * matters when the oil is hidden inside a fragrance compound and is noted on the row.
 * Rows marked `M` are from memory.
 */
export const essentialOilHints: readonly EssentialOilHint[] = [
  {
    id: 'eo-lavender',
    name: 'Lavender oil',
    inciNames: ['Lavandula Angustifolia Oil', 'Lavandula Angustifolia (Lavender) Oil'],
    cas: ['8000-28-0'],
    typicalAllergens: ['Linalool', 'Linalyl Acetate', 'Camphor', 'Limonene'],
    typicalRanges: [
      'Linalool 20–43 %',
      'Linalyl Acetate 25–47 %',
      'Camphor ≤ 1.5 %',
      'Limonene ≤ 1 %',
    ],
    source: `${ISO_3515}; ${ANNEX_III_CAS}`,
    status: 'C2',
    note: 'Ranges are the ISO 3515 limits for "other origin" lavender. Suppliers often also declare Geraniol and Coumarin (from memory). The oil itself is an Annex III entry (360) since (EU) 2023/1545.',
  },
  {
    id: 'eo-lavandin',
    name: 'Lavandin oil (Grosso)',
    inciNames: ['Lavandula Hybrida Oil', 'Lavandula Hybrida Grosso Oil'],
    cas: ['8022-15-9'],
    typicalAllergens: ['Linalool', 'Linalyl Acetate', 'Camphor', 'Limonene'],
    typicalRanges: [
      'Linalool 24–37 %',
      'Linalyl Acetate 25–38 %',
      'Camphor 6.5–8 %',
      'Limonene 0.5–1.5 %',
    ],
    source: ISO_8902,
    status: 'C2',
    note: 'Allergens and ranges from the ISO 8902 (Grosso) column; INCI names and CAS number from memory.',
  },
  {
    id: 'eo-tea-tree',
    name: 'Tea tree oil',
    inciNames: ['Melaleuca Alternifolia Leaf Oil', 'Melaleuca Alternifolia (Tea Tree) Leaf Oil'],
    cas: ['68647-73-4', '85085-48-9'],
    typicalAllergens: ['Alpha-Terpinene', 'Terpinolene', 'Limonene', 'Pinene'],
    typicalRanges: [
      'Alpha-Terpinene 5–13 %',
      'Terpinolene 1.5–5 %',
      'Limonene 0.5–4 %',
      'alpha-Pinene 1–6 %',
    ],
    source: ISO_4730,
    status: 'C2',
    note: 'Ranges are ISO 4730 limits. alpha-Terpineol (1.5–8 %) may fall under the Annex III "Terpineol" entry; check the supplier declaration. INCI names and CAS numbers from memory.',
  },
  {
    id: 'eo-lemon',
    name: 'Lemon oil',
    inciNames: ['Citrus Limon Peel Oil', 'Citrus Limon (Lemon) Peel Oil'],
    cas: ['8008-56-8', '84929-31-7'],
    typicalAllergens: ['Limonene', 'Citral', 'Pinene', 'Geraniol', 'Linalool'],
    source: `${MEMORY}; ${ANNEX_III_CAS}`,
    status: 'M',
    note: 'The oil itself is an Annex III entry (353) since (EU) 2023/1545. Cold-pressed citrus oils can be phototoxic (a separate IFRA matter).',
  }, // from memory
  {
    id: 'eo-sweet-orange',
    name: 'Sweet orange oil',
    inciNames: [
      'Citrus Aurantium Dulcis Peel Oil',
      'Citrus Aurantium Dulcis (Orange) Peel Oil',
      'Citrus Sinensis Peel Oil',
    ],
    cas: ['8008-57-9'],
    typicalAllergens: ['Limonene', 'Linalool', 'Citral'],
    source: `${MEMORY}; ${ANNEX_III_CAS}`,
    status: 'M',
    note: 'The oil itself falls under an Annex III entry (351) since (EU) 2023/1545.',
  }, // from memory
  {
    id: 'eo-bergamot',
    name: 'Bergamot oil',
    inciNames: ['Citrus Aurantium Bergamia Peel Oil', 'Citrus Bergamia Peel Oil'],
    cas: ['8007-75-8', '68648-33-9'],
    typicalAllergens: ['Limonene', 'Linalyl Acetate', 'Linalool', 'Citral', 'Pinene'],
    source: `${MEMORY}; ${ANNEX_III_CAS}`,
    status: 'M',
    note: 'CAS 68648-33-9 is the Annex III entry (352) listing; 8007-75-8 from memory. Bergapten-free grades are sold for leave-on use.',
  }, // from memory
  {
    id: 'eo-lime',
    name: 'Lime oil',
    inciNames: ['Citrus Aurantifolia Peel Oil', 'Citrus Aurantifolia (Lime) Oil'],
    cas: ['8008-26-2'],
    typicalAllergens: ['Limonene', 'Citral', 'Pinene', 'Linalool'],
    source: MEMORY,
    status: 'M',
  }, // from memory
  {
    id: 'eo-grapefruit',
    name: 'Grapefruit oil',
    inciNames: ['Citrus Paradisi Peel Oil', 'Citrus Paradisi (Grapefruit) Peel Oil'],
    cas: ['8016-20-4'],
    typicalAllergens: ['Limonene', 'Linalool', 'Citral'],
    source: MEMORY,
    status: 'M',
  }, // from memory
  {
    id: 'eo-peppermint',
    name: 'Peppermint oil',
    inciNames: ['Mentha Piperita Oil', 'Mentha Piperita (Peppermint) Oil'],
    cas: ['8006-90-4', '84082-70-2'],
    typicalAllergens: ['Menthol', 'Limonene', 'Pinene', 'Linalool'],
    source: `${MEMORY}; ${ANNEX_III_CAS}`,
    status: 'M',
    note: 'The oil itself is an Annex III entry (361) since (EU) 2023/1545.',
  }, // from memory
  {
    id: 'eo-spearmint',
    name: 'Spearmint oil',
    inciNames: ['Mentha Spicata Herb Oil', 'Mentha Spicata Leaf Oil', 'Mentha Viridis Leaf Oil'],
    cas: ['8008-79-5', '84696-51-5'],
    typicalAllergens: ['Carvone', 'Limonene', 'Linalool', 'Menthol'],
    source: `${MEMORY}; ${ANNEX_III_CAS}`,
    status: 'M',
    note: 'The oil itself is an Annex III entry (362) since (EU) 2023/1545.',
  }, // from memory
  {
    id: 'eo-ylang-ylang',
    name: 'Ylang ylang oil',
    inciNames: ['Cananga Odorata Flower Oil', 'Cananga Odorata Oil'],
    cas: ['8006-81-3', '68606-83-7'],
    typicalAllergens: [
      'Linalool',
      'Benzyl Benzoate',
      'Benzyl Salicylate',
      'Beta-Caryophyllene',
      'Geraniol',
      'Farnesol',
      'Eugenol',
      'Isoeugenol',
    ],
    source: `${MEMORY}; ${ANNEX_III_CAS}`,
    status: 'M',
    note: 'CAS 68606-83-7 is the Annex III entry (347) listing; 8006-81-3 from memory.',
  }, // from memory
  {
    id: 'eo-cinnamon-leaf',
    name: 'Cinnamon leaf oil',
    inciNames: ['Cinnamomum Zeylanicum Leaf Oil', 'Cinnamomum Verum Leaf Oil'],
    cas: ['8015-96-1'],
    typicalAllergens: ['Eugenol', 'Beta-Caryophyllene', 'Linalool', 'Benzyl Benzoate', 'Cinnamal'],
    source: MEMORY,
    status: 'M',
    note: 'Eugenol is usually the main constituent; Annex III does not limit eugenol, but IFRA does.',
  }, // from memory
  {
    id: 'eo-cinnamon-bark',
    name: 'Cinnamon bark oil',
    inciNames: ['Cinnamomum Zeylanicum Bark Oil', 'Cinnamomum Verum Bark Oil'],
    cas: ['8015-91-6', '84649-98-9'],
    typicalAllergens: [
      'Cinnamal',
      'Eugenol',
      'Linalool',
      'Beta-Caryophyllene',
      'Benzyl Benzoate',
      'Coumarin',
      'Cinnamyl Alcohol',
    ],
    source: `${MEMORY}; ${ANNEX_III_CAS}`,
    status: 'M',
    note: 'Cinnamal is usually the main constituent. The oil itself is an Annex III entry (349) since (EU) 2023/1545.',
  }, // from memory
  {
    id: 'eo-clove',
    name: 'Clove oil (bud or leaf)',
    inciNames: [
      'Eugenia Caryophyllus Bud Oil',
      'Eugenia Caryophyllus Leaf Oil',
      'Syzygium Aromaticum Bud Oil',
      'Syzygium Aromaticum Leaf Oil',
    ],
    cas: ['8000-34-8', '84961-50-2'],
    typicalAllergens: ['Eugenol', 'Beta-Caryophyllene', 'Eugenyl Acetate', 'Isoeugenol'],
    source: `${MEMORY}; ${ANNEX_III_CAS}`,
    status: 'M',
    note: 'The oil itself is an Annex III entry (356) since (EU) 2023/1545.',
  }, // from memory
  {
    id: 'eo-eucalyptus',
    name: 'Eucalyptus oil',
    inciNames: ['Eucalyptus Globulus Leaf Oil', 'Eucalyptus Globulus Oil'],
    cas: ['8000-48-4', '97926-40-4'],
    typicalAllergens: ['Limonene', 'Pinene', 'Linalool'],
    source: `${MEMORY}; ${ANNEX_III_CAS}`,
    status: 'M',
    note: 'The main constituent, 1,8-cineole (eucalyptol), is not a labelled allergen. The oil itself is an Annex III entry (355) since (EU) 2023/1545.',
  }, // from memory
  {
    id: 'eo-rosemary',
    name: 'Rosemary oil',
    inciNames: ['Rosmarinus Officinalis Leaf Oil', 'Rosmarinus Officinalis (Rosemary) Leaf Oil'],
    cas: ['8000-25-7'],
    typicalAllergens: ['Camphor', 'Pinene', 'Limonene', 'Linalool', 'Beta-Caryophyllene'],
    source: MEMORY,
    status: 'M',
  }, // from memory
  {
    id: 'eo-geranium',
    name: 'Geranium oil',
    inciNames: ['Pelargonium Graveolens Flower Oil', 'Pelargonium Graveolens Oil'],
    cas: ['8000-46-2', '90082-51-2'],
    typicalAllergens: ['Citronellol', 'Geraniol', 'Linalool', 'Citral', 'Limonene'],
    source: `${MEMORY}; ${ANNEX_III_CAS}`,
    status: 'M',
    note: 'The oil itself is an Annex III entry (364) since (EU) 2023/1545.',
  }, // from memory
  {
    id: 'eo-patchouli',
    name: 'Patchouli oil',
    inciNames: ['Pogostemon Cablin Oil', 'Pogostemon Cablin Leaf Oil'],
    cas: ['8014-09-3'],
    typicalAllergens: ['Beta-Caryophyllene'],
    source: MEMORY,
    status: 'M',
    note: 'Few labelled constituents; the oil itself is an Annex III entry (365) since (EU) 2023/1545. The regulatory sources file notes the export may have swapped the oil and extract CAS numbers.',
  }, // from memory
  {
    id: 'eo-rose',
    name: 'Rose oil (otto)',
    inciNames: ['Rosa Damascena Flower Oil', 'Rosa Damascena (Rose) Flower Oil'],
    cas: ['8007-01-0', '90106-38-0'],
    typicalAllergens: ['Citronellol', 'Geraniol', 'Eugenol', 'Linalool', 'Farnesol', 'Citral'],
    source: MEMORY,
    status: 'M',
  }, // from memory
  {
    id: 'eo-cedarwood-virginia',
    name: 'Cedarwood oil (Virginia)',
    inciNames: ['Juniperus Virginiana Oil', 'Juniperus Virginiana Wood Oil'],
    cas: ['8000-27-9', '85085-41-2'],
    typicalAllergens: [],
    source: `${MEMORY}; ${ANNEX_III_CAS}`,
    status: 'M',
    note: 'Few or no separately labelled constituents; the oil itself is an Annex III entry (358) since (EU) 2023/1545, so ask the supplier how to declare it inside a fragrance compound.',
  }, // from memory
  {
    id: 'eo-lemongrass',
    name: 'Lemongrass oil',
    inciNames: ['Cymbopogon Citratus Leaf Oil', 'Cymbopogon Flexuosus Oil'],
    cas: ['8007-02-1', '91844-92-7'],
    typicalAllergens: ['Citral', 'Geraniol', 'Limonene', 'Linalool', 'Farnesol'],
    source: `${MEMORY}; ${ANNEX_III_CAS}`,
    status: 'M',
    note: 'Citral is usually the main constituent. The oil itself is an Annex III entry (354) since (EU) 2023/1545.',
  }, // from memory
  {
    id: 'eo-litsea',
    name: 'Litsea (may chang) oil',
    inciNames: ['Litsea Cubeba Fruit Oil'],
    cas: ['68855-99-2'],
    typicalAllergens: ['Citral', 'Limonene', 'Linalool', 'Geraniol'],
    source: MEMORY,
    status: 'M',
  }, // from memory
  {
    id: 'eo-palmarosa',
    name: 'Palmarosa oil',
    inciNames: ['Cymbopogon Martini Oil', 'Cymbopogon Martini Herb Oil'],
    cas: ['8014-19-5'],
    typicalAllergens: ['Geraniol', 'Linalool', 'Farnesol', 'Citral', 'Limonene'],
    source: MEMORY,
    status: 'M',
    note: 'Geraniol is usually the main constituent.',
  }, // from memory
  {
    id: 'eo-clary-sage',
    name: 'Clary sage oil',
    inciNames: ['Salvia Sclarea Oil', 'Salvia Sclarea (Clary) Oil'],
    cas: ['8016-63-5'],
    typicalAllergens: ['Linalyl Acetate', 'Linalool', 'Geraniol', 'Sclareol', 'Limonene'],
    source: MEMORY,
    status: 'M',
  }, // from memory
  {
    id: 'eo-frankincense',
    name: 'Frankincense oil',
    inciNames: ['Boswellia Carterii Oil', 'Boswellia Sacra Oil'],
    cas: ['8016-36-2'],
    typicalAllergens: ['Limonene', 'Pinene', 'Linalool'],
    source: MEMORY,
    status: 'M',
  }, // from memory
];
