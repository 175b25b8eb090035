import { TestBed } from '@angular/core/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { Router } from '@angular/router';
import type { ComplianceFinding, VersionComparison } from '@batchproof/shared';
import {
  aFormula,
  aVersion,
  BICARB,
  BLUE_BLEND,
  CITRIC,
  FORMULA_ID,
  nextRequest,
  openAs,
} from '../formulas-testing';
import FormulaComparePage from './formula-compare-page';

const ROUTES = [{ path: 'formulas/:id/compare', component: FormulaComparePage }];

const BLOCK: ComplianceFinding = {
  code: 'COLOURANT_NOT_PERMITTED',
  severity: 'block',
  market: 'US',
  subject: 'Ultramarines (CI 77007)',
  message: 'Not permitted in the US for products used in the bath.',
  source: '21 CFR 73.2725',
  status: 'C',
  lines: [2],
};

const COMPARISON: VersionComparison = {
  from: 1,
  to: 2,
  lines: [
    {
      materialId: BICARB.id,
      materialName: BICARB.tradeName,
      change: 'changed',
      fromGrams: 200,
      toGrams: 180,
      fromPercent: 66.6667,
      toPercent: 64.2857,
      percentMoved: false,
    },
    {
      materialId: CITRIC.id,
      materialName: CITRIC.tradeName,
      change: 'unchanged',
      fromGrams: 100,
      toGrams: 100,
      fromPercent: 33.3333,
      toPercent: 35.7143,
      percentMoved: true,
    },
    {
      materialId: BLUE_BLEND.id,
      materialName: BLUE_BLEND.tradeName,
      change: 'removed',
      fromGrams: 1,
      toGrams: null,
      fromPercent: 0.3311,
      toPercent: null,
      percentMoved: false,
    },
  ],
  markets: [
    {
      market: 'US',
      fromDeclaration: 'Ingredients: Sodium Bicarbonate, Citric Acid, Mica, Ultramarines.',
      toDeclaration: 'Ingredients: Sodium Bicarbonate, Citric Acid.',
      declarationChanged: true,
      ingredientsAdded: [],
      ingredientsRemoved: ['Mica', 'Ultramarines'],
      findingsAdded: [],
      findingsRemoved: [BLOCK],
    },
  ],
};

const VERSIONS = [
  aVersion([], { number: 1, state: 'superseded' }),
  aVersion([], { number: 2, state: 'released' }),
];

async function openCompare(url = `/formulas/${FORMULA_ID}/compare?from=1&to=2`) {
  const page = await openAs('viewer', ROUTES, url, FormulaComparePage);
  page.backend.expectOne(`/api/formulas/${FORMULA_ID}`).flush(aFormula(VERSIONS));
  const req = page.backend.expectOne((r) => r.url === `/api/formulas/${FORMULA_ID}/compare`);
  return { ...page, req };
}

/** Each row of the line changes as its cells' words (icons are decoration), joined by `|`. */
const rowTexts = (el: HTMLElement) =>
  Array.from(el.querySelectorAll('table[aria-label="Line changes"] tbody tr')).map((tr) =>
    Array.from(tr.querySelectorAll('th, td'))
      .map((cell) => {
        const copy = cell.cloneNode(true) as HTMLElement;
        copy.querySelectorAll('mat-icon').forEach((icon) => icon.remove());
        return (copy.textContent ?? '').replace(/\s+/g, ' ').trim();
      })
      .join(' | '),
  );

describe('FormulaComparePage', () => {
  beforeEach(() => localStorage.clear());

  it('asks for the versions in the URL and lists removed, changed and unchanged lines with grams and percent', async () => {
    const page = await openCompare();
    expect(page.req.request.params.get('from')).toBe('1');
    expect(page.req.request.params.get('to')).toBe('2');
    page.req.flush(COMPARISON);
    await page.harness.fixture.whenStable();

    expect(rowTexts(page.el)).toEqual([
      'Lagoon blue mica | Removed | 1 g | — | 0.33 % | —',
      'Bicarb, fine | Changed | 200 g | 180 g | 66.67 % | 64.29 %',
      'Citric acid | Same | 100 g | 100 g | 33.33 % | 35.71 %',
    ]);
  });

  it('shows per market how the declaration changed and which findings were resolved', async () => {
    const page = await openCompare();
    page.req.flush(COMPARISON);
    await page.harness.fixture.whenStable();

    const us = page.el.querySelector('[aria-label="US changes"]')!.textContent!;
    expect(us).toContain('Ingredients: Sodium Bicarbonate, Citric Acid, Mica, Ultramarines.');
    expect(us).toContain('No longer named: Mica, Ultramarines');
    expect(us).toContain('Resolved since version 1');
    expect(us).toMatch(/Blocks\s*Ultramarines \(CI 77007\) — 21 CFR 73\.2725/);
  });

  it('choosing another version puts it in the URL', async () => {
    const page = await openCompare();
    page.req.flush(COMPARISON);
    await page.harness.fixture.whenStable();

    const [from] = await page.loader.getAllHarnesses(MatSelectHarness);
    await from!.open();
    const chosen = from!.clickOptions({ text: /Version 2/ });
    const again = await nextRequest(
      page.backend,
      (r) => r.url === `/api/formulas/${FORMULA_ID}/compare`,
    );
    expect(again.request.params.get('from')).toBe('2');
    again.flush({ ...COMPARISON, from: 2, lines: [] });
    await chosen;
    expect(TestBed.inject(Router).url).toContain('from=2');
  });
});
