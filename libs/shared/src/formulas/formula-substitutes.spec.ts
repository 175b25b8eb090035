import { describe, expect, it } from 'vitest';
import { fieldErrorsFromZod } from '../errors/error-envelope';
import { formulaVersionInputSchema, linesInGrams } from './formula-schema';

const profile = { use: 'rinse-off', inBath: true, ifraCategory: '9', markets: ['EU'] };
const corn = '00000000-0000-4000-8000-000000000001';
const tapioca = '00000000-0000-4000-8000-000000000002';
const arrowroot = '00000000-0000-4000-8000-000000000003';
const more = [4, 5, 6, 7, 8].map((n) => `00000000-0000-4000-8000-00000000000${n}`);

const refusals = (body: unknown) => {
  const result = formulaVersionInputSchema.safeParse(body);
  return result.success ? {} : fieldErrorsFromZod(result.error);
};
const byWeight = (substitutes: unknown) => ({
  lines: [{ materialId: corn, grams: 100, substitutes }],
  profile,
});
const byPercent = (substitutes: unknown) => ({
  byPercent: { batchGrams: 500, lines: [{ materialId: corn, percent: 100, substitutes }] },
  profile,
});

describe('approved substitutes on a draft line', () => {
  it.each([
    ['by weight', byWeight],
    ['by percent', byPercent],
  ])('a line %s may name up to five other materials, or none', (_, body) => {
    expect(refusals(body([tapioca, arrowroot]))).toEqual({});
    expect(refusals(body(more))).toEqual({});
    expect(refusals(body([]))).toEqual({});
    expect(refusals(body(undefined))).toEqual({});
  });

  it('refuses a sixth substitute on the list', () => {
    expect(refusals(byWeight([tapioca, ...more]))).toEqual({
      'lines.0.substitutes': ['A line has at most 5 approved substitutes'],
    });
  });

  it('refuses the line’s own material as its substitute, on that entry', () => {
    expect(refusals(byWeight([tapioca, corn]))).toEqual({
      'lines.0.substitutes.1': [
        'A line’s own material cannot be its substitute: choose another material',
      ],
    });
    expect(refusals(byPercent([corn]))).toEqual({
      'byPercent.lines.0.substitutes.0': [
        'A line’s own material cannot be its substitute: choose another material',
      ],
    });
  });

  it('refuses a material named twice, on the repeat', () => {
    expect(refusals(byWeight([tapioca, arrowroot, tapioca]))).toEqual({
      'lines.0.substitutes.2': ['This substitute is listed twice: name each material once'],
    });
  });

  it('refuses something that is not a material id', () => {
    expect(refusals(byWeight(['tapioca']))).toEqual({
      'lines.0.substitutes.0': ['Choose a valid material'],
    });
  });

  it('keeps the substitutes with their lines in grams, whichever way they were entered', () => {
    const parsed = formulaVersionInputSchema.parse(byPercent([tapioca]));
    expect(linesInGrams(parsed)).toEqual([
      { materialId: corn, grams: 500, substitutes: [tapioca] },
    ]);
    expect(linesInGrams(formulaVersionInputSchema.parse(byWeight(undefined)))).toEqual([
      { materialId: corn, grams: 100, substitutes: [] },
    ]);
  });
});
