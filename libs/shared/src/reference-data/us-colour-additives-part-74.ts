import {
  ALL,
  EXTERNAL_ONLY,
  GENERAL_NOT_EYE,
  certified,
  type UsColourAdditive,
} from './us-colour-additive-row';

/** Part 74 colour additives: "All batches … shall be certified" (e.g. 21 CFR 74.2330(d)). Rows whose uses are `M` warn but never block. */
export const usPart74ColourAdditives: readonly UsColourAdditive[] = [
  certified(
    'us-fdc-blue-1',
    'FD&C Blue No. 1',
    ['42090'],
    '74.2101',
    { ...GENERAL_NOT_EYE, eyeArea: true, eyeAreaIncludesLake: true },
    'C2',
    'C',
    {
      aliases: ['blue 1', 'blue no. 1', 'brilliant blue fcf'],
      source: '21 CFR 74.2101; 59 FR 7638 (eye area, incl. Aluminum Lake)',
      note: '"Generally" confirmed only secondarily (C2); eye-area use with its Aluminum Lake confirmed (C).',
    },
  ),
  certified('us-dc-blue-4', 'D&C Blue No. 4', ['42090'], '74.2104', EXTERNAL_ONLY, 'M', 'C', {
    // from memory
    aliases: ['blue 4'],
    note: 'Shares CI 42090 with FD&C Blue No. 1 (FDA/ICMAD information sheet). Section and uses from memory.',
  }),
  certified(
    'us-fdc-red-40',
    'FD&C Red No. 40',
    ['16035'],
    '74.2340',
    { ...GENERAL_NOT_EYE, eyeArea: true, eyeAreaIncludesLake: true },
    'C2',
    'C',
    {
      aliases: ['red 40', 'allura red ac'],
      source: `21 CFR 74.2340; FDA, Color Additives Permitted for Use in Cosmetics (table copy)`,
      note: 'The 74.2340 paragraph itself was not read. FDA summary table (copy): "FD&C Red No. 40 | Yes, also Al lake | Yes" (eye area; generally). Drug listing 74.1340(b)(1) confirms eye-area use with the Aluminum Lake (C).',
    },
  ),
  certified(
    'us-fdc-yellow-5',
    'FD&C Yellow No. 5',
    ['19140'],
    '74.2705',
    { ...GENERAL_NOT_EYE, eyeArea: true, eyeAreaIncludesLake: true },
    'C',
    'C',
    {
      aliases: ['yellow 5', 'tartrazine'],
      source: '21 CFR 74.2705; FDA Regulatory Status of Color Additives (FDCYellow5)',
    },
  ),
  certified(
    'us-fdc-yellow-6',
    'FD&C Yellow No. 6',
    ['15985'],
    '74.2706',
    GENERAL_NOT_EYE,
    'C2',
    'C',
    {
      aliases: ['yellow 6', 'sunset yellow fcf'],
    },
  ),
  certified('us-fdc-green-3', 'FD&C Green No. 3', ['42053'], '74.2203', GENERAL_NOT_EYE, 'M', 'C', {
    aliases: ['green 3', 'fast green fcf'],
  }), // from memory
  certified('us-dc-red-6', 'D&C Red No. 6', ['15850'], '74.2306', GENERAL_NOT_EYE, 'C2', 'C', {
    aliases: ['red 6'],
  }),
  certified('us-dc-red-7', 'D&C Red No. 7', ['15850:1'], '74.2307', GENERAL_NOT_EYE, 'C2', 'C', {
    aliases: ['red 7'],
  }),
  certified('us-dc-red-21', 'D&C Red No. 21', ['45380:2'], '74.2321', GENERAL_NOT_EYE, 'C', 'C', {
    aliases: ['red 21'],
  }),
  certified('us-dc-red-22', 'D&C Red No. 22', ['45380'], '74.2322', GENERAL_NOT_EYE, 'M', 'C', {
    aliases: ['red 22', 'eosine'],
  }), // from memory
  certified('us-dc-red-27', 'D&C Red No. 27', ['45410:1'], '74.2327', GENERAL_NOT_EYE, 'M', 'C', {
    aliases: ['red 27'],
  }), // from memory
  certified('us-dc-red-28', 'D&C Red No. 28', ['45410'], '74.2328', GENERAL_NOT_EYE, 'M', 'C2', {
    aliases: ['red 28', 'phloxine b'],
  }), // from memory
  certified('us-dc-red-30', 'D&C Red No. 30', ['73360'], '74.2330', GENERAL_NOT_EYE, 'C', 'C2', {
    aliases: ['red 30'],
    note: '74.2330: "may be safely used for coloring cosmetics generally". CI 73360 = D&C Red No. 30 from a secondary source that also gives the Annex IV entry 100 chemical name.',
  }),
  certified('us-dc-red-31', 'D&C Red No. 31', ['15800:1'], '74.2331', EXTERNAL_ONLY, 'C', 'M', {
    aliases: ['red 31'],
  }),
  certified(
    'us-dc-red-33',
    'D&C Red No. 33',
    ['17200'],
    '74.2333',
    { ...EXTERNAL_ONLY, lipProductsMaxPercent: 3 },
    'C',
    'CALC',
    {
      aliases: ['red 33', 'acid fuchsine'],
      note: 'Lip products up to 3 % total colour by weight; also mouthwashes and dentifrices. CI 17200: 74.1333(a) "disodium salt of 5-amino-4-hydroxy-3-(phenylazo)-2,7-naphthalenedisulfonic acid" is the substance of Annex IV entry 37 (CI 17200), so the pairing is derived (CALC).',
    },
  ),
  certified(
    'us-dc-red-36',
    'D&C Red No. 36',
    ['12085'],
    '74.2336',
    { ...EXTERNAL_ONLY, lipProductsMaxPercent: 3 },
    'C',
    'C',
    {
      aliases: ['red 36'],
      source: '21 CFR 74.2336; FDA Regulatory Status of Color Additives (DCRed36)',
    },
  ),
  certified('us-fdc-red-4', 'FD&C Red No. 4', ['14700'], '74.2304', EXTERNAL_ONLY, 'C', 'C', {
    aliases: ['red 4', 'ponceau sx'],
    source: '21 CFR 82.304; 74.2304',
  }),
  certified('us-dc-orange-4', 'D&C Orange No. 4', ['15510'], '74.2254', EXTERNAL_ONLY, 'C', 'C', {
    aliases: ['orange 4'],
  }),
  certified(
    'us-dc-orange-5',
    'D&C Orange No. 5',
    ['45370:1'],
    '74.2255',
    { ...EXTERNAL_ONLY, lipProductsMaxPercent: 5 },
    'C',
    'C',
    {
      aliases: ['orange 5'],
      note: 'Lipsticks and lip cosmetics up to 5.0 % by weight; mouthwashes and dentifrices.',
    },
  ),
  certified(
    'us-dc-orange-10',
    'D&C Orange No. 10',
    ['45425:1'],
    '74.2260',
    EXTERNAL_ONLY,
    'M',
    'C',
    { aliases: ['orange 10'] },
  ), // from memory
  certified('us-dc-orange-11', 'D&C Orange No. 11', ['45425'], '74.2261', EXTERNAL_ONLY, 'C', 'C', {
    aliases: ['orange 11'],
  }),
  certified('us-dc-violet-2', 'D&C Violet No. 2', ['60725'], '74.2602', EXTERNAL_ONLY, 'C', 'C', {
    aliases: ['violet 2'],
    source: '21 CFR 74.2602; FDA Regulatory Status of Color Additives (DCViolet2)',
  }),
  certified(
    'us-ext-dc-violet-2',
    'Ext. D&C Violet No. 2',
    ['60730'],
    '74.2602a',
    EXTERNAL_ONLY,
    'C',
    'C',
    { aliases: ['ext. violet 2'] },
  ),
  certified('us-dc-green-5', 'D&C Green No. 5', ['61570'], '74.2205', ALL, 'C2', 'C', {
    aliases: ['green 5'],
  }),
  certified('us-dc-green-6', 'D&C Green No. 6', ['61565'], '74.2206', EXTERNAL_ONLY, 'C2', 'C', {
    aliases: ['green 6'],
  }),
  certified('us-dc-green-8', 'D&C Green No. 8', ['59040'], '74.2208', EXTERNAL_ONLY, 'M', 'C', {
    // from memory
    aliases: ['green 8', 'pyranine'],
    note: 'Believed externally applied with a percent cap; the cap was not seen, so Batchproof does not check it.',
  }),
  certified(
    'us-dc-yellow-10',
    'D&C Yellow No. 10',
    ['47005'],
    '74.2710',
    GENERAL_NOT_EYE,
    'M',
    'M',
    { aliases: ['yellow 10'] },
  ), // from memory
  certified('us-dc-yellow-7', 'D&C Yellow No. 7', ['45350'], '74.2707', EXTERNAL_ONLY, 'C', 'M', {
    aliases: ['yellow 7'],
    source: '21 CFR 74.2707; 82.1707',
  }),
  certified(
    'us-ext-dc-yellow-7',
    'Ext. D&C Yellow No. 7',
    ['10316'],
    '74.2707a',
    EXTERNAL_ONLY,
    'C',
    'M',
    { aliases: ['ext. yellow 7'], source: '21 CFR 74.2707a; 82.2707a' },
  ),
  certified(
    'us-dc-black-2',
    'D&C Black No. 2',
    ['77266'],
    '74.2052',
    {
      generally: false,
      eyeArea: true,
      externallyApplied: false,
      restrictedTo: [
        'eyeliner',
        'brush-on-brow',
        'eye shadow',
        'mascara',
        'lipstick',
        'blushers and rouge',
        'makeup and foundation',
        'nail enamel',
      ],
    },
    'C',
    'C',
    {
      aliases: ['carbon black', 'black 2'],
      source: '21 CFR 74.2052(c)',
      note: '74.2052(c): "may be safely used for coloring the following cosmetics in amounts consistent with current good manufacturing practice: Eyeliner, brush-on-brow, eye shadow, mascara, lipstick, blushers and rouge, makeup and foundation, and nail enamel."',
    },
  ),
];
