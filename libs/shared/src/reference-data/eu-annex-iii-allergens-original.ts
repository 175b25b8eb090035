import { entry, O, PEROXIDE, type EuAnnexIiiAllergen } from './eu-annex-iii-allergen-row';

/** The original labelled allergens still labelled (26 less the two moved to Annex II). Label names C2. */
export const euAnnexIiiOriginalAllergens: readonly EuAnnexIiiAllergen[] = [
  entry('45', 'Benzyl Alcohol', 'C2', O, true, [['Benzyl alcohol', '100-51-6']]),
  entry('67', 'Amyl Cinnamal', 'C2', O, false, [['2-Benzylideneheptanal', '122-40-7']]),
  entry('69', 'Cinnamyl Alcohol', 'C2', O, false, [['Cinnamyl alcohol', '104-54-1']]),
  entry('70', 'Citral', 'C2', O, true, [
    ['(E)-3,7-Dimethylocta-2,6-dienal', '141-27-5'],
    ['(Z)-3,7-Dimethylocta-2,6-dienal', '106-26-3'],
    ['3,7-Dimethyl-2,6-octadienal', '5392-40-5'],
  ]),
  entry('71', 'Eugenol', 'C2', O, false, [['Phenol, 2-methoxy-4-(2-propenyl)', '97-53-0']]),
  entry('72', 'Hydroxycitronellal', 'C2', O, false, [['7-Hydroxycitronellal', '107-75-5']], {
    maxPercent: 1,
  }),
  entry(
    '73',
    'Isoeugenol',
    'C2',
    O,
    false,
    [
      ['trans-Isoeugenol', '5932-68-3'],
      ['cis-Isoeugenol', '5912-86-7'],
      ['Phenol, 2-methoxy-4-(1-propenyl)', '97-54-1'],
    ],
    { maxPercent: 0.02 },
  ),
  entry('74', 'Amylcinnamyl Alcohol', 'C2', O, false, [
    ['2-Pentyl-3-phenylprop-2-en-1-ol', '101-85-9'],
  ]),
  entry('75', 'Benzyl Salicylate', 'C2', O, false, [['Benzyl salicylate', '118-58-1']]),
  entry('76', 'Cinnamal', 'C2', O, false, [['2-Propenal, 3-phenyl-', '104-55-2']]),
  entry('77', 'Coumarin', 'C2', O, false, [['2H-1-Benzopyran-2-one', '91-64-5']]),
  entry('78', 'Geraniol', 'C2', O, false, [
    ['2,6-Octadien-1-ol, 3,7-dimethyl-, (2E)-', '106-24-1'],
  ]),
  entry('80', 'Anise Alcohol', 'C2', O, false, [['4-Methoxybenzyl alcohol', '105-13-5']]),
  entry('81', 'Benzyl Cinnamate', 'C2', O, false, [
    ['2-Propenoic acid, 3-phenyl-, phenylmethyl ester', '103-41-3'],
  ]),
  entry('82', 'Farnesol', 'C2', O, false, [
    ['2,6,10-Dodecatrien-1-ol, 3,7,11-trimethyl-', '4602-84-0'],
  ]),
  entry('84', 'Linalool', 'C2', O, false, [['1,6-Octadien-3-ol, 3,7-dimethyl-', '78-70-6']]),
  entry('85', 'Benzyl Benzoate', 'C2', O, false, [['Benzyl benzoate', '120-51-4']]),
  entry('86', 'Citronellol', 'C2', O, false, [
    ['(3R)-3,7-Dimethyloct-6-en-1-ol', '1117-61-9'],
    ['(3S)-3,7-Dimethyloct-6-en-1-ol', '7540-51-4'],
    ['(±)-3,7-Dimethyloct-6-en-1-ol', '106-22-9'],
  ]),
  entry('87', 'Hexyl Cinnamal', 'C2', O, false, [['2-Benzylideneoctanal', '101-86-0']]),
  entry(
    '88',
    'Limonene',
    'C2',
    O,
    true,
    [
      ['d-Limonene', '5989-27-5'],
      ['l-Limonene', '5989-54-8'],
      ['Dipentene (racemic limonene)', '138-86-3'],
    ],
    PEROXIDE,
  ),
  entry('89', 'Methyl 2-Octynoate', 'C2', O, false, [['Methyl oct-2-ynoate', '111-12-6']], {
    maxPercent: 0.01,
  }),
  entry('90', 'Alpha-Isomethyl Ionone', 'C2', O, false, [
    ['3-Methyl-4-(2,6,6-trimethyl-2-cyclohexen-1-yl)-3-buten-2-one', '127-51-5'],
  ]),
  entry('91', 'Evernia Prunastri Extract', 'C2', O, false, [['Oak moss extract', '90028-68-5']]),
  entry('92', 'Evernia Furfuracea Extract', 'C2', O, false, [['Treemoss extract', '90028-67-4']]),
];
