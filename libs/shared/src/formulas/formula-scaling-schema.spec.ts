import { describe, expect, it } from 'vitest';
import { fieldErrorsFromZod } from '../errors/error-envelope';
import { scaleRequestSchema } from './formula-scaling-schema';

const refusals = (body: unknown) => {
  const result = scaleRequestSchema.safeParse(body);
  return result.success ? {} : fieldErrorsFromZod(result.error);
};

describe('scaleRequestSchema', () => {
  it('takes a workshop-sized batch by units or by total', () => {
    expect(refusals({ units: 12, unitMassGrams: 150, lossPercent: 3 })).toEqual({});
    expect(refusals({ totalGrams: 25_000 })).toEqual({});
  });

  it('refuses sizes no workshop makes, on the field that asks for them', () => {
    expect(refusals({ units: 5_000_000, unitMassGrams: 150 })).toEqual({
      units: ['Make at most 1,000,000 units at a time'],
    });
    expect(refusals({ totalGrams: 1e308 })).toEqual({
      totalGrams: ['The total is too large (1,000,000,000 g at most)'],
    });
    expect(refusals({ units: 2, unitMassGrams: 1e308 })).toEqual({
      unitMassGrams: ['The unit mass is too large (1,000,000 g at most)'],
    });
  });

  it('refuses units × unit mass beyond the largest batch', () => {
    expect(refusals({ units: 1_000_000, unitMassGrams: 5_000 })).toEqual({
      units: ['That batch would weigh more than 1,000,000,000 g: make fewer units'],
    });
  });
});
