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
