import { MatAutocompleteHarness } from '@angular/material/autocomplete/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatButtonToggleHarness } from '@angular/material/button-toggle/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import type { HttpRequest } from '@angular/common/http';
import { TestBed } from '@angular/core/testing';
import type {
  ComplianceFinding,
  ErrorEnvelope,
  FormulaVersion,
  Material,
  Role,
} from '@batchproof/shared';
import { MaterialsApi } from '../../materials/materials-api';
import {
  aFormula,
  aMaterial,
  aVersion,
  BICARB,
  BLUE_BLEND,
  CITRIC,
  fieldInput,
  flushLabelRuns,
  flushMaterials,
  FORMULA_ID,
  nextRequest,
  openAs,
  type OpenedPage,
  openVersionOn,
  summaryOf,
  textOf,
} from '../formulas-testing';
import FormulaPage from './formula-page';

const ROUTES = [{ path: 'formulas/:id/versions/:n', component: FormulaPage }];
const URL = `/formulas/${FORMULA_ID}/versions/1`;
const DRAFT = aVersion([
  { material: BICARB, grams: 200 },
  { material: CITRIC, grams: 100 },
]);

type Page = OpenedPage;

/** Opens version 1 and answers its reads: formula, version, then its lines' materials. */
const openDraft = (role: Role = 'formulator', version = DRAFT) =>
  openVersionOn(ROUTES, FormulaPage, URL, role, version, [BICARB, CITRIC]);

const isMaterialsRead = (r: HttpRequest<unknown>) =>
  r.method === 'GET' && r.url === '/api/materials' && r.params.has('ids');

const squash = (t: string | null | undefined) => (t ?? '').replace(/\s+/g, ' ').trim();
const text = textOf;

/** A blocking finding as the server's release refusal carries it. */
const ULTRAMARINE_BLOCK: ComplianceFinding = {
  code: 'COLOURANT_NOT_PERMITTED',
  severity: 'block',
  market: 'US',
  subject: 'Ultramarines (CI 77007)',
  message: 'Ultramarines are not permitted in products used in the bath.',
  source: '21 CFR 73.2725',
  status: 'C',
  lines: [2],
};

/** The draft as the server stores it after the check that blocked its release. */
const BLOCKED_CHECK = { ...DRAFT, counts: { block: 1, warn: 0, info: 0 } };

/** After a refusal the page reads the version again: the server stored its fresh check. */
async function flushStoredCheck(page: Page, stored: FormulaVersion) {
  (
    await nextRequest(page.backend, (r) => r.url === `/api/formulas/${FORMULA_ID}/versions/1`)
  ).flush(stored);
  await page.harness.fixture.whenStable();
}

/** Clicks Release and answers with a 409 carrying `error`, then answers the version's re-read. */
async function refuseRelease(
  page: Page,
  error: ErrorEnvelope['error'],
  stored: FormulaVersion = BLOCKED_CHECK,
) {
  const clicked = (await releaseButton(page)).click();
  const refused = await nextRequest(page.backend, (r) => r.url.endsWith('/versions/1/release'));
  refused.flush({ error }, { status: 409, statusText: 'Conflict' });
  await clicked;
  await flushStoredCheck(page, stored);
  return refused;
}

const overrideButtons = (page: Page) =>
  page.loader.getAllHarnesses(MatButtonHarness.with({ text: /recorded reason/ }));

function releaseButton(page: Page) {
  return page.loader.getHarness(MatButtonHarness.with({ text: /^\S*\s*Release$/ }));
}

const field = fieldInput;

describe('FormulaPage', () => {
  beforeEach(() => localStorage.clear());

  it('updates totals and percentages as grams are typed, and converts to percent entry and back', async () => {
    const page = await openDraft();
    expect(text(page, '[data-testid="total-grams"]')).toBe('300 g');
    expect(text(page, '[data-testid="line-percent-0"]')).toBe('66.67 %');

    await (await field(page, 'Grams, line 2')).setValue('200');
    expect(text(page, '[data-testid="total-grams"]')).toBe('400 g');
    expect(text(page, '[data-testid="line-percent-0"]')).toBe('50.00 %');

    await (await page.loader.getHarness(MatButtonToggleHarness.with({ text: 'Percent' }))).check();
    expect(await (await field(page, 'Batch total')).getValue()).toBe('400');
    expect(await (await field(page, 'Percent, line 1')).getValue()).toBe('50');
    expect(await (await field(page, 'Percent, line 2')).getValue()).toBe('50');

    // A bigger batch keeps the percentages and gives each line its new grams.
    await (await field(page, 'Batch total')).setValue('1000');
    expect(text(page, '[data-testid="line-grams-0"]')).toBe('500 g');
    expect(text(page, '[data-testid="total-percent"]')).toBe('100.00 %');

    await (await page.loader.getHarness(MatButtonToggleHarness.with({ text: 'Grams' }))).check();
    expect(await (await field(page, 'Grams, line 1')).getValue()).toBe('500');
    expect(text(page, '[data-testid="total-grams"]')).toBe('1,000 g');
  });

  it('says how far percent lines are from 100 % while they are typed', async () => {
    const page = await openDraft();
    await (await page.loader.getHarness(MatButtonToggleHarness.with({ text: 'Percent' }))).check();
    await (await field(page, 'Percent, line 2')).setValue('20');
    expect(text(page, '.totals')).toContain('13.333 % still to place');
  });

  it('saves lines entered by percent as percent lines with the batch total', async () => {
    const page = await openDraft();
    await (await page.loader.getHarness(MatButtonToggleHarness.with({ text: 'Percent' }))).check();
    await (await field(page, 'Batch total')).setValue('600');
    const saved = (
      await page.loader.getHarness(MatButtonHarness.with({ text: /Save draft/ }))
    ).click();
    const put = await nextRequest(page.backend, (r) => r.method === 'PUT');
    expect(put.request.body.lines).toBeUndefined();
    expect(put.request.body.byPercent.batchGrams).toBe(600);
    expect(put.request.body.byPercent.lines).toEqual([
      { materialId: BICARB.id, percent: 66.6667 },
      { materialId: CITRIC.id, percent: 33.3333 },
    ]);
    put.flush(DRAFT);
    await saved;
  });

  it('moves and removes lines with labelled buttons, keeping the focus on the moved line', async () => {
    const page = await openDraft();
    await (
      await page.loader.getHarness(
        MatButtonHarness.with({ selector: '[aria-label="Move line 2 up"]' }),
      )
    ).click();
    const materials = () =>
      Array.from(page.el.querySelectorAll<HTMLInputElement>('bp-material-picker input')).map(
        (i) => i.value,
      );
    expect(materials()).toEqual(['Citric acid', 'Bicarb, fine']);
    // Line 1 cannot move further up, so the focus stays on it by its other move button.
    expect(document.activeElement?.getAttribute('aria-label')).toBe('Move line 1 down');

    await (
      await page.loader.getHarness(
        MatButtonHarness.with({ selector: '[aria-label="Remove line 1"]' }),
      )
    ).click();
    expect(materials()).toEqual(['Bicarb, fine']);
    expect(text(page, '[data-testid="total-grams"]')).toBe('200 g');
  });

  it('shows a live US block when a blend with ultramarines (CI 77007) is added to a bath product', async () => {
    const page = await openDraft();
    const us = () => text(page, '[aria-label="US · United States findings"]');
    expect(us()).not.toContain('Blocks');

    await (await page.loader.getHarness(MatButtonHarness.with({ text: /Add line/ }))).click();
    const picker = (await page.loader.getAllHarnesses(MatAutocompleteHarness))[2]!;
    // A harness waits for the page to settle after acting, which a pending read prevents: each
    // read is answered while the typing or the click is still pending.
    const typing = picker.enterText('lagoon');
    const search = await nextRequest(
      page.backend,
      (r) => r.url === '/api/materials' && r.method === 'GET' && r.params.get('q') === 'lagoon',
    );
    search.flush({ items: [summaryOf(BLUE_BLEND)], total: 1, page: 1, pageSize: 10 });
    await typing;

    const [option] = await picker.getOptions({ text: /Lagoon blue mica/ });
    const picking = option!.click();
    await flushMaterials(page, [BLUE_BLEND]);
    await picking;
    await (await field(page, 'Grams, line 3')).setValue('1');

    expect(us()).toContain('Blocks');
    expect(us()).toContain('Ultramarines');
    expect(us()).toContain('21 CFR 73.2725');
    expect(text(page, 'bp-live-checks h3')).toMatch(/Blocks\s*1/);
  });

  it('when a line’s material is saved in the materials screens, checks the draft against the saved record', async () => {
    const mica = aMaterial('1b7f0c52-5a43-4d7e-8a51-6f0d2f4a0004', {
      tradeName: 'Harbour mica',
      inci: 'Mica',
      category: 'colourant',
      components: [{ inci: 'Mica', percent: 100, colourIndex: 'CI 77019' }],
    });
    const draft = aVersion([
      { material: BICARB, grams: 200 },
      { material: mica, grams: 1 },
    ]);
    const page = await openAs('formulator', ROUTES, URL, FormulaPage);
    page.backend.expectOne(`/api/formulas/${FORMULA_ID}`).flush(aFormula([draft]));
    page.backend.expectOne(`/api/formulas/${FORMULA_ID}/versions/1`).flush(draft);
    await flushMaterials(page, [BICARB, mica]);
    await flushLabelRuns(page);
    await page.harness.fixture.whenStable();
    const us = () => text(page, '[aria-label="US · United States findings"]');
    expect(us()).not.toContain('Ultramarines');

    // The supplier's corrected certificate: the mica also holds ultramarines (CI 77007).
    const corrected: Material = {
      ...mica,
      components: [
        { inci: 'Mica', percent: 85, colourIndex: 'CI 77019' },
        { inci: 'Ultramarines', percent: 15, colourIndex: 'CI 77007' },
      ],
    };
    const saving = TestBed.inject(MaterialsApi)
      .update(mica.id, { ...corrected, supplierId: null })
      .subscribe();
    page.backend
      .expectOne((r) => r.method === 'PUT' && r.url === `/api/materials/${mica.id}`)
      .flush(corrected);
    saving.unsubscribe();
    await page.harness.fixture.whenStable();

    // The saved record replaces the editor's copy: no second read, and the live check follows it.
    page.backend.expectNone(isMaterialsRead);
    page.backend.expectNone((r) => r.method === 'GET' && r.url === `/api/materials/${mica.id}`);
    expect(us()).toContain('Ultramarines');
    expect(us()).toContain('21 CFR 73.2725');
  });

  it('offers “Sold as soap” only for a soap, with what it means in the US', async () => {
    const page = await openDraft();
    expect(page.el.textContent).not.toContain('Sold as soap');

    const type = await page.loader.getHarness(
      MatSelectHarness.with({ selector: 'bp-profile-fields mat-select' }),
    );
    await type.clickOptions({ text: 'Soap' });
    await page.harness.fixture.whenStable();
    const box = page.el.querySelector('bp-profile-fields .sold-as-soap');
    expect(box?.textContent).toContain('Sold as soap');
    // 21 CFR 701.20
    expect(text(page, '#sold-as-soap-hint')).toBe(
      'Labelled and sold only as soap: in the US such a soap is not a cosmetic (21 CFR 701.20)',
    );
  });

  it('on a 400 puts the server messages beside their fields and keeps everything typed', async () => {
    const page = await openDraft();
    await (await field(page, 'Grams, line 2')).setValue('120');
    const saved = (
      await page.loader.getHarness(MatButtonHarness.with({ text: /Save draft/ }))
    ).click();
    const put = await nextRequest(page.backend, (r) => r.method === 'PUT');
    expect(put.request.body.lines).toEqual([
      { materialId: BICARB.id, grams: 200 },
      { materialId: CITRIC.id, grams: 120 },
    ]);
    put.flush(
      {
        error: {
          code: 'validation_failed',
          message: 'Some lines name an unknown material.',
          fieldErrors: { 'lines.1.materialId': ['Choose one of this workshop’s materials'] },
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await saved;
    await page.harness.fixture.whenStable();

    const material = await page.loader.getHarness(
      MatFormFieldHarness.with({ floatingLabelText: 'Material, line 2' }),
    );
    expect(await material.getTextErrors()).toEqual(['Choose one of this workshop’s materials']);
    expect(await (await field(page, 'Grams, line 2')).getValue()).toBe('120');
    expect(text(page, '.bp-form-error')).toContain('Some lines name an unknown material.');
  });

  it('on a refused release, offers the owner an override with a recorded reason', async () => {
    const page = await openDraft('owner', { ...DRAFT, counts: { block: 1, warn: 0, info: 0 } });
    const refused = await refuseRelease(page, {
      code: 'release_blocked',
      message: 'Version 1 has 1 blocking finding(s). Resolve them, or the owner may override.',
      findings: [ULTRAMARINE_BLOCK],
    });
    expect(refused.request.body).toEqual({});
    expect(text(page, '.refusal')).toContain('Not released.');

    await (
      await page.loader.getHarness(MatButtonHarness.with({ text: /recorded reason/ }))
    ).click();
    // The dialog lists the findings the refusal carried, not the draft's older stored check.
    expect(squash(document.querySelector('bp-release-dialog .blocks')?.textContent)).toContain(
      'US · Ultramarines (CI 77007)',
    );
    const reason = await page.root.getHarness(
      MatInputHarness.with({ selector: 'bp-release-dialog textarea' }),
    );
    await reason.setValue('Assessor confirmed the EU-only listing on 2 Dec.');
    const confirmed = (
      await page.root.getHarness(MatButtonHarness.with({ text: 'Release with this reason' }))
    ).click();

    const override = await nextRequest(page.backend, (r) => r.url.endsWith('/versions/1/release'));
    expect(override.request.body).toEqual({
      override: { reason: 'Assessor confirmed the EU-only listing on 2 Dec.' },
    });
    override.flush({
      ...DRAFT,
      state: 'released',
      releasedAt: '2026-12-02T10:00:00.000Z',
      overrideReason: 'Assessor confirmed the EU-only listing on 2 Dec.',
    });
    (await nextRequest(page.backend, (r) => r.url === `/api/formulas/${FORMULA_ID}`)).flush(
      aFormula([{ ...DRAFT, state: 'released' }]),
    );
    await confirmed;
    await page.harness.fixture.whenStable();
    expect(text(page, '[data-testid="version-state"]')).toContain('released');
    expect(text(page, '.released-note')).toContain('Reason recorded');
  });

  it('on a refused release, tells a formulator only the owner may override, with no override button', async () => {
    const page = await openDraft('formulator');
    await refuseRelease(page, {
      code: 'release_blocked',
      message: 'Version 1 has 1 blocking finding(s).',
      findings: [ULTRAMARINE_BLOCK],
    });

    expect(text(page, '.refusal')).toContain("Only the workshop's owner may release");
    expect(await overrideButtons(page)).toHaveLength(0);
  });

  it('reads a refusal from its error code: a 409 conflict naming blocking findings offers no override', async () => {
    const page = await openDraft('owner', { ...DRAFT, counts: { block: 1, warn: 0, info: 0 } });
    await refuseRelease(
      page,
      {
        code: 'conflict',
        message: 'Version 1 cannot be checked yet: Line 1 weighs 0 g',
      },
      { ...DRAFT, evaluation: null, counts: null, evaluationProblems: ['Line 1 weighs 0 g'] },
    );

    expect(text(page, '.refusal')).toContain('cannot be checked yet');
    expect(await overrideButtons(page)).toHaveLength(0);
  });

  it('shows a released version read-only to its writers, with a new draft action instead', async () => {
    const page = await openDraft('owner', {
      ...DRAFT,
      state: 'released',
      releasedAt: '2026-11-02T10:00:00.000Z',
    });
    expect(await (await field(page, 'Grams, line 1')).isDisabled()).toBe(true);
    const labels = await Promise.all(
      (await page.loader.getAllHarnesses(MatButtonHarness)).map((b) => b.getText()),
    );
    expect(labels.join('|')).toContain('New draft from this version');
    expect(labels.join('|')).not.toContain('Save draft');
  });

  it('gives production and viewers no write actions on a draft', async () => {
    const page = await openDraft('production');
    expect(await (await field(page, 'Grams, line 1')).isDisabled()).toBe(true);
    const labels = await Promise.all(
      (await page.loader.getAllHarnesses(MatButtonHarness)).map((b) => b.getText()),
    );
    expect(labels.join('|')).not.toMatch(/Save draft|Release|New draft|Add line/);
    expect(labels.join('|')).toContain('Scale version 1');
  });
});
