import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import type { ComplianceFinding } from '@batchproof/shared';
import { ASSESSMENT_CAUTION, AssessmentFindings } from './assessment-findings';

const missing = (market: 'EU' | 'UK'): ComplianceFinding => ({
  code: 'SAFETY_ASSESSMENT_MISSING',
  severity: 'warn',
  market,
  subject: 'Version 3',
  message: `Version 3 has no signed safety assessment; version 2 was assessed. A qualified safety assessor must assess and sign this version before it is sold in the ${market}.`,
  source:
    market === 'EU'
      ? 'Regulation (EC) No 1223/2009, Art. 10 and Annex I'
      : 'UK Cosmetics Regulation (retained Regulation (EC) No 1223/2009), Art. 10 and Annex I',
  status: 'C',
  lines: [],
});

async function render(findings: ComplianceFinding[] | undefined) {
  TestBed.configureTestingModule({ providers: [provideZonelessChangeDetection()] });
  const fixture = TestBed.createComponent(AssessmentFindings);
  fixture.componentRef.setInput('findings', findings);
  fixture.componentRef.setInput('markets', ['US', 'EU', 'UK']);
  await fixture.whenStable();
  return fixture.nativeElement as HTMLElement;
}

describe('AssessmentFindings', () => {
  it('shows a missing assessment as a warning naming the assessed version, with the safety caution and both sources', async () => {
    const el = await render([missing('EU'), missing('UK')]);
    expect(el.querySelector('h3')?.textContent).toBe('Safety assessment');
    expect(el.querySelector('[role="note"]')?.textContent).toContain(ASSESSMENT_CAUTION);
    const items = el.querySelectorAll('bp-finding-list li.warn');
    // The same words for the EU and the UK are shown once, under both markets.
    expect(items.length).toBe(1);
    expect(items[0]!.textContent).toContain('version 2 was assessed');
    expect(items[0]!.textContent).toContain('Art. 10 and Annex I');
    expect(items[0]!.textContent).toContain('UK Cosmetics Regulation');
  });

  it('shows nothing when the version is signed or the answer did not look it up', async () => {
    expect((await render([])).textContent?.trim()).toBe('');
    TestBed.resetTestingModule();
    expect((await render(undefined)).textContent?.trim()).toBe('');
  });
});
