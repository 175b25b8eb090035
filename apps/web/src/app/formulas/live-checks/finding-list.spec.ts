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
