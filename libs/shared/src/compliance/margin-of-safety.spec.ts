import { describe, expect, it } from 'vitest';
import { ZodError } from 'zod';
import { marginOfSafety } from './margin-of-safety';

// SED = A × C/100 × DAp/100 and MoS = PoD_sys / SED: from memory (SCCS Notes of Guidance, SCCS/1647/22).
describe('marginOfSafety (SCCS Notes of Guidance)', () => {
  it('computes SED 0.0279 and MoS 1792 for a shower gel at 1 % (worked example E1)', () => {
    // SCCS Notes of Guidance (SED = A × C / 100) [CALC]; exposure A = 2.79 mg/kg bw/day from memory
    const result = marginOfSafety({
      exposureMgPerKgDay: 2.79,
      concentrationPercent: 1,
      dermalAbsorptionPercent: 100,
      pointOfDepartureMgPerKgDay: 50,
    });
    expect(result.sedMgPerKgDay).toBeCloseTo(0.0279, 6);
    expect(result.marginOfSafety).toBeCloseTo(1792.1, 1);
    expect(result.flagged).toBe(false);
  });

  it('flags MoS 97.4 for a body lotion at 0.5 % and defers to the assessor (worked example E2)', () => {
    // SCCS Notes of Guidance (MoS = POD / SED) [CALC]; threshold 100 from memory
    const result = marginOfSafety({
      exposureMgPerKgDay: 123.2,
      concentrationPercent: 0.5,
      dermalAbsorptionPercent: 50,
      pointOfDepartureMgPerKgDay: 30,
    });
    expect(result.sedMgPerKgDay).toBeCloseTo(0.308, 6);
    expect(result.marginOfSafety).toBeCloseTo(97.4, 1);
    expect(result.flagged).toBe(true);
    expect(result.message).toMatch(/below 100.*safety assessor/);
  });

  it('flags MoS 76.5 for a hand cream at 2 % with absorption left at 100 % (hand-worked E4)', () => {
    // hand-worked: A 32.70 (SCCS/1647/22 Table 3A, hand cream [C2]); SED = 32.70 × 0.02 × 1.00 = 0.654;
    // MoS = 50 / 0.654 = 76.45 (SCCS Notes of Guidance, MoS = PoD_sys / SED)
    const result = marginOfSafety({
      exposureMgPerKgDay: 32.7,
      concentrationPercent: 2,
      dermalAbsorptionPercent: 100,
      pointOfDepartureMgPerKgDay: 50,
    });
    expect(result.sedMgPerKgDay).toBeCloseTo(0.654, 9);
    expect(result.marginOfSafety).toBeCloseTo(76.45, 2);
    expect(result.flagged).toBe(true);
  });

  it('passes MoS 12 012 for a hand wash soap at 0.5 % with 10 % absorption (hand-worked E5)', () => {
    // hand-worked: A 3.33 (SCCS Notes of Guidance hand wash soap, from memory); SED = 3.33 × 0.005 × 0.10
    // = 0.001665; MoS = 20 / 0.001665 = 12 012.0
    const result = marginOfSafety({
      exposureMgPerKgDay: 3.33,
      concentrationPercent: 0.5,
      dermalAbsorptionPercent: 10,
      pointOfDepartureMgPerKgDay: 20,
    });
    expect(result.sedMgPerKgDay).toBeCloseTo(0.001665, 9);
    expect(result.marginOfSafety).toBeCloseTo(12012.0, 1);
    expect(result.flagged).toBe(false);
  });

  it('does not flag a margin of exactly 100 (hand-worked E6, threshold boundary)', () => {
    // hand-worked: SED = 100 × 0.01 × 1.00 = 1; MoS = 100 / 1 = 100; "MoS ≥ 100" adequate (SCCS NoG, from memory)
    const result = marginOfSafety({
      exposureMgPerKgDay: 100,
      concentrationPercent: 1,
      dermalAbsorptionPercent: 100,
      pointOfDepartureMgPerKgDay: 100,
    });
    expect(result.marginOfSafety).toBeCloseTo(100, 9);
    expect(result.flagged).toBe(false);
    expect(result.message).toMatch(/^Margin of safety 100 \(at least 100/);
  });

  it('rejects a concentration above 100 % with a field path', () => {
    try {
      marginOfSafety({
        exposureMgPerKgDay: 1,
        concentrationPercent: 120,
        dermalAbsorptionPercent: 100,
        pointOfDepartureMgPerKgDay: 1,
      });
      expect.unreachable();
    } catch (error) {
      // ZodError expected from marginOfSafetyInputSchema.parse
      expect((error as ZodError).issues[0]?.path).toEqual(['concentrationPercent']);
    }
  });
});
