import { describe, expect, it } from 'vitest';
import { compareForPicking, gramsPerLotUnit, type PickableLot, suggestLotPicks } from './lot-picks';

const lot = (over: Partial<PickableLot> & Pick<PickableLot, 'id'>): PickableLot => ({
  materialId: 'citric',
  supplierLotNumber: over.id.toUpperCase(),
  unit: 'g',
  receivedOn: '2026-06-01',
  expiresOn: null,
  stockOnHand: 5000,
  ...over,
});
const citric = (grams: number) => ({ materialId: 'citric', grams, gramsPerMillilitre: null });
const MADE_ON = '2026-12-02';

describe('suggestLotPicks', () => {
  it('chooses the first-expiring lot with enough stock', () => {
    const lots = [
      lot({ id: 'later', expiresOn: '2027-09-30' }),
      lot({ id: 'earlier', expiresOn: '2027-03-31' }),
      lot({ id: 'undated', expiresOn: null }),
    ];
    const [line] = suggestLotPicks([citric(2002.32)], lots, MADE_ON);
    expect(line).toMatchObject({ status: 'single', shortGrams: 0, split: null, notes: [] });
    expect(line!.picks).toEqual([
      {
        lotId: 'earlier',
        supplierLotNumber: 'EARLIER',
        expiresOn: '2027-03-31',
        grams: 2002.32,
        quantity: 2002.32,
        unit: 'g',
      },
    ]);
  });

  it('passes over an earlier lot that holds too little, and says so', () => {
    const lots = [
      lot({ id: 'small', expiresOn: '2027-01-31', stockOnHand: 300 }),
      lot({ id: 'big', expiresOn: '2027-06-30', unit: 'kg', stockOnHand: 10 }),
    ];
    const [line] = suggestLotPicks([citric(2002.32)], lots, MADE_ON);
    // 2,002.32 g from a lot in kg is 2.0023 kg (4 decimals, as stored)
    expect(line!.picks).toMatchObject([
      { lotId: 'big', grams: 2002.32, quantity: 2.0023, unit: 'kg' },
    ]);
    expect(line!.notes).toEqual(['Lot SMALL expires earlier but holds only 300.0 g']);
  });

  it('splits across lots in expiry order when no single lot has enough', () => {
    const lots = [
      lot({ id: 'b', expiresOn: '2027-05-31', stockOnHand: 1500 }),
      lot({ id: 'a', expiresOn: '2027-02-28', stockOnHand: 1200 }),
    ];
    const [line] = suggestLotPicks([citric(2002.32)], lots, MADE_ON);
    // 1,200 g from A, then 802.32 g from B
    expect(line!.status).toBe('split');
    expect(line!.picks.map((p) => [p.lotId, p.grams])).toEqual([
      ['a', 1200],
      ['b', 802.32],
    ]);
    expect(line!.split).toEqual(line!.picks);
    expect(line!.notes).toEqual([
      'No single lot holds 2,002 g: split across 2 lots in expiry order',
    ]);
  });

  it('says how short the stock is when all lots together are not enough', () => {
    const lots = [lot({ id: 'a', stockOnHand: 500 }), lot({ id: 'b', stockOnHand: 250.5 })];
    const [line] = suggestLotPicks([citric(1000)], lots, MADE_ON);
    expect(line).toMatchObject({ status: 'short', shortGrams: 249.5 });
    expect(line!.notes).toEqual([
      'All lots in stock together hold 750.5 g, 249.5 g short of 1,000 g',
    ]);
  });

  it('does not offer expired lots, empty lots or other materials', () => {
    const lots = [
      lot({ id: 'expired', expiresOn: '2026-12-01' }),
      lot({ id: 'empty', stockOnHand: 0 }),
      lot({ id: 'starch', materialId: 'starch' }),
    ];
    const [line] = suggestLotPicks([citric(10)], lots, MADE_ON);
    expect(line!.status).toBe('none');
    expect(line!.notes).toEqual([
      'Lot EXPIRED expired on 2026-12-01 and is not offered',
      'No lot in stock can supply 10.0 g: record goods-in first',
    ]);
  });

  it('converts mL through the weight per millilitre and refuses to guess without one', () => {
    const oil = [lot({ id: 'oil', materialId: 'oil', unit: 'L', stockOnHand: 2 })];
    // 0.92 g/mL: 2 L hold 1,840 g; 460 g is 0.5 L
    const [known] = suggestLotPicks(
      [{ materialId: 'oil', grams: 460, gramsPerMillilitre: 0.92 }],
      oil,
      MADE_ON,
    );
    expect(known!.picks).toMatchObject([{ lotId: 'oil', grams: 460, quantity: 0.5, unit: 'L' }]);
    const [unknown] = suggestLotPicks(
      [{ materialId: 'oil', grams: 460, gramsPerMillilitre: null }],
      oil,
      MADE_ON,
    );
    expect(unknown!.status).toBe('none');
    expect(unknown!.notes[0]).toBe(
      'Lot OIL is not offered: it is counted in L and the material has no weight per millilitre: enter one on the material, or choose the lot by hand',
    );
  });

  it('does not let two lines count the same stock twice', () => {
    const lots = [
      lot({ id: 'a', expiresOn: '2027-01-31', stockOnHand: 1500 }),
      lot({ id: 'b', stockOnHand: 1500 }),
    ];
    const [first, second] = suggestLotPicks([citric(1000), citric(1000)], lots, MADE_ON);
    expect(first!.picks.map((p) => p.lotId)).toEqual(['a']);
    // A has 500 g left: the second line's 1,000 g come from B
    expect(second!.picks.map((p) => p.lotId)).toEqual(['b']);
    expect(second!.notes).toEqual(['Lot A expires earlier but holds only 500.0 g']);
  });
});

describe('compareForPicking and gramsPerLotUnit', () => {
  it('puts undated lots after dated ones and breaks ties by the day received', () => {
    const lots = [
      lot({ id: 'undated', expiresOn: null, receivedOn: '2026-01-01' }),
      lot({ id: 'new', expiresOn: '2027-03-31', receivedOn: '2026-09-01' }),
      lot({ id: 'old', expiresOn: '2027-03-31', receivedOn: '2026-05-01' }),
    ];
    expect([...lots].sort(compareForPicking).map((l) => l.id)).toEqual(['old', 'new', 'undated']);
  });

  it('weighs g, kg and mL with a density, never units', () => {
    expect(gramsPerLotUnit('kg', null)).toBe(1000);
    expect(gramsPerLotUnit('mL', 1.1)).toBe(1.1);
    expect(gramsPerLotUnit('units', 1)).toEqual({
      reason: 'it is counted in units, which cannot be weighed out in grams',
    });
  });
});
