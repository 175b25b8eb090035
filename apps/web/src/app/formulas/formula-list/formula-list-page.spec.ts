import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { Router } from '@angular/router';
import type { Role } from '@batchproof/shared';
import type { FormulaPage } from '@batchproof/shared';
import { aFormula, aVersion, FORMULA_ID, nextRequest, openAs } from '../formulas-testing';
import FormulaListPage from './formula-list-page';

@Component({ template: 'editor' })
class EditorStub {}

const ROUTES = [
  { path: 'formulas', component: FormulaListPage },
  { path: 'formulas/:id', component: EditorStub },
];

const PAGE: FormulaPage = {
  items: [
    {
      id: FORMULA_ID,
      name: 'Lagoon fizzer',
      productType: 'fizzer',
      updatedAt: '2026-11-30T10:00:00.000Z',
      latestVersion: 2,
      latestState: 'draft',
      releasedVersion: 1,
      latestCounts: { block: 1, warn: 2, info: 0 },
    },
  ],
  total: 1,
  page: 1,
  pageSize: 25,
};
const EMPTY: FormulaPage = { items: [], total: 0, page: 1, pageSize: 25 };

async function openList(role: Role, url = '/formulas', answer = PAGE) {
  const page = await openAs(role, ROUTES, url, FormulaListPage);
  const req = page.backend.expectOne((r) => r.url === '/api/formulas');
  req.flush(answer);
  await page.harness.fixture.whenStable();
  return { ...page, req };
}

const buttons = async (page: Awaited<ReturnType<typeof openList>>) =>
  Promise.all((await page.loader.getAllHarnesses(MatButtonHarness)).map((b) => b.getText()));

describe('FormulaListPage', () => {
  beforeEach(() => localStorage.clear());

  it('asks the server for the filter, sort and page in the URL', async () => {
    const page = await openList(
      'viewer',
      '/formulas?q=lag&productType=fizzer&sort=updatedAt&dir=desc&page=2',
    );
    const params = page.req.request.params;
    expect(params.get('q')).toBe('lag');
    expect(params.get('productType')).toBe('fizzer');
    expect(params.get('sort')).toBe('updatedAt');
    expect(params.get('dir')).toBe('desc');
    expect(params.get('page')).toBe('2');
  });

  it('shows each formula with its latest state and its findings as words, not colour alone', async () => {
    const page = await openList('viewer');
    const cells = await (await page.loader.getHarness(MatTableHarness)).getCellTextByColumnName();
    expect(cells['name']!.text).toEqual(['Lagoon fizzer']);
    expect(cells['productType']!.text).toEqual(['Fizzer (bath bomb)']);
    expect(cells['latest']!.text[0]).toMatch(/v2\s*edit_note\s*draft\s*\(v1 released\)/);
    expect(cells['findings']!.text[0]).toMatch(/Blocks\s*1.*Check\s*2.*Note\s*0/);
  });

  it('offers "New formula" to writers only, and tells an empty workshop what to do', async () => {
    const viewer = await openList('viewer', '/formulas', EMPTY);
    expect((await buttons(viewer)).join('|')).not.toContain('New formula');
    expect(viewer.el.textContent).toContain('The owner or a formulator writes them');
    TestBed.resetTestingModule();

    const formulator = await openList('formulator', '/formulas', EMPTY);
    expect((await buttons(formulator)).join('|')).toContain('New formula');
    expect(formulator.el.textContent).toContain('Choose “New formula”');
  });

  it('creates a formula with a starting profile for its type and opens it', async () => {
    const page = await openList('owner', '/formulas', EMPTY);
    await (await page.loader.getHarness(MatButtonHarness.with({ text: /New formula/ }))).click();
    await (
      await page.root.getHarness(MatInputHarness.with({ selector: 'bp-new-formula-dialog input' }))
    ).setValue('Lagoon fizzer');
    const created = (
      await page.root.getHarness(MatButtonHarness.with({ text: 'Create formula' }))
    ).click();

    const post = await nextRequest(page.backend, (r) => r.method === 'POST');
    expect(post.request.body).toMatchObject({
      name: 'Lagoon fizzer',
      productType: 'fizzer',
      draft: {
        lines: [],
        profile: { use: 'rinse-off', inBath: true, ifraCategory: '9', markets: ['US', 'EU'] },
      },
    });
    post.flush(aFormula([aVersion([])]), { status: 201, statusText: 'Created' });
    await created;
    // The dialog hands the formula over once it has closed.
    await vi.waitFor(() => expect(TestBed.inject(Router).url).toBe(`/formulas/${FORMULA_ID}`));
  });
});
