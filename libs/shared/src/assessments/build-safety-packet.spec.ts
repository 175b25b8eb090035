import { describe, expect, it } from 'vitest';
import {
  buildSafetyPacket,
  packetHashContent,
  type SafetyPacketInput,
  type SafetyPacketLineInput,
} from './build-safety-packet';
import { DEFAULT_BODY_WEIGHT_KG, EXPOSURE_DEFAULTS } from './exposure-defaults';
import type { ProductIdentity } from '../labels/product-identity';
import type { SafetyPacket } from './safety-packet';

const material = (
  over: Partial<SafetyPacketLineInput['material']>,
): SafetyPacketLineInput['material'] => ({
  tradeName: 'Material',
  inci: 'Aqua',
  usName: null,
  cas: null,
  ec: null,
  category: 'base',
  functions: [],
  colourIndex: null,
  nano: false,
  components: [],
  ifraCertificate: null,
  allergenDeclaration: null,
  supplierName: null,
  ...over,
});

/** 100 g: 60 g water, 30 g a blend with 10 % Linalool, 10 g a fragrance with 5 % Linalool. */
function input(): SafetyPacketInput {
  return {
    formula: { id: 'f1', name: 'Quiet Lotion', productType: 'lotion' },
    version: { id: 'v1', number: 2, state: 'released', releasedAt: '2026-11-01T10:00:00.000Z' },
    workshop: { name: 'Fern Hollow Soaps', address: '1 Mill Lane' },
    lines: [
      {
        position: 1,
        grams: 60,
        material: material({
          tradeName: 'Water',
          inci: 'Aqua',
          cas: '7732-18-5',
          functions: ['solvent'],
        }),
        certificate: null,
      },
      {
        position: 2,
        grams: 30,
        material: material({
          tradeName: 'Calm base',
          inci: 'Glycerin, Linalool',
          category: 'oil',
          components: [
            { inci: 'Glycerin', percent: 90 },
            { inci: 'Linalool', cas: '78-70-6', percent: 10 },
          ],
        }),
        certificate: null,
      },
      {
        position: 3,
        grams: 10,
        material: material({
          tradeName: 'Meadow scent',
          inci: 'Parfum',
          category: 'fragrance',
          supplierName: 'Scent Supply Co',
          ifraCertificate: {
            maxPercentByIfraCategory: { '5A': 2 },
            issuedOn: '2026-01-01',
            amendment: 51,
          },
          allergenDeclaration: {
            documentDate: '2026-01-01',
            allergens: [{ inci: 'LINALOOL', cas: '78-70-6', percent: 5 }],
          },
        }),
        certificate: { title: 'IFRA certificate Meadow', issuedOn: '2026-01-01' },
      },
    ],
    evaluation: null,
    identity: null,
    notes: {
      physicalChemical: 'White cream, pH 5.5',
      stability: '',
      microbiological: '',
      impurities: '',
      packaging: 'PET jar',
      normalUse: 'Apply to the body daily',
    },
    complaints: [],
    documentsOnFile: [],
    documentsMissing: [{ materialName: 'Water', what: 'Safety data sheet' }],
    batches: [],
    assessment: {
      id: 'a1',
      status: 'draft',
      assessorName: 'Ada Assessor',
      exposure: {
        presetKey: null,
        dailyAmountGrams: 7.82,
        retentionFactor: 1,
        bodyWeightKg: 60,
        source: 'own data',
      },
      substances: [
        {
          substanceKey: 'linalool',
          pointOfDepartureMgPerKgDay: 117,
          pointOfDepartureSource: 'study',
          dermalAbsorptionPercent: null,
          dermalAbsorptionSource: '',
        },
      ],
      partB: { conclusion: 'Safe', labelWarnings: '', reasoning: '', credentials: 'BSc' },
      signedAt: null,
      signedByName: null,
      contentHash: null,
    },
    generatedAt: '2026-12-03T08:00:00.000Z',
  };
}

const anIdentity = (): ProductIdentity => ({
  productName: 'Quiet Lotion',
  productCode: 'QL-1',
  gtin: null,
  shelfLifeMonths: null,
  periodAfterOpeningMonths: 12,
  directions: 'Smooth over the skin after the bath.',
  usAdverseEventContact: { address: null, phone: '+1 555 0100', website: null },
  euResponsiblePerson: { name: 'Fern Hollow Soaps', address: '1 Mill Lane' },
  ukResponsiblePerson: { name: null, address: null },
  canadianFrench: { productName: null, warnings: null, directions: null },
});

const hashOf = (i: SafetyPacketInput) => packetHashContent(buildSafetyPacket(i));

describe('buildSafetyPacket', () => {
  it('merges the same substance from a blend and a fragrance declaration and sums its percent', () => {
    const packet = buildSafetyPacket(input());
    const linalool = packet.substances.find((s) => s.key === 'linalool');
    // 30 % × 10 % = 3 % from the blend; 10 % × 5 % = 0.5 % from the fragrance
    expect(linalool?.percent).toBeCloseTo(3.5, 9);
    expect(linalool?.from).toEqual(['Calm base', 'Meadow scent']);
    expect(linalool?.cas).toBe('78-70-6');
    expect(packet.substances.find((s) => s.key === 'glycerin')?.percent).toBeCloseTo(27, 9);
    expect(packet.substances.find((s) => s.key === 'aqua')?.percent).toBeCloseTo(60, 9);
    expect(packet.substances.find((s) => s.key === 'parfum')?.percent).toBeCloseTo(10, 9);
    expect(packet.substances.map((s) => s.key)).toEqual(['aqua', 'glycerin', 'parfum', 'linalool']);
  });

  it('lays out the composition with percent, function words and the fragrance supplier', () => {
    const packet = buildSafetyPacket(input());
    expect(packet.composition.map((c) => [c.materialName, c.percent, c.function])).toEqual([
      ['Water', 60, 'solvent'],
      ['Calm base', 30, 'Oil'],
      ['Meadow scent', 10, 'Fragrance'],
    ]);
    expect(packet.composition[2]!.fragrance).toEqual({
      supplierName: 'Scent Supply Co',
      code: null,
      certificate: { title: 'IFRA certificate Meadow', issuedOn: '2026-01-01' },
    });
    expect(packet.composition[0]!.fragrance).toBeNull();
    expect(packet.totalGrams).toBe(100);
  });

  it('computes exposure, SED and MoS with marginOfSafety and marks the default absorption', () => {
    const packet = buildSafetyPacket(input());
    // A = 7.82 g × 1 × 1000 / 60 kg = 130.33 mg/kg bw/day (SCCS Notes of Guidance, from memory)
    expect(packet.exposure?.exposureMgPerKgDay).toBeCloseTo(130.333, 3);
    const m = packet.margins.find((x) => x.substanceKey === 'linalool')!;
    // SED = 130.33 × 3.5 % × 100 % = 4.5617; MoS = 117 / 4.5617 = 25.6 [CALC]
    expect(m.sedMgPerKgDay).toBeCloseTo(4.5617, 4);
    expect(m.marginOfSafety).toBeCloseTo(25.65, 2);
    expect(m.flagged).toBe(true);
    expect(m.absorptionDefaulted).toBe(true);
    expect(packet.attention).toContain(
      'MoS 26 for Linalool is below 100: the safety assessor must review it before the product is released.',
    );
    expect(packet.attention).toContain('Point of departure not entered for Aqua.');
    const water = packet.margins.find((x) => x.substanceKey === 'aqua')!;
    expect(water.marginOfSafety).toBeNull();
    expect(water.sedMgPerKgDay).toBeCloseTo(78.2, 6);
  });

  it('takes a shipped preset as published and marks it a default', () => {
    const preset = EXPOSURE_DEFAULTS[0]!;
    const i = input();
    i.assessment.exposure = {
      presetKey: preset.key,
      dailyAmountGrams: preset.dailyAmountGrams,
      retentionFactor: preset.retentionFactor,
      bodyWeightKg: DEFAULT_BODY_WEIGHT_KG,
      source: '',
    };
    const packet = buildSafetyPacket(i);
    expect(packet.exposure).toMatchObject({
      exposureMgPerKgDay: preset.exposureMgPerKgDay,
      defaulted: true,
      presetLabel: preset.label,
    });
    const m = packet.margins.find((x) => x.substanceKey === 'linalool')!;
    expect(m.sedMgPerKgDay).toBeCloseTo(preset.exposureMgPerKgDay * 0.035, 9);
  });

  it('carries the label identity in plain lines', () => {
    const i = input();
    i.identity = anIdentity();
    expect(buildSafetyPacket(i).identity).toEqual({
      productName: 'Quiet Lotion',
      directions: 'Smooth over the skin after the bath.',
      shelfLifeMonths: null,
      periodAfterOpeningMonths: 12,
      euResponsiblePerson: 'Fern Hollow Soaps, 1 Mill Lane',
      ukResponsiblePerson: null,
      usAdverseEventContact: '+1 555 0100',
    });
    expect(buildSafetyPacket(input()).identity).toBeNull();
  });

  it('has no SED or MoS before the exposure is entered, and says so', () => {
    const i = input();
    i.assessment.exposure = null;
    const packet = buildSafetyPacket(i);
    expect(packet.exposure).toBeNull();
    expect(packet.margins.every((m) => m.sedMgPerKgDay === null && m.marginOfSafety === null)).toBe(
      true,
    );
    expect(packet.attention[0]).toContain('Exposure to the product is not chosen yet');
  });
});

describe('packetHashContent', () => {
  it('ignores generatedAt and the signature fields', () => {
    const base = hashOf(input());
    const later = input();
    later.generatedAt = '2027-01-01T00:00:00.000Z';
    later.assessment.status = 'signed';
    later.assessment.signedAt = '2027-01-01T00:00:00.000Z';
    later.assessment.signedByName = 'Ada Assessor';
    later.assessment.contentHash = 'f'.repeat(64);
    expect(hashOf(later)).toBe(base);
  });

  it('does not depend on key order', () => {
    const packet = buildSafetyPacket(input());
    const reversed = Object.fromEntries(
      Object.entries(packet).reverse(),
    ) as unknown as SafetyPacket;
    reversed.notes = Object.fromEntries(
      Object.entries(packet.notes).reverse(),
    ) as SafetyPacket['notes'];
    expect(packetHashContent(reversed)).toBe(packetHashContent(packet));
    expect(JSON.parse(packetHashContent(packet))).not.toHaveProperty('generatedAt');
  });

  const changes: [string, (i: SafetyPacketInput) => void][] = [
    ['a safety note', (i) => (i.notes.stability = '3 months at 40 °C: no change')],
    ['the exposure', (i) => (i.assessment.exposure!.dailyAmountGrams = 8)],
    ['a point of departure', (i) => (i.assessment.substances[0]!.pointOfDepartureMgPerKgDay = 118)],
    ['a dermal absorption', (i) => (i.assessment.substances[0]!.dermalAbsorptionPercent = 50)],
    ['Part B', (i) => (i.assessment.partB.reasoning = 'Margins discussed')],
    ["a line's weight (and so its percent)", (i) => (i.lines[0]!.grams = 61)],
    [
      'a complaint',
      (i) =>
        i.complaints.push({
          receivedOn: '2026-11-20',
          whatHappened: 'Redness on the arm',
          bodyArea: 'arm',
          serious: false,
          batchCode: null,
          status: 'open',
        }),
    ],
    ['a missing document', (i) => (i.documentsMissing = [])],
    ['the label identity', (i) => (i.identity = anIdentity())],
    [
      'a batch',
      (i) =>
        i.batches.push({ code: 'B1', madeOn: '2026-11-02', unitsMade: 20, status: 'released' }),
    ],
  ];
  it.each(changes)('changes when %s changes', (_what, change) => {
    const changed = input();
    change(changed);
    expect(hashOf(changed)).not.toBe(hashOf(input()));
  });
});
