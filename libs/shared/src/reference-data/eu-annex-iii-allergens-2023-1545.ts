import { entry, N, PEROXIDE, type EuAnnexIiiAllergen } from './eu-annex-iii-allergen-row';

/**
 * Labelled allergens added by Regulation (EU) 2023/1545. Label names marked `M` are from memory; for
 * those the engine prints the supplier's INCI name instead.
 */
export const euAnnexIii2023Allergens: readonly EuAnnexIiiAllergen[] = [
  entry('46', '6-Methylcoumarin', 'M', N, true, [['6-Methylcoumarin', '92-48-8']], {
    note: 'Maximum 0.003 % applies to oral products only.',
  }),
  entry(
    '109',
    'Pinus Mugo Leaf/Twig Oil',
    'M',
    N,
    true,
    [['Pinus mugo leaf and twig oil and extract', '90082-72-7']],
    PEROXIDE,
  ),
  entry(
    '114',
    'Pinus Pumila Leaf/Twig Oil',
    'M',
    N,
    true,
    [['Pinus pumila leaf and twig oil and extract', '97676-05-6']],
    PEROXIDE,
  ),
  entry(
    '122',
    'Cedrus Atlantica Bark Oil',
    'M',
    N,
    true,
    [
      ['Cedrus atlantica oil', '8023-85-6'],
      ['Cedrus atlantica extract', '92201-55-3'],
    ],
    PEROXIDE,
  ),
  entry(
    '124',
    'Turpentine',
    'C2',
    N,
    true,
    [
      ['Turpentine gum (Pinus spp.)', '9005-90-7'],
      ['Turpentine oil and rectified oil', '8006-64-2'],
      ['Turpentine, steam distilled (Pinus spp.)', '8052-14-0'],
    ],
    PEROXIDE,
  ),
  entry('131', 'Alpha-Terpinene', 'C2', N, true, [['p-Mentha-1,3-diene', '99-86-5']], PEROXIDE),
  entry('133', 'Terpinolene', 'C2', N, true, [['p-Mentha-1,4(8)-diene', '586-62-9']], PEROXIDE),
  entry('154', 'Myroxylon Pereirae Oil', 'M', N, true, [['Balsam Peru oil', '8007-00-9']], {
    maxPercent: 0.4,
  }),
  entry(
    '157',
    'Rose Ketones',
    'C',
    N,
    true,
    [
      ['(E)-1-(2,6,6-Trimethyl-1-cyclohexen-1-yl)-2-buten-1-one', '23726-91-2'],
      ['(E)-1-(2,6,6-Trimethyl-2-cyclohexen-1-yl)-2-buten-1-one', '24720-09-0'],
      ['(Z)-1-(2,6,6-Trimethyl-1-cyclohexen-1-yl)-2-buten-1-one', '23726-92-3'],
      ['(Z)-1-(2,6,6-Trimethyl-2-cyclohexen-1-yl)-2-buten-1-one', '23726-94-5'],
      ['1-(2,6,6-Trimethyl-2-cyclohexen-1-yl)-2-butenone', '43052-87-5'],
      ['1-(2,6,6-Trimethyl-3-cyclohexen-1-yl)-2-buten-1-one', '57378-68-4'],
      ['1-(2,6,6-Trimethylcyclohexa-1,3-dien-1-yl)-2-buten-1-one', '23696-85-7'],
      ['rel-(2E)-1-[(1R,2S)-2,6,6-Trimethyl-3-cyclohexen-1-yl]-2-buten-1-one', '71048-82-3'],
    ],
    { maxPercent: 0.02 },
  ),
  entry(
    '175',
    '3-Propylidenephthalide',
    'C2',
    N,
    true,
    [['3-Propylidenephthalide', '17369-59-4']],
    { maxPercent: 0.01 },
  ),
  entry(
    '196',
    'Lippia Citriodora Flower Extract',
    'M',
    N,
    true,
    [
      ['Aloysia triphylla extract', '85116-63-8'],
      ['Verbena absolute', '8024-12-2'],
    ],
    {
      maxPercent: 0.2,
      note: 'Labelling sentence not in the export row; listed as a new labelled allergen by a secondary source (C2).',
    },
  ),
  entry('324', 'Methyl Salicylate', 'C2', N, true, [['Methyl 2-hydroxybenzoate', '119-36-8']], {
    note: 'Maxima differ by product type (0.06 % for most rinse-off and leave-on skin products); Batchproof does not check them yet.',
  }),
  entry('327', 'Acetyl Cedrene', 'C2', N, true, [['Acetyl cedrene', '32388-55-9']]),
  entry('328', 'Amyl Salicylate', 'C2', N, true, [['Pentyl-2-hydroxy-benzoate', '2050-08-0']]),
  entry('329', 'Anethole', 'C2', N, true, [
    ['trans-Anethole', '4180-23-8'],
    ['Anethole', '104-46-1'],
  ]),
  entry('330', 'Benzaldehyde', 'C2', N, true, [['Benzaldehyde', '100-52-7']]),
  entry('331', 'Camphor', 'C2', N, true, [
    ['(+)-Camphor', '464-49-3'],
    ['(-)-Camphor', '464-48-2'],
    ['Bornan-2-one', '76-22-2'],
  ]),
  entry('332', 'Beta-Caryophyllene', 'C2', N, true, [['Beta-caryophyllene', '87-44-5']]),
  entry('333', 'Carvone', 'C2', N, true, [
    ['(5R)-Carvone', '6485-40-1'],
    ['(5S)-Carvone', '2244-16-8'],
    ['Carvone', '99-49-0'],
  ]),
  entry('334', 'Dimethyl Phenethyl Acetate', 'C2', N, true, [
    ['2-Methyl-1-phenyl-2-propyl acetate', '151-05-3'],
  ]),
  entry('335', 'Hexadecanolactone', 'C2', N, true, [['Oxacycloheptadecan-2-one', '109-29-5']]),
  entry('336', 'Hexamethylindanopyran', 'C2', N, true, [
    ['Hexahydro-hexamethylcyclopenta-γ-2-benzopyran', '1222-05-5'],
  ]),
  entry('337', 'Linalyl Acetate', 'M', N, true, [
    ['3,7-Dimethylocta-1,6-diene-3-yl acetate', '115-95-7'],
  ]),
  entry('338', 'Menthol', 'M', N, true, [
    ['d-Menthol', '15356-60-2'],
    ['dl-Menthol', '89-78-1'],
    ['l-Menthol', '2216-51-5'],
    ['Menthol', '1490-04-6'],
  ]),
  entry('339', 'Trimethylcyclopentenylmethylpentenol (glossary name not confirmed)', 'M', N, true, [
    ['3-Methyl-5-(2,2,3-trimethyl-3-cyclopentenyl)pent-4-en-2-ol', '67801-20-1'],
  ]),
  entry('340', 'Salicylaldehyde', 'M', N, true, [['o-Hydroxybenzaldehyde', '90-02-8']]),
  entry('341', 'Santalol', 'M', N, true, [
    ['beta-Santalol', '77-42-9'],
    ['Santalol isomer', '11031-45-1'],
    ['alpha-Santalol', '115-71-9'],
  ]),
  entry('342', 'Sclareol', 'M', N, true, [['Sclareol', '515-03-7']]),
  entry('343', 'Terpineol', 'M', N, true, [
    ['gamma-Terpineol', '586-81-2'],
    ['beta-Terpineol', '138-87-4'],
    ['Terpineol (mixed isomers)', '8000-41-7'],
    ['alpha-Terpineol', '98-55-5'],
  ]),
  entry('344', 'Tetramethyl Acetyloctahydronaphthalenes', 'M', N, true, [
    ['Octahydro-2,3,5,5-tetramethyl-2-naphthyl ethanone', '54464-59-4'],
    ['Octahydro-2,3,8,8-tetramethyl-2-naphthyl ethanone', '54464-57-2'],
    ['1,2,3,4,6,7,8,8a-Octahydro-2,3,8,8-tetramethyl-2-naphthyl ethanone', '68155-67-9'],
    ['1,2,3,5,6,7,8,8a-Octahydro-2,3,8,8-tetramethyl-2-naphthyl ethanone', '68155-66-8'],
  ]),
  entry('345', 'Trimethylbenzenepropanol', 'M', N, true, [
    ['3-(2,2-Dimethyl-3-hydroxypropyl)toluene', '103694-68-4'],
  ]),
  entry('346', 'Vanillin', 'M', N, true, [['4-Hydroxy-3-methoxybenzaldehyde', '121-33-5']]),
  entry('347', 'Cananga Odorata Flower Oil', 'M', N, true, [
    ['Cananga odorata flower extract', '93686-30-7'],
    ['Cananga flower oils', '68606-83-7'],
    ['Cananga odorata flower oil', '8006-81-3'],
    ['Ylang Ylang flower extract', '83863-30-3'],
  ]),
  entry('348', 'Cinnamomum Cassia Leaf Oil', 'M', N, true, [
    ['Cinnamomum cassia leaf extract', '84961-46-6'],
    ['Cinnamomum cassia leaf oil', '8007-80-5'],
  ]),
  entry('349', 'Cinnamomum Zeylanicum Bark Oil', 'M', N, true, [
    ['Cinnamomum zeylanicum bark oil', '8015-91-6'],
    ['Cinnamomum zeylanicum bark extract', '84649-98-9'],
  ]),
  entry('350', 'Citrus Aurantium Amara Flower Oil', 'M', N, true, [
    ['Citrus aurantium amara and dulcis flower oils', '8016-38-4'],
    ['Citrus aurantium dulcis flower extract', '8028-48-6'],
  ]),
  entry('351', 'Citrus Aurantium Amara Peel Oil', 'M', N, true, [
    ['Citrus aurantium amara peel oil', '68916-04-1'],
    ['Citrus aurantium dulcis peel oil', '8008-57-9'],
    ['Citrus sinensis peel extract', '97766-30-8'],
    ['Citrus aurantium amara peel extract', '72968-50-4'],
  ]),
  entry('352', 'Citrus Aurantium Bergamia Peel Oil', 'M', N, true, [
    ['Citrus aurantium bergamia oil', '68648-33-9'],
    ['Citrus aurantium bergamia extract', '89957-91-5'],
    ['Bergamot oil', '8007-75-8'],
  ]),
  entry('353', 'Citrus Limon Peel Oil', 'M', N, true, [
    ['Citrus limon oil', '8008-56-8'],
    ['Citrus limon extract', '84929-31-7'],
  ]),
  entry('354', 'Cymbopogon Citratus Leaf Oil', 'M', N, true, [
    ['Cymbopogon citratus oils', '8007-02-1'],
    ['Cymbopogon flexuosus oils', '91844-92-7'],
    ['Cymbopogon schoenanthus oils', '89998-16-3'],
  ]),
  entry('355', 'Eucalyptus Globulus Leaf Oil', 'M', N, true, [
    ['Eucalyptus globulus extract', '97926-40-4'],
    ['Eucalyptus globulus oil', '8000-48-4'],
  ]),
  entry('356', 'Eugenia Caryophyllus Bud Oil', 'M', N, true, [
    ['Eugenia caryophyllus extract', '84961-50-2'],
    ['Eugenia caryophyllus oil', '8000-34-8'],
  ]),
  entry('357', 'Jasminum Officinale Oil', 'M', N, true, [
    ['Jasmine oils', '8022-96-6'],
    ['Jasminum grandiflorum/officinale oil and extract', '8024-43-9'],
    ['Jasminum officinale extract', '90045-94-6'],
    ['Jasminum grandiflorum extract', '84776-64-7'],
  ]),
  entry('358', 'Juniperus Virginiana Oil', 'M', N, true, [
    ['Juniperus virginiana extract', '85085-41-2'],
    ['Juniperus virginiana oil', '8000-27-9'],
  ]),
  entry('359', 'Laurus Nobilis Leaf Oil', 'M', N, true, [
    ['Laurus nobilis oil', '8007-48-5'],
    ['Laurus nobilis extract', '84603-73-6'],
    ['Laurus nobilis oil', '8002-41-3'],
  ]),
  entry('360', 'Lavandula Angustifolia Oil', 'M', N, true, [
    ['Lavandula angustifolia / intermedia oil and extract', '8000-28-0'],
    ['Lavandula angustifolia extract', '84776-65-8'],
    ['Lavandula hybrida oil/extract', '8022-15-9'],
    ['Lavandula hybrida extract', '91722-69-9'],
    ['Lavandula hybrida oil/extract', '93455-97-1'],
    ['Lavandula hybrida oil/extract', '93455-96-0'],
    ['Lavandula intermedia extract', '92623-76-2'],
    ['Lavandula angustifolia extract', '90063-37-9'],
  ]),
  entry('361', 'Mentha Piperita Oil', 'M', N, true, [
    ['Mentha piperita extract', '84082-70-2'],
    ['Mentha piperita oil', '8006-90-4'],
  ]),
  entry('362', 'Mentha Spicata Herb Oil', 'M', N, true, [
    ['Spearmint oil', '8008-79-5'],
    ['Spearmint extract', '84696-51-5'],
  ]),
  entry('363', 'Narcissus Poeticus Flower Extract', 'M', N, true, [
    ['Narcissus jonquilla extract', '90064-25-8'],
    ['Narcissus poeticus extract', '90064-26-9'],
    ['Narcissus poeticus oils', '68917-12-4'],
    ['Narcissus pseudonarcissus extract', '90064-27-0'],
  ]),
  entry('364', 'Pelargonium Graveolens Flower Oil', 'M', N, true, [
    ['Pelargonium graveolens extract', '90082-51-2'],
    ['Pelargonium graveolens oil', '8000-46-2'],
  ]),
  entry(
    '365',
    'Pogostemon Cablin Oil',
    'M',
    N,
    true,
    [
      ['Pogostemon cablin extract', '8014-09-3'],
      ['Pogostemon cablin oil', '84238-39-1'],
    ],
    {
      note: 'The export appears to pair the extract and oil CAS numbers the other way round; both map to this entry.',
    },
  ),
  entry('366', 'Rosa Damascena Flower Oil', 'M', N, true, [
    ['Rosa alba flower oil/extract', '93334-48-6'],
    ['Rosa canina flower oil', '84696-47-9'],
    ['Rosa centifolia oil/extract', '84604-12-6'],
    ['Rosa damascena flower extract', '90106-38-0'],
    ['Rosa damascena flower oil', '8007-01-0'],
    ['Rosa gallica flower oil', '84604-13-7'],
    ['Rosa moschata flower oil', null],
    ['Rosa rugosa flower oil', '92347-25-6'],
  ]),
  entry('367', 'Santalum Album Oil', 'M', N, true, [
    ['Santalum album extract', '84787-70-2'],
    ['Santalum album oil', '8006-87-9'],
  ]),
  entry('368', 'Eugenyl Acetate', 'M', N, true, [['Eugenyl acetate', '93-28-7']]),
  entry('369', 'Geranyl Acetate', 'M', N, true, [['Geranyl acetate', '105-87-3']]),
  entry('370', 'Isoeugenyl Acetate', 'M', N, true, [['Isoeugenyl acetate', '93-29-8']]),
  entry(
    '371',
    'Pinene',
    'M',
    N,
    true,
    [
      ['(1R)-alpha-Pinene', '7785-70-8'],
      ['(1S)-beta-Pinene', '18172-67-3'],
      ['alpha-Pinene', '80-56-8'],
      ['beta-Pinene', '127-91-3'],
    ],
    PEROXIDE,
  ),
];
