import { describe, expect, it } from 'vitest';
import { documentStatusEntries } from './document-status';

const TODAY = '2026-06-15';
const states = (category: string, docs: { kind: 'sds' | 'ifra-certificate'; issuedOn: string }[]) =>
  documentStatusEntries(category, docs, TODAY).map((e) => [e.kind, e.state]);

describe('documentStatusEntries', () => {
  it('counts an SDS dated after today as dated in the future, never current', () => {
    const [entry] = documentStatusEntries('base', [{ kind: 'sds', issuedOn: '2026-06-16' }], TODAY);
    expect(entry!.state).toBe('future-dated');
    expect(entry!.message).toContain('2026-06-16, after today');
  });

  it('counts an SDS issued today or within the last 365 days as current, and older as out of date', () => {
    expect(states('base', [{ kind: 'sds', issuedOn: TODAY }])).toEqual([['sds', 'current']]);
    // DOCUMENT_STALE_DAYS = 365; common practice, no published source
    expect(states('base', [{ kind: 'sds', issuedOn: '2025-06-15' }])).toEqual([['sds', 'current']]);
    expect(states('base', [{ kind: 'sds', issuedOn: '2025-06-14' }])).toEqual([
      ['sds', 'out-of-date'],
    ]);
  });

  it('asks a fragrance for an SDS, an IFRA certificate and an allergen declaration', () => {
    expect(states('fragrance', [{ kind: 'ifra-certificate', issuedOn: '2026-01-01' }])).toEqual([
      ['sds', 'missing'],
      ['ifra-certificate', 'current'],
      ['allergen-declaration', 'missing'],
    ]);
  });
});
