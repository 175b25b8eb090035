import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import type { ComplianceFinding } from '@batchproof/shared';
import { FindingList } from './finding-list';
import { INTERPRETATION_NOTE } from './interpretation-note';

const aFinding = (fields: Partial<ComplianceFinding>): ComplianceFinding => ({
  code: 'COLOURANT_NOT_PERMITTED',
  severity: 'block',
  market: 'EU',
  subject: 'Ultramarines',
  message: 'Ultramarines: not for products applied on mucous membranes.',
  source: 'Regulation (EC) No 1223/2009 Annex IV',
  status: 'C',
  lines: [0],
  ...fields,
});

async function render(findings: ComplianceFinding[]) {
  TestBed.configureTestingModule({ providers: [provideZonelessChangeDetection()] });
  const fixture = TestBed.createComponent(FindingList);
  fixture.componentRef.setInput('findings', findings);
  fixture.componentRef.setInput('markets', ['EU']);
  await fixture.whenStable();
  return fixture.nativeElement as HTMLElement;
}

describe('FindingList', () => {
  it('says in words that an interpretation finding is Batchproof’s reading, and that the owner may override it', async () => {
    const el = await render([aFinding({ status: 'interpretation' })]);
    const note = el.querySelector('bp-interpretation-note');
    expect(note?.textContent).toContain('Interpretation:');
    expect(note?.textContent).toContain(INTERPRETATION_NOTE);
    // The icon is decoration: the words carry the meaning for a screen reader.
    expect(note?.querySelector('mat-icon')?.getAttribute('aria-hidden')).toBe('true');
  });

  it('adds no interpretation note to a finding resting on a confirmed rule', async () => {
    const el = await render([
      aFinding({ status: 'C' }),
      aFinding({ status: 'M', severity: 'warn' }),
    ]);
    expect(el.querySelector('bp-interpretation-note')).toBeNull();
    expect(el.textContent).toContain('(from memory, not yet confirmed)');
  });
});

describe('FindingList across markets', () => {
  it('shows a finding raised alike for the EU, UK and Canada once, under those markets, with each source', async () => {
    TestBed.configureTestingModule({ providers: [provideZonelessChangeDetection()] });
    const fixture = TestBed.createComponent(FindingList);
    const missing = (market: 'EU' | 'UK' | 'CA', source: string) =>
      aFinding({
        code: 'FRAGRANCE_ALLERGEN_DATA_MISSING',
        market,
        subject: 'Lavender oil',
        message: `Lavender oil has no allergen declaration, so the ${market} ingredient list cannot name the allergens.`,
        source,
      });
    fixture.componentRef.setInput('findings', [
      missing('EU', 'EU Annex III'),
      missing('UK', 'UK Annex III'),
      missing('CA', 'SOR/2024-63'),
      aFinding({ market: 'EU' }),
    ]);
    fixture.componentRef.setInput('markets', ['US', 'EU', 'UK', 'CA']);
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    const titles = [...el.querySelectorAll('h4')].map((h) => h.textContent?.trim());
    expect(titles).toEqual([
      'EU · European Union, UK · United Kingdom and CA · Canada',
      'EU · European Union',
    ]);
    const items = el.querySelectorAll('li');
    expect(items.length).toBe(2);
    expect(items[0]!.textContent).toContain('the EU/UK/CA ingredient list');
    expect(items[0]!.textContent).toContain('EU Annex III; UK Annex III; SOR/2024-63');
  });
});
