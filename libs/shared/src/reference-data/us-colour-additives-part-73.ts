import {
  ALL,
  EXTERNAL_AND_EYE,
  EXTERNAL_ONLY,
  FDA_TABLE_2019,
  exempt,
  type UsColourAdditive,
} from './us-colour-additive-row';

/** Part 73 colour additives, exempt from certification (e.g. 21 CFR 73.2575(d)). Rows whose uses are `M` warn but never block. */
export const usPart73ColourAdditives: readonly UsColourAdditive[] = [
  exempt('us-mica', 'Mica', ['77019'], '73.2496', ALL, 'C', 'M', {
    note: 'CI 77019 is not given in the CFR listing and has no EU Annex IV entry; pairing from memory.',
  }),
  exempt('us-titanium-dioxide', 'Titanium Dioxide', ['77891'], '73.2575', ALL, 'C', 'C'),
  exempt('us-iron-oxides', 'Iron Oxides', ['77491', '77492', '77499'], '73.2250', ALL, 'C', 'C', {
    aliases: ['iron oxide', 'iron oxide red', 'iron oxide yellow', 'iron oxide black'],
  }),
  exempt('us-ultramarines', 'Ultramarines', ['77007'], '73.2725', EXTERNAL_AND_EYE, 'C', 'C2', {
    note: 'CI 77007 is the Annex IV entry 120 "lazurite" (the ultramarine pigment); pairing inferred, hence C2.',
    aliases: [
      'ultramarine blue',
      'ultramarine violet',
      'ultramarine pink',
      'ultramarine green',
      'ultramarine',
    ],
  }),
  exempt(
    'us-chromium-oxide-greens',
    'Chromium Oxide Greens',
    ['77288'],
    '73.2327',
    EXTERNAL_AND_EYE,
    'C',
    'C',
    {
      source: `21 CFR 73.2327; ${FDA_TABLE_2019}`,
      note: 'CI 77288 is Annex IV entry 129, "Chromium (III) oxide".',
    },
  ),
  exempt(
    'us-chromium-hydroxide-green',
    'Chromium Hydroxide Green',
    ['77289'],
    '73.2326',
    EXTERNAL_AND_EYE,
    'C',
    'C',
    {
      source: `21 CFR 73.2326; ${FDA_TABLE_2019}`,
      note: 'CI 77289 is Annex IV entry 130, "Chromium (III) hydroxide".',
    },
  ),
  exempt(
    'us-ferric-ferrocyanide',
    'Ferric Ferrocyanide',
    ['77510'],
    '73.2299',
    EXTERNAL_AND_EYE,
    'C',
    'C2',
    {
      aliases: ['prussian blue'],
      note: 'Annex IV entry 138 names CI 77510 "Ferric Ammonium Ferrocyanide"; ferric ferrocyanide sold as CI 77510 is inferred, hence C2.',
    },
  ),
  exempt(
    'us-ferric-ammonium-ferrocyanide',
    'Ferric Ammonium Ferrocyanide',
    ['77510'],
    '73.2298',
    EXTERNAL_AND_EYE,
    'C',
    'C',
    {
      source: `21 CFR 73.2298; ${FDA_TABLE_2019}`,
      note: 'CI 77510 is Annex IV entry 138, "Ferric Ammonium Ferrocyanide".',
    },
  ),
  exempt('us-manganese-violet', 'Manganese Violet', ['77742'], '73.2775', ALL, 'C2', 'C', {
    source: '21 CFR 73.2775',
    note: 'Uses (cosmetics generally, including the area of the eye) confirmed only secondarily: the CFR paragraph was not read here. CI 77742 is Annex IV entry 140, ammonium manganese(3+) diphosphate.',
  }),
  exempt('us-bismuth-oxychloride', 'Bismuth Oxychloride', ['77163'], '73.2162', ALL, 'C', 'C', {
    source: `21 CFR 73.2162; ${FDA_TABLE_2019}`,
    note: 'CI 77163 is Annex IV entry 123, "Bismuth chloride oxide".',
  }),
  exempt('us-zinc-oxide', 'Zinc Oxide', ['77947'], '73.2991', ALL, 'C', 'C', {
    note: '73.2991(b): "may be safely used in cosmetics, including cosmetics intended for use in the area of the eye". CI 77947 is Annex IV entry 144, zinc oxide.',
  }),
  exempt('us-carmine', 'Carmine', ['75470'], '73.2087', ALL, 'C', 'C', {
    aliases: ['cochineal'],
    source: `21 CFR 73.2087; ${FDA_TABLE_2019}`,
    note: 'CI 75470 is Annex IV entry 115, "Carmines".',
  }),
  exempt('us-annatto', 'Annatto', ['75120'], '73.2030', ALL, 'C', 'C', {
    source: `21 CFR 73.2030; ${FDA_TABLE_2019}`,
  }),
  exempt('us-beta-carotene', 'Beta-Carotene', ['40800'], '73.2095', ALL, 'C', 'C'),
  exempt('us-caramel', 'Caramel', [], '73.2085', ALL, 'C', 'C', {
    source: `21 CFR 73.2085; ${FDA_TABLE_2019}`,
  }),
  exempt(
    'us-aluminum-powder',
    'Aluminum Powder',
    ['77000'],
    '73.2645',
    EXTERNAL_AND_EYE,
    'C',
    'C',
    {
      aliases: ['aluminium powder', 'aluminum', 'aluminium'],
      source: `21 CFR 73.2645; ${FDA_TABLE_2019}`,
    },
  ),
  exempt('us-bronze-powder', 'Bronze Powder', ['77400'], '73.2646', ALL, 'C', 'M', {
    source: `21 CFR 73.2646; ${FDA_TABLE_2019}`,
  }),
  exempt('us-copper-powder', 'Copper Powder', ['77400'], '73.2647', ALL, 'C', 'C', {
    source: `21 CFR 73.2647; ${FDA_TABLE_2019}`,
    note: 'CI 77400 is Annex IV entry 132, "Copper".',
  }),
  exempt('us-guaiazulene', 'Guaiazulene', [], '73.2180', EXTERNAL_ONLY, 'C', 'C'),
];
