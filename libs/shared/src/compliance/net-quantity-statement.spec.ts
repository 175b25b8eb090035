import { describe, expect, it } from 'vitest';
import { ZodError } from 'zod';
import { largestWholeUnits, netQuantityStatement } from './net-quantity-statement';
import { US_UNITS } from './us-customary-units';

describe('netQuantityStatement (FPLA; 21 CFR 701.13)', () => {
  it('declares 4 oz of a solid as "Net Wt. 4 oz (113 g)", rounding the grams down', () => {
    // NIST Handbook 133 / 44 (1 oz = 28.349523125 g exactly) [CALC]: 4 oz = 113.3980925 g; NIST: never overstate, round down
    const statement = netQuantityStatement({ amount: 4 * US_UNITS.ounceGrams, unit: 'g' });
    expect(statement.text).toBe('Net Wt. 4 oz (113 g)');
    expect(statement.kind).toBe('weight');
  });

  it('declares 113 g as 3.98 oz, never 4 oz', () => {
    // NIST metric labelling fact sheet: "In no case shall rounded net contents declarations overstate a quantity"
    const statement = netQuantityStatement({ amount: 113, unit: 'g' });
    expect(statement.us.value).toBe(3.98);
    expect(statement.us.value * US_UNITS.ounceGrams).toBeLessThanOrEqual(113);
  });

  it('declares 1 lb as "16 oz (1 lb) 453 g" and adds pounds from 16 oz', () => {
    // NIST Handbook 44 (1 lb = 16 oz = 453.59237 g) [CALC]; dual oz + lb form from memory
    expect(netQuantityStatement({ amount: US_UNITS.poundGrams, unit: 'g' }).text).toBe(
      'Net Wt. 16 oz (1 lb) 453 g',
    );
    expect(netQuantityStatement({ amount: 24 * US_UNITS.ounceGrams, unit: 'g' }).text).toBe(
      'Net Wt. 24 oz (1 lb 8 oz) 680 g',
    );
  });

  it('declares a liquid in fluid ounces: 8 fl oz (236 mL)', () => {
    // NIST Handbook 44 (1 US fl oz = 29.5735295625 mL) [CALC]: 8 fl oz = 236.5882365 mL; FPLA: liquids by fluid measure
    const statement = netQuantityStatement({
      amount: 8 * US_UNITS.fluidOunceMillilitres,
      unit: 'mL',
    });
    expect(statement.text).toBe('Net 8 fl oz (236 mL)');
    expect(statement.kind).toBe('fluid');
  });

  it('never overstates either figure over a sweep of amounts', () => {
    // Tolerance of 1e-9 g only absorbs float noise in the loop's own sums (9.139999999999999 for 9.14).
    for (let step = 100; step <= 200000; step += 37) {
      const amount = step / 100;
      const { metric, us } = netQuantityStatement({ amount, unit: 'g' });
      expect(metric.value).toBeLessThanOrEqual(amount + 1e-9);
      expect(us.value * US_UNITS.ounceGrams).toBeLessThanOrEqual(amount + 1e-9);
    }
  });

  it('gives the minimum type height from the panel area', () => {
    // 21 CFR 701.13 / 16 CFR 500.21: ≤ 5 in² → 1/16 in; > 5-25 in² → 1/8 in (C2)
    expect(
      netQuantityStatement({ amount: 100, unit: 'g', pdpAreaSqIn: 5 }).minimumTypeHeight?.label,
    ).toBe('1/16 in');
    expect(
      netQuantityStatement({ amount: 100, unit: 'g', pdpAreaSqIn: 5.01 }).minimumTypeHeight?.label,
    ).toBe('1/8 in');
    // from memory: 3/16 in for > 25-100 in²
    const large = netQuantityStatement({
      amount: 100,
      unit: 'g',
      pdpAreaSqIn: 40,
    }).minimumTypeHeight;
    expect(large).toEqual({ inches: 3 / 16, label: '3/16 in', status: 'M' });
  });

  it('notes the EU small-package exemption below 5 g', () => {
    // Regulation (EC) No 1223/2009, Art. 19(1)(b)
    expect(netQuantityStatement({ amount: 4, unit: 'g' }).notes.join(' ')).toMatch(/under 5 g/);
  });

  it('rejects a zero amount with a field path', () => {
    try {
      netQuantityStatement({ amount: 0, unit: 'g' });
      expect.unreachable();
    } catch (error) {
      // ZodError expected from netQuantityInputSchema.parse
      expect(error).toBeInstanceOf(ZodError);
      expect((error as ZodError).issues[0]?.path).toEqual(['amount']);
    }
  });
});

describe('net quantity for volumes and for each market', () => {
  it('adds the largest whole US units for a liquid of a quart or more', () => {
    // NIST Handbook 44 (1 qt = 32 fl oz, 1 gal = 128 fl oz) [CALC]; FPLA "largest whole unit" form from memory
    const quart = netQuantityStatement({ amount: 32 * US_UNITS.fluidOunceMillilitres, unit: 'mL' });
    expect(quart.text).toBe('Net 32 fl oz (1 qt) 946 mL');
    const litre = netQuantityStatement({ amount: 1000, unit: 'mL' });
    expect(litre.text).toBe('Net 33.8 fl oz (1 qt 1.8 fl oz) 1000 mL');
    expect(largestWholeUnits(160)).toBe('1 gal 1 qt');
    expect(largestWholeUnits(48)).toBe('1 qt 1 pt');
    expect(largestWholeUnits(20)).toBe('1 pt 4 fl oz');
  });

  it('puts the metric quantity first, on its own, for the EU, UK and Canada', () => {
    // Regulation (EC) No 1223/2009, Art. 19(1)(b): nominal content by weight or volume
    const statement = netQuantityStatement({ amount: 250, unit: 'mL' });
    expect(statement.byMarket.EU).toBe('250 ml');
    expect(statement.byMarket.UK).toBe('250 ml');
    expect(statement.byMarket.CA).toBe('250 mL');
    expect(statement.byMarket.US).toBe(statement.text);
    expect(statement.notes.join(' ')).toMatch(/Poids net/);
  });
});
