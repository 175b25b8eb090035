import type { AssessmentDetail, SafetyPacket } from '@batchproof/shared';

/* Test data for the assessments specs (imported by specs only). */

export const ASSESSMENT_ID = 'a5e55000-0000-4000-8000-000000000001';
export const FORMULA_ID = 'f0000000-0000-4000-8000-000000000001';
export const VERSION_ID = 'e0000000-0000-4000-8000-000000000002';
export const HASH = 'ab'.repeat(32);

/** A lotion's packet: two substances, no exposure chosen, no points of departure yet. */
export function aPacket(overrides: Partial<SafetyPacket> = {}): SafetyPacket {
  return {
    formula: { id: FORMULA_ID, name: 'Everyday Body Lotion', productType: 'lotion' },
    version: {
      id: VERSION_ID,
      number: 2,
      state: 'released',
      releasedAt: '2026-11-02T10:00:00.000Z',
    },
    workshop: { name: 'Hollowmere Bathworks', address: '1 Mill Lane' },
    composition: [
      {
        position: 1,
        materialName: 'Vegetable glycerin',
        inci: 'Glycerin',
        cas: '56-81-5',
        ec: '200-289-5',
        function: 'Humectant',
        percent: 5,
        fragrance: null,
      },
      {
        position: 2,
        materialName: 'Meadow fragrance oil',
        inci: 'Parfum',
        cas: null,
        ec: null,
        function: 'Fragrance',
        percent: 0.9,
        fragrance: {
          supplierName: 'Lindenfield Aromas',
          code: 'LA-221',
          certificate: { title: 'IFRA certificate 51st amendment', issuedOn: '2026-01-10' },
        },
      },
    ],
    totalGrams: 1000,
    notes: {
      physicalChemical: 'White emulsion, pH 5.5',
      stability: '',
      microbiological: 'Challenge test passed (criteria A)',
      impurities: '',
      packaging: 'PET bottle with pump',
      normalUse: 'Apply to the body once a day',
    },
    exposure: null,
    substances: [
      {
        key: 'glycerin',
        inci: 'Glycerin',
        cas: '56-81-5',
        percent: 5,
        from: ['Vegetable glycerin'],
      },
      {
        key: 'linalool',
        inci: 'Linalool',
        cas: '78-70-6',
        percent: 0.9,
        from: ['Meadow fragrance oil'],
      },
    ],
    margins: [
      {
        substanceKey: 'glycerin',
        inci: 'Glycerin',
        percent: 5,
        dermalAbsorptionPercent: 100,
        absorptionDefaulted: true,
        dermalAbsorptionSource: '',
        pointOfDepartureMgPerKgDay: null,
        pointOfDepartureSource: '',
        sedMgPerKgDay: null,
        marginOfSafety: null,
        flagged: false,
      },
      {
        substanceKey: 'linalool',
        inci: 'Linalool',
        percent: 0.9,
        dermalAbsorptionPercent: 100,
        absorptionDefaulted: true,
        dermalAbsorptionSource: '',
        pointOfDepartureMgPerKgDay: null,
        pointOfDepartureSource: '',
        sedMgPerKgDay: null,
        marginOfSafety: null,
        flagged: false,
      },
    ],
    attention: [
      'Exposure to the product is not chosen yet, so no SED or margin of safety can be worked out.',
    ],
    undesirableEffects: [
      {
        receivedOn: '2026-11-20',
        whatHappened: 'Itchy forearms after use',
        bodyArea: 'Arms',
        serious: false,
        batchCode: '261101-EBL-1',
        status: 'open',
      },
    ],
    markets: [
      {
        market: 'EU',
        declaration: 'Ingredients: Aqua, Glycerin, Parfum, Linalool.',
        warnings: ['Avoid contact with eyes.'],
        colourants: [],
        allergens: [
          {
            inci: 'Linalool',
            percent: 0.02,
            declared: true,
            thresholdPercent: 0.001,
            annexRef: 'III/84',
            requiredFrom: null,
          },
        ],
      },
    ],
    identity: {
      productName: 'Everyday Body Lotion',
      directions: 'Smooth onto clean skin.',
      shelfLifeMonths: 12,
      periodAfterOpeningMonths: 6,
      euResponsiblePerson: 'Hollowmere Bathworks, 1 Mill Lane',
      ukResponsiblePerson: null,
      usAdverseEventContact: null,
    },
    findings: [
      {
        code: 'SAFETY_ASSESSMENT_MISSING',
        severity: 'warn',
        market: 'EU',
        subject: 'Everyday Body Lotion',
        message: 'Version 2 has no signed safety assessment.',
        source: 'Regulation (EC) No 1223/2009, Article 10',
        status: 'C',
        lines: [],
      },
    ],
    documentsOnFile: [
      {
        materialName: 'Meadow fragrance oil',
        kind: 'ifra-certificate',
        title: 'IFRA certificate 51st amendment',
        issuedOn: '2026-01-10',
        expiresOn: null,
      },
    ],
    documentsMissing: [{ materialName: 'Vegetable glycerin', what: 'Safety data sheet' }],
    batches: [{ code: '261101-EBL-1', madeOn: '2026-11-01', unitsMade: 40, status: 'released' }],
    partB: { conclusion: '', labelWarnings: '', reasoning: '', credentials: '' },
    assessment: {
      id: ASSESSMENT_ID,
      status: 'draft',
      assessorName: 'Wren Ashby',
      signedAt: null,
      signedByName: null,
      contentHash: null,
    },
    generatedAt: '2026-12-03T08:00:00.000Z',
    ...overrides,
  };
}

/** The draft assessment as `GET /api/assessments/:id` answers it. */
export function anAssessment(overrides: Partial<AssessmentDetail> = {}): AssessmentDetail {
  const packet = overrides.packet ?? aPacket();
  return {
    id: ASSESSMENT_ID,
    status: 'draft',
    formulaId: FORMULA_ID,
    versionId: VERSION_ID,
    versionNumber: 2,
    exposure: null,
    substances: [],
    partB: { conclusion: '', labelWarnings: '', reasoning: '', credentials: '' },
    contentHash: HASH,
    canEdit: true,
    ...overrides,
    packet,
  };
}
