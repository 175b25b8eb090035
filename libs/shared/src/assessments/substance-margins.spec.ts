import { describe, expect, it } from 'vitest';
import type { SubstanceInput } from './assessment-api';
import type { PacketExposure, PacketSubstance } from './safety-packet';
import {
  formatMargin,
  marginAttention,
  substanceMargin,
  substanceMargins,
} from './substance-margins';

const substance = (inci: string, percent: number): PacketSubstance => ({
  key: inci.toLowerCase(),
  inci,
  cas: null,
  percent,
  from: ['Test material'],
});

const values = (key: string, over: Partial<SubstanceInput> = {}): SubstanceInput => ({
  substanceKey: key,
  pointOfDepartureMgPerKgDay: null,
  pointOfDepartureSource: '',
  dermalAbsorptionPercent: null,
  dermalAbsorptionSource: '',
  ...over,
});

const bodyLotion: PacketExposure = {
  input: {
    presetKey: 'body-lotion',
    dailyAmountGrams: 7.82,
    retentionFactor: 1,
    bodyWeightKg: 60,
    source: '',
  },
  exposureMgPerKgDay: 123.2,
  presetLabel: 'Body lotion (leave-on)',
  source: 'SCCS/1647/22 (12th revision), Table 3A',
  defaulted: true,
};

describe('substanceMargin (SCCS Notes of Guidance: SED = A × C/100 × DAp/100, MoS = PoD_sys / SED)', () => {
  it('gives SED 0.0279 and MoS 1 792 for shower gel at 1 %, absorption defaulted (regulatory-sources.md E1)', () => {
    // E1: 2.79 × 0.01 × 1.00 = 0.0279; 50 / 0.0279 = 1 792.1
    const m = substanceMargin(
      2.79,
      substance('Linalool', 1),
      values('linalool', { pointOfDepartureMgPerKgDay: 50, pointOfDepartureSource: 'Study X' }),
    );
    expect(m.sedMgPerKgDay).toBeCloseTo(0.0279, 9);
    expect(m.marginOfSafety).toBeCloseTo(1792.1, 1);
    expect(m.flagged).toBe(false);
    expect(m.dermalAbsorptionPercent).toBe(100);
    expect(m.absorptionDefaulted).toBe(true);
    expect(m.dermalAbsorptionSource).toMatch(/Default 100 %/);
    expect(m.pointOfDepartureSource).toBe('Study X');
  });

  it('flags MoS 97.4 for body lotion at 0.5 % with 50 % absorption (regulatory-sources.md E2)', () => {
    // E2: 123.20 × 0.005 × 0.50 = 0.308; 30 / 0.308 = 97.4
    const m = substanceMargin(
      123.2,
      substance('Linalool', 0.5),
      values('linalool', {
        pointOfDepartureMgPerKgDay: 30,
        dermalAbsorptionPercent: 50,
        dermalAbsorptionSource: 'In vitro study',
      }),
    );
    expect(m.sedMgPerKgDay).toBeCloseTo(0.308, 9);
    expect(m.marginOfSafety).toBeCloseTo(97.4, 1);
    expect(m.flagged).toBe(true);
    expect(m.absorptionDefaulted).toBe(false);
    expect(m.dermalAbsorptionSource).toBe('In vitro study');
  });

  it('gives SED 0.308 × 2 = 0.616 and MoS 243.5 at 100 % absorption (hand-worked E7)', () => {
    // hand-worked: 123.20 × 0.005 × 1.00 = 0.616; 150 / 0.616 = 243.51
    const m = substanceMargin(
      123.2,
      substance('Limonene', 0.5),
      values('limonene', { pointOfDepartureMgPerKgDay: 150 }),
    );
    expect(m.sedMgPerKgDay).toBeCloseTo(0.616, 9);
    expect(m.marginOfSafety).toBeCloseTo(243.51, 2);
    expect(m.flagged).toBe(false);
  });

  it('has SED but no margin while the point of departure is missing', () => {
    const m = substanceMargin(2.79, substance('Citral', 0.2), undefined);
    // 2.79 × 0.002 × 1.00 = 0.00558
    expect(m.sedMgPerKgDay).toBeCloseTo(0.00558, 9);
    expect(m.marginOfSafety).toBeNull();
    expect(m.flagged).toBe(false);
    expect(m.pointOfDepartureMgPerKgDay).toBeNull();
  });

  it('has neither SED nor margin before the exposure is chosen', () => {
    const m = substanceMargin(
      null,
      substance('Citral', 0.2),
      values('citral', { pointOfDepartureMgPerKgDay: 10 }),
    );
    expect(m.sedMgPerKgDay).toBeNull();
    expect(m.marginOfSafety).toBeNull();
  });

  it('matches each substance with the assessor values of the same key, in packet order', () => {
    const margins = substanceMargins(
      2.79,
      [substance('Linalool', 1), substance('Citral', 0.2)],
      [values('citral', { pointOfDepartureMgPerKgDay: 10 }), values('linalool')],
    );
    expect(margins.map((m) => m.substanceKey)).toEqual(['linalool', 'citral']);
    expect(margins[1]?.pointOfDepartureMgPerKgDay).toBe(10);
    expect(margins[0]?.pointOfDepartureMgPerKgDay).toBeNull();
  });
});

describe('marginAttention', () => {
  it('names the shipped default, the margin under 100, the missing PoD and the defaulted absorption', () => {
    const margins = [
      substanceMargin(
        123.2,
        substance('Linalool', 0.5),
        values('linalool', { pointOfDepartureMgPerKgDay: 30, dermalAbsorptionPercent: 50 }),
      ),
      substanceMargin(123.2, substance('Citral', 0.1), undefined),
    ];
    expect(marginAttention(margins, bodyLotion)).toEqual([
      'Exposure taken from the shipped default for body lotion (leave-on) (A = 123.20 mg/kg bw/day, SCCS/1647/22 (12th revision), Table 3A): confirm it fits how this product is used.',
      'MoS 97 for Linalool is below 100: the safety assessor must review it before the product is released.',
      'Point of departure not entered for Citral.',
      'Dermal absorption left at the default 100 % for Citral.',
    ]);
  });

  it('says the exposure is missing, and nothing about a default the assessor replaced', () => {
    expect(marginAttention([], null)).toEqual([
      'Exposure to the product is not chosen yet, so no SED or margin of safety can be worked out.',
    ]);
    expect(marginAttention([], { ...bodyLotion, defaulted: false, presetLabel: null })).toEqual([]);
  });

  it('shows margins under 10 with one decimal', () => {
    expect(formatMargin(7.44)).toBe('7.4');
    expect(formatMargin(97.4)).toBe('97');
  });
});
