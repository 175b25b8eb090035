import { addDays, expiresBeforeFor, expiryState, isoDay } from './lot-expiry';

const TODAY = new Date(2026, 4, 15); // 15 May 2026, local time

describe('lot expiry', () => {
  it('writes a local day as YYYY-MM-DD and counts days across a month end', () => {
    expect(isoDay(TODAY)).toBe('2026-05-15');
    expect(addDays(TODAY, 17)).toBe('2026-06-01');
    expect(addDays(TODAY, -15)).toBe('2026-04-30');
  });

  it('calls a lot expired from the day after its expiry date', () => {
    expect(expiryState('2026-05-14', TODAY)).toBe('expired');
    expect(expiryState('2026-05-15', TODAY)).toBe('soon');
  });

  it('calls a lot expiring soon within 30 days, and fine after that', () => {
    expect(expiryState('2026-06-14', TODAY)).toBe('soon');
    expect(expiryState('2026-06-15', TODAY)).toBe('ok');
    expect(expiryState(null, TODAY)).toBe('none');
  });

  it('turns the list filter into the API cut-off, ignoring filters it does not know', () => {
    expect(expiresBeforeFor('expired', TODAY)).toBe('2026-05-14');
    expect(expiresBeforeFor('30', TODAY)).toBe('2026-06-14');
    expect(expiresBeforeFor('7', TODAY)).toBeUndefined();
    expect(expiresBeforeFor(undefined, TODAY)).toBeUndefined();
  });
});
