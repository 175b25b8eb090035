import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HttpRequest } from '@angular/common/http';
import type { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatAutocompleteHarness } from '@angular/material/autocomplete/testing';
import { By } from '@angular/platform-browser';
import { RouterTestingHarness } from '@angular/router/testing';
import type { Material, MaterialListItem } from '@batchproof/shared';
import { signedInAs } from '../../auth/signed-in-as';
import FormulaPage from '../../formulas/formula-editor/formula-page';
import {
  aFormula,
  aVersion,
  BICARB,
  CITRIC,
  flushLabelRuns,
  FORMULA_ID,
  openAs as openFormulaAs,
} from '../../formulas/formulas-testing';
import LotPage from '../../lots/lot-page/lot-page';
import { MaterialsApi } from '../materials-api';
import { aMaterial, answerMaterialsRead, isMaterialsRead, summaryOf } from '../materials-testing';
import { MaterialPicker } from './material-picker';

const SHEA = aMaterial('0b4c7a52-2c1e-4a55-9d5e-6f1f3b2a9c01', {
  tradeName: 'Shea butter, refined',
  inci: 'Butyrospermum Parkii Butter',
  category: 'butter',
});
/** Matches "linal" in its own INCI name. */
const ZEST = aMaterial('0b4c7a52-2c1e-4a55-9d5e-6f1f3b2a9c02', {
  tradeName: 'Zest',
  inci: 'Linalool',
  category: 'essential-oil',
});
/** Matches "linal" only in one of its components. */
const AROMA = aMaterial('0b4c7a52-2c1e-4a55-9d5e-6f1f3b2a9c03', {
  tradeName: 'Aroma blend',
  inci: 'Parfum',
  category: 'fragrance',
  components: [
    { inci: 'Benzyl Alcohol', percent: 40 },
    { inci: 'Linalyl Acetate', percent: 60 },
  ],
});

/** Opens a formula's draft of two lines and answers its reads. */
async function openFormula() {
  const page = await openFormulaAs(
    'formulator',
    [{ path: 'formulas/:id/versions/:n', component: FormulaPage }],
    `/formulas/${FORMULA_ID}/versions/1`,
    FormulaPage,
  );
  const draft = aVersion([
    { material: BICARB, grams: 200 },
    { material: CITRIC, grams: 100 },
  ]);
  page.backend.expectOne(`/api/formulas/${FORMULA_ID}`).flush(aFormula([draft]));
  page.backend.expectOne(`/api/formulas/${FORMULA_ID}/versions/1`).flush(draft);
  await answerMaterialsRead(page.backend, [BICARB, CITRIC]);
  await flushLabelRuns(page);
  await page.harness.fixture.whenStable();
  return page;
}

/** Opens the goods-in form at `url` (`/lots/new…`). */
async function openLotForm(url: string) {
  const backend = await signedInAs('formulator', [{ path: 'lots/new', component: LotPage }]);
  const harness = await RouterTestingHarness.create();
  await harness.navigateByUrl(url, LotPage);
  return { harness, backend, loader: TestbedHarnessEnvironment.loader(harness.fixture) };
}

/** Saves `material` as the materials screens do, and answers the save. */
async function saveInMaterialsScreens(backend: HttpTestingController, material: Material) {
  const saving = TestBed.inject(MaterialsApi)
    .update(material.id, { ...material, supplierId: null })
    .subscribe();
  backend
    .expectOne((r) => r.method === 'PUT' && r.url === `/api/materials/${material.id}`)
    .flush(material);
  saving.unsubscribe();
}

const isSearch = (q: string) => (r: HttpRequest<unknown>) =>
  r.method === 'GET' && r.url === '/api/materials' && r.params.get('q') === q;

describe('MaterialPicker', () => {
  beforeEach(() => localStorage.clear());

  it('is the picker of the formula lines', async () => {
    const page = await openFormula();
    const pickers = page.harness.fixture.debugElement.queryAll(By.directive(MaterialPicker));
    expect(pickers).toHaveLength(2);
    const values = await Promise.all(
      (await page.loader.getAllHarnesses(MatAutocompleteHarness)).map((p) => p.getValue()),
    );
    expect(values).toEqual(['Bicarb, fine', 'Citric acid']);
  });

  it('is the picker of the lots form', async () => {
    const page = await openLotForm('/lots/new');
    await page.harness.fixture.whenStable();
    const pickers = page.harness.fixture.debugElement.queryAll(By.directive(MaterialPicker));
    expect(pickers).toHaveLength(1);
  });

  it('lists own-name matches as the server ranks them and says which matched only in a blend component', async () => {
    const page = await openLotForm('/lots/new');
    await page.harness.fixture.whenStable();
    const picker = await page.loader.getHarness(MatAutocompleteHarness);
    const typing = picker.enterText('linal');
    const search = await vi.waitFor(() => page.backend.expectOne(isSearch('linal')));
    const items: MaterialListItem[] = [
      { ...summaryOf(ZEST), matchedIn: 'name' },
      { ...summaryOf(AROMA), matchedIn: 'components', matchedComponent: 'Linalyl Acetate' },
    ];
    search.flush({ items, total: 2, page: 1, pageSize: 20 });
    await typing;

    const options = await Promise.all((await picker.getOptions()).map((o) => o.getText()));
    expect(options).toHaveLength(2);
    expect(options[0]).toContain('Zest');
    expect(options[0]).not.toContain('matched in');
    expect(options[1]).toContain('Aroma blend');
    expect(options[1]).toContain('matched in a blend component: Linalyl Acetate');
    // Said to screen readers too, not only shown.
    const status = page.harness.routeNativeElement!.querySelector(
      'bp-material-picker [role="status"]',
    );
    expect(status?.textContent?.trim()).toBe(
      '2 materials found, 1 of them through a blend component.',
    );

    await picker.selectOption({ text: /Aroma blend/ });
    expect(await picker.getValue()).toBe('Aroma blend');
  });
});

describe('The one material read model', () => {
  beforeEach(() => localStorage.clear());

  it('a material saved in the materials screens shows its saved name in the formula lines, with no second read', async () => {
    const page = await openFormula();
    await saveInMaterialsScreens(page.backend, { ...BICARB, tradeName: 'Bicarb, extra fine' });
    await page.harness.fixture.whenStable();

    const values = await Promise.all(
      (await page.loader.getAllHarnesses(MatAutocompleteHarness)).map((p) => p.getValue()),
    );
    expect(values).toEqual(['Bicarb, extra fine', 'Citric acid']);
    page.backend.expectNone(isMaterialsRead);
  });

  it('a material saved in the materials screens shows its saved name in the lots form, with no second read', async () => {
    const page = await openLotForm(`/lots/new?materialId=${SHEA.id}`);
    await answerMaterialsRead(page.backend, [SHEA]);
    await page.harness.fixture.whenStable();
    const picker = await page.loader.getHarness(MatAutocompleteHarness);
    expect(await picker.getValue()).toBe('Shea butter, refined');

    await saveInMaterialsScreens(page.backend, { ...SHEA, tradeName: 'Shea butter, unrefined' });
    await page.harness.fixture.whenStable();

    expect(await picker.getValue()).toBe('Shea butter, unrefined');
    page.backend.expectNone(isMaterialsRead);
  });

  it('reads the materials of the formula lines and of the lots form through one cache', async () => {
    const page = await openLotForm(`/lots/new?materialId=${BICARB.id}`);
    await answerMaterialsRead(page.backend, [BICARB]);
    await page.harness.fixture.whenStable();

    // The formula editor's read of the same material is answered from the cache.
    const api = TestBed.inject(MaterialsApi);
    const read = await new Promise<Material>((resolve) => api.record(BICARB.id).subscribe(resolve));
    expect(read.tradeName).toBe('Bicarb, fine');
    page.backend.expectNone(isMaterialsRead);
  });
});
