import type {
  MarketRecordInput,
  PartB,
  SafetyNotesInput,
  SubstanceInput,
} from '@batchproof/shared';
import type { DemoFormula } from './hollowmere-formulas';
import type { DemoMaterialKey } from './hollowmere-materials';

/**
 * The demo's safety-assessment story (issue 12), all invented: Dr. Orla Finchley, Hollowmere's
 * demo assessor, also assesses for a second fictional workshop, Tidewrack Soap Co., and has signed
 * the assessment of the Everyday Body Lotion's first version; version 2 (a little less fragrance)
 * is released and waits for its own. The points of departure, absorption values and texts below are
 * entered as the fictional assessor's own and are NOT figures for a real assessment.
 */

/** The second workshop, whose owner signs in as `owner@tidewrack.example` with the demo password. */
export const tidewrack = {
  name: 'Tidewrack Soap Co.',
  address: '2 Quayside Steps, Saltmarrow, ME 04099, USA',
  owner: { name: 'Perrin Marsh', email: 'owner@tidewrack.example' },
} as const;

/** The demo assessor, a member of both workshops (signs in to Tidewrack: worked there last). */
export const DEMO_ASSESSOR_EMAIL = 'assessor@hollowmere.example';

/** The Hollowmere formula whose first version carries the signed assessment. */
export const LOTION = 'Everyday Body Lotion';

/** Tidewrack's materials, taken from the demo's material list (same fictional suppliers). */
export const tidewrackMaterials: DemoMaterialKey[] = [
  'epsom',
  'seaSalt',
  'almond',
  'polysorbate',
  'lavender',
  'shea',
  'cocoa',
  'coconut',
];

const butterProfile: DemoFormula['profile'] = {
  use: 'leave-on',
  contact: { mucousMembranes: false, eyeArea: false, lips: false },
  inBath: false,
  adultsOnly: false,
  ifraCategory: '5A',
  markets: ['US', 'EU', 'UK'],
  unitMassGrams: 120,
  netQuantity: { amount: 120, unit: 'g' },
};

/** Tidewrack's two small products, both released (the engine finds nothing blocking). */
export const tidewrackFormulas: DemoFormula[] = [
  {
    name: 'Low Tide Body Butter',
    productType: 'body-butter',
    notes: 'Melt the butters gently, stir in the oil, whip when half set. Lavender last.',
    lines: [
      ['shea', 450],
      ['cocoa', 150],
      ['almond', 250],
      ['coconut', 140],
      ['lavender', 10],
    ],
    profile: butterProfile,
    release: true,
  },
  {
    name: 'Driftwood Salt Soak',
    productType: 'bath-salts',
    notes: 'Blend the oil and lavender into the salts last; jar at once.',
    lines: [
      ['epsom', 620],
      ['seaSalt', 320],
      ['almond', 40],
      ['polysorbate', 10],
      ['lavender', 10],
    ],
    profile: {
      ...butterProfile,
      use: 'rinse-off',
      inBath: true,
      ifraCategory: '9',
      unitMassGrams: 300,
      netQuantity: { amount: 300, unit: 'g' },
    },
    release: true,
  },
];

/** The Tidewrack product the assessor has started on (a draft), and the one still waiting. */
export const TIDEWRACK_STARTED = 'Low Tide Body Butter';
export const TIDEWRACK_WAITING = 'Driftwood Salt Soak';

const demoSource = 'Supplier toxicological summary on file (demo)';

/**
 * The assessor's entries per substance, by the packet's substance key (lower-cased INCI). Values
 * are the fictional assessor's demo entries, not published figures; a substance left out has no
 * point of departure entered (the reasoning says why).
 */
export const lotionSubstances: Record<string, Omit<SubstanceInput, 'substanceKey'>> = {
  phenoxyethanol: {
    pointOfDepartureMgPerKgDay: 350, // demo entry, not a published figure
    pointOfDepartureSource: `${demoSource}: 90-day oral study, NOAEL as summarised`,
    dermalAbsorptionPercent: 80, // demo entry, not a published figure
    dermalAbsorptionSource: `${demoSource}: in-vitro skin study as summarised`,
  },
  ethylhexylglycerin: {
    pointOfDepartureMgPerKgDay: 200, // demo entry
    pointOfDepartureSource: `${demoSource}: repeated-dose study summary`,
    dermalAbsorptionPercent: null,
    dermalAbsorptionSource: '',
  },
  glycerin: {
    pointOfDepartureMgPerKgDay: 1000, // demo entry: a limit dose
    pointOfDepartureSource: 'Assessor’s own literature file: limit-dose study, no effects (demo)',
    dermalAbsorptionPercent: null,
    dermalAbsorptionSource: '',
  },
  'polysorbate 60': {
    pointOfDepartureMgPerKgDay: 500, // demo entry
    pointOfDepartureSource: `${demoSource} (emulsifying wax)`,
    dermalAbsorptionPercent: 10, // demo entry
    dermalAbsorptionSource: 'Assessor’s judgement: large molecule, low uptake (demo)',
  },
  'benzyl salicylate': {
    pointOfDepartureMgPerKgDay: 50, // demo entry
    pointOfDepartureSource: 'Fragrance supplier’s safety data pack on file (demo)',
    dermalAbsorptionPercent: null,
    dermalAbsorptionSource: '',
  },
  citronellol: {
    pointOfDepartureMgPerKgDay: 50, // demo entry
    pointOfDepartureSource: 'Fragrance supplier’s safety data pack on file (demo)',
    dermalAbsorptionPercent: null,
    dermalAbsorptionSource: '',
  },
};

/** Part B of the lotion's version 1, as the fictional assessor wrote it. */
export const lotionPartB: PartB = {
  conclusion:
    'DEMO TEXT. Everyday Body Lotion, version 1, is safe for human health when used as directed ' +
    'and under reasonably foreseeable conditions of use, on the data in this packet.',
  labelWarnings:
    'DEMO TEXT. For external use only. Avoid contact with eyes. Stop use if irritation occurs.',
  reasoning:
    'DEMO TEXT. Exposure as for a body lotion (whole body, leave-on, once or twice a day). The ' +
    'preservative and the fragrance allergens are the substances of toxicological interest; their ' +
    'margins of safety are above 100 with the points of departure entered. Water, shea butter, ' +
    'almond oil, fatty alcohols and xanthan gum are common cosmetic and food ingredients with no ' +
    'systemic concern at these levels, so no point of departure was entered for them. Stability ' +
    'and the challenge test are on file (Part A items 2 and 3). Fragrance within its IFRA limit ' +
    'for category 5A on the supplier’s certificate.',
  credentials:
    'DEMO TEXT. Dr. Orla Finchley, PhD in toxicology (fictional); cosmetic safety assessor for ' +
    'small workshops. A fictional person: these are not real credentials.',
};

/** The maker's Part A notes (items 2–5); version 2 notes the lower fragrance amount. */
export const lotionNotes = (version: 1 | 2): SafetyNotesInput => ({
  physicalChemical:
    'DEMO TEXT. White, soft oil-in-water emulsion; pH 5.4–5.8; density about 0.98 g/mL.',
  stability:
    version === 1
      ? 'DEMO TEXT. 12 weeks at 40 °C and at room temperature, and 3 freeze–thaw cycles: no ' +
        'separation, colour or odour change; pH within 0.3.'
      : 'DEMO TEXT. As version 1 (12 weeks at 40 °C, 3 freeze–thaw cycles). Version 2 has less ' +
        'fragrance only; a 4-week check at 40 °C showed no change.',
  microbiological:
    'DEMO TEXT. Preservative efficacy (challenge) test passed criteria A on version 1 at an ' +
    'outside lab (report on file). Made with distilled water; equipment sanitised before each batch.',
  impurities:
    'DEMO TEXT. Raw materials of cosmetic grade with certificates of analysis on file; no traces ' +
    'of prohibited substances declared by the suppliers.',
  packaging:
    'DEMO TEXT. 240 mL HDPE bottle with a polypropylene pump; the supplier states suitability ' +
    'for cosmetic emulsions.',
  normalUse:
    'DEMO TEXT. Adults and older children; applied to the body once or twice a day and left on. ' +
    'Not for use on broken skin or near the eyes.',
});

/** Version 2 of the lotion: the fragrance lowered from 5 g to 4 g per batch, water up by 1 g. */
export const lotionV2 = {
  changes: { water: 1, wrenfieldRain: -1 } satisfies Partial<Record<DemoMaterialKey, number>>,
  notes:
    'Version 2: a little less fragrance (4 g instead of 5 g per batch) after customer comments.',
};

/** The EU labels printed from version 2 (a full-sheet run; the PDF is made in the background). */
export const lotionLabelRun = {
  markets: ['EU' as const],
  stockId: 'letter-4x3.333in-6',
  copies: 6,
  lotCode: 'EBL-2612',
};

/**
 * A notification reference recorded for another product, so the readiness screen shows a done
 * item. The reference is invented (a real one comes from the EU's notification portal).
 */
export const demoNotification: {
  formula: string;
  daysAgo: number;
  record: Omit<MarketRecordInput, 'recordedOn'>;
} = {
  formula: 'Orchard Fog Fizzer',
  daysAgo: 40,
  record: {
    reference: 'DEMO-CPNP-4127730',
    notes: 'Demo reference: not a real notification.',
  },
};

/** The assessor's draft in Tidewrack: exposure chosen, one point of departure, Part B begun. */
export const butterDraft = {
  substances: {
    'prunus amygdalus dulcis oil': {
      pointOfDepartureMgPerKgDay: null,
      pointOfDepartureSource: 'Food-grade oil: no systemic concern expected (demo note)',
      dermalAbsorptionPercent: null,
      dermalAbsorptionSource: '',
    },
    linalool: {
      pointOfDepartureMgPerKgDay: 100, // demo entry, not a published figure
      pointOfDepartureSource: 'Essential oil supplier’s safety data pack on file (demo)',
      dermalAbsorptionPercent: null,
      dermalAbsorptionSource: '',
    },
  } satisfies Record<string, Omit<SubstanceInput, 'substanceKey'>>,
  partB: {
    reasoning: 'DEMO TEXT. Draft: waiting for the stability results before concluding.',
  } satisfies Partial<PartB>,
};
