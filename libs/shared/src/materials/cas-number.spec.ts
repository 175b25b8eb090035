import { describe, expect, it } from 'vitest';
import { referenceLists } from '../reference-data/reference-lists';
import { materialCreateSchema } from './material-schema';
import { casCheckDigit, casProblems, isValidCas } from './cas-number';

describe('CAS Registry Number check digit', () => {
  it.each([
    ['7732-18-5', 'water'],
    ['7647-14-5', 'sodium chloride'],
    ['144-55-8', 'sodium bicarbonate'],
    ['77-92-9', 'citric acid'],
    ['122-99-6', 'phenoxyethanol'],
    ['78-70-6', 'linalool'],
    ['5989-27-5', 'd-limonene'],
    ['13463-67-7', 'titanium dioxide'],
  ])('accepts %s (%s)', (cas) => {
    // CAS Registry: check digit = Σ (digit × position from the right) mod 10
    expect(isValidCas(cas)).toBe(true);
  });

  it('works the published example: 7732-18-5 → (8×1 + 1×2 + 2×3 + 3×4 + 7×5 + 7×6) mod 10 = 5', () => {
    // CAS Registry's own worked example for water
    expect(casCheckDigit('7732-18-5')).toBe(105 % 10);
  });

  it('rejects a wrong check digit or shape, saying which digit is expected', () => {
    expect(isValidCas('7732-18-4')).toBe(false);
    expect(isValidCas('7732185')).toBe(false);
    expect(casProblems('7732-18-4')).toEqual([
      'CAS 7732-18-4 fails its check digit (the other digits call for 5): check the number',
    ]);
    expect(casProblems('not a number')).toEqual(['Enter a CAS number such as 7732-18-5']);
    expect(casProblems('8000-28-0; 90063-37-9')).toEqual([]);
  });

  it('refuses a material whose CAS field holds a number that fails its check digit', () => {
    const result = materialCreateSchema.safeParse({
      tradeName: 'Distilled water',
      inci: 'Aqua',
      cas: '7732-18-4',
      category: 'base',
    });
    expect(result.success).toBe(false);
    expect(result.error?.issues[0]?.path).toEqual(['cas']);
  });

  it('every CAS number in the shipped reference lists passes its check digit', () => {
    const found: string[] = [];
    const walk = (value: unknown) => {
      if (typeof value === 'string') found.push(...(value.match(/\b\d{2,7}-\d{2}-\d\b/g) ?? []));
      else if (Array.isArray(value)) value.forEach(walk);
      else if (value && typeof value === 'object') Object.values(value).forEach(walk);
    };
    for (const list of referenceLists) for (const row of list.rows) walk(row);
    expect(found.length).toBeGreaterThan(50);
    expect(found.filter((cas) => !isValidCas(cas))).toEqual([]);
  });
});
