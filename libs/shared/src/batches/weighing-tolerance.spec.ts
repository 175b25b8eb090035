import { describe, expect, it } from 'vitest';
import { checkUnitWeights, checkWeighing, weighingToleranceSchema } from './weighing-tolerance';

const line = (actualGrams: number | null, targetGrams = 500) => ({
  name: 'Citric acid',
  targetGrams,
  actualGrams,
});

describe('checkWeighing', () => {
  it('keeps exactly 2 % inside the default tolerance and flags 2.01 %', () => {
    // 510 g against 500 g is +2 %; 510.05 g is +2.01 %; 489.95 g is −2.01 %
    const [edge, over, under] = checkWeighing([line(510), line(510.05), line(489.95)]);
    expect(edge).toEqual({ status: 'ok', deviationPercent: 2, message: null });
    expect(over).toEqual({
      status: 'out',
      deviationPercent: 2.01,
      message: 'Citric acid: 510.05 g weighed against 500.00 g, 2.01 % over (allowed ±2 %)',
    });
    expect(under).toMatchObject({ status: 'out', deviationPercent: -2.01 });
    expect(under.message).toContain('2.01 % under');
  });

  it('holds the edge on a target with binary noise: 2,002.32 g at +2 % is 2,042.3664 g', () => {
    const [check] = checkWeighing([line(2042.3664, 2002.32)]);
    expect(check).toMatchObject({ status: 'ok', deviationPercent: 2 });
  });

  it('uses the workshop tolerance', () => {
    // 5 % over is out at 2 %, in at 5 %
    expect(checkWeighing([line(525)])[0]!.status).toBe('out');
    expect(checkWeighing([line(525)], 5)[0]!.status).toBe('ok');
  });

  it('says which lines are not weighed and which weigh something on a 0 g line', () => {
    const [missing, zero, extra] = checkWeighing([line(null), line(0, 0), line(1.5, 0)]);
    expect(missing).toEqual({
      status: 'not-weighed',
      deviationPercent: null,
      message: 'Citric acid: not weighed yet',
    });
    expect(zero!.status).toBe('ok');
    expect(extra!.message).toBe('Citric acid: 1.50 g weighed, but this line is 0 g in the formula');
  });

  it('refuses a tolerance outside 0.1 to 20 %', () => {
    expect(() => checkWeighing([line(500)], 0.05)).toThrow(
      'The weighing tolerance must be 0.1 to 20 %',
    );
    expect(weighingToleranceSchema.safeParse(20.5).success).toBe(false);
    expect(weighingToleranceSchema.parse(undefined)).toBe(2);
  });
});

describe('checkUnitWeights', () => {
  it('passes units at or above the declared net quantity', () => {
    expect(checkUnitWeights([180, 181.5, 182], 180)).toMatchObject({
      status: 'ok',
      averageGrams: 181.17,
      messages: [],
    });
  });

  it('names light units when the average still meets the declaration', () => {
    // 176 + 184 + 183 = 543; 543 / 3 = 181 g ≥ 180 g, but unit 1 is light
    const check = checkUnitWeights([176, 184, 183], 180);
    expect(check).toMatchObject({
      status: 'light-units',
      averageGrams: 181,
      lightestGrams: 176,
      belowDeclared: [1],
    });
    expect(check.messages).toEqual([
      '1 of 3 units weigh less than the declared 180.0 g (unit 1; the lightest 176.0 g)',
    ]);
  });

  it('flags an average below the declaration', () => {
    // (178 + 179 + 182) / 3 = 179.67 g
    const check = checkUnitWeights([178, 179, 182], 180);
    expect(check.status).toBe('average-below');
    expect(check.messages[0]).toBe(
      'The average unit weighs 179.67 g, below the declared 180.0 g: the units must weigh at least the declared net quantity on average',
    );
    expect(check.belowDeclared).toEqual([1, 2]);
  });
});
