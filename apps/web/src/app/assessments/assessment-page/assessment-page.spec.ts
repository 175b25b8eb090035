import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HttpRequest } from '@angular/common/http';
import type { HttpTestingController } from '@angular/common/http/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { RouterTestingHarness } from '@angular/router/testing';
import {
  type AssessmentDetail,
  type AssessmentUpdate,
  exposureDefaultsFor,
  PART_A_HEADINGS,
  PART_B_HEADINGS,
  type Role,
} from '@batchproof/shared';
import { signedInAs } from '../../auth/signed-in-as';
import { unsavedChangesGuard } from '../../forms/unsaved-changes';
import { chooseOnLeaving, Elsewhere, leave } from '../../forms/unsaved-changes-testing';
import { ASSESSMENT_ID, aPacket, anAssessment, HASH } from '../assessments-testing';
import AssessmentPage, { PACKET_CHANGED_NOTICE } from './assessment-page';

const URL = `/api/assessments/${ASSESSMENT_ID}`;

const sent = (backend: HttpTestingController, match: (r: HttpRequest<unknown>) => boolean) =>
  vi.waitFor(() => backend.expectOne(match));

async function open(role: Role, detail: AssessmentDetail) {
  const backend = await signedInAs(role, [
    { path: 'assessments', children: [] },
    { path: 'assessments/:id', component: AssessmentPage, canDeactivate: [unsavedChangesGuard] },
    { path: 'elsewhere', component: Elsewhere },
  ]);
  const harness = await RouterTestingHarness.create();
  await harness.navigateByUrl(`/assessments/${ASSESSMENT_ID}`);
  (await sent(backend, (r) => r.url === URL && r.method === 'GET')).flush(detail);
  await harness.fixture.whenStable();
  const loader = TestbedHarnessEnvironment.loader(harness.fixture);
  const field = (label: string | RegExp) =>
    loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }));
  return {
    backend,
    harness,
    loader,
    field,
    type: async (label: string | RegExp, value: string) =>
      (await (await field(label)).getControl(MatInputHarness))!.setValue(value),
    el: () => harness.routeNativeElement as HTMLElement,
    buttons: async () =>
      Promise.all((await loader.getAllHarnesses(MatButtonHarness)).map((b) => b.getText())),
  };
}

/** Opens the Sign dialog, confirms and signs; the page's click and the sign request it sent. */
async function signConfirmed(page: Awaited<ReturnType<typeof open>>) {
  const signing = (await page.loader.getHarness(MatButtonHarness.with({ text: /Sign…/ }))).click();
  const root = TestbedHarnessEnvironment.documentRootLoader(page.harness.fixture);
  const dialog = await vi.waitFor(() => root.getHarness(MatDialogHarness));
  await (await dialog.getHarness(MatCheckboxHarness)).check();
  await (await dialog.getHarness(MatButtonHarness.with({ text: /^verified\s*Sign$/ }))).click();
  return { signing, post: await sent(page.backend, (r) => r.url === `${URL}/sign`) };
}

/** The lotion with own exposure values and points of departure: linalool's margin is under 100. */
function aFilledIn(overrides: Partial<AssessmentDetail> = {}): AssessmentDetail {
  return anAssessment({
    exposure: {
      presetKey: null,
      dailyAmountGrams: 7.82,
      retentionFactor: 1,
      bodyWeightKg: 60,
      source: 'Our own in-use study',
    },
    substances: [
      {
        substanceKey: 'glycerin',
        pointOfDepartureMgPerKgDay: 1000,
        pointOfDepartureSource: 'Registration dossier',
        dermalAbsorptionPercent: null,
        dermalAbsorptionSource: '',
      },
      {
        substanceKey: 'linalool',
        pointOfDepartureMgPerKgDay: 50,
        pointOfDepartureSource: 'SCCS opinion',
        dermalAbsorptionPercent: null,
        dermalAbsorptionSource: '',
      },
    ],
    partB: {
      conclusion: 'Safe as labelled.',
      labelWarnings: 'Avoid contact with eyes.',
      reasoning: 'Margins discussed.',
      credentials: 'Wren Ashby, MSc Toxicology',
    },
    ...overrides,
  });
}

describe('AssessmentPage', { timeout: 30_000 }, () => {
  afterEach(() => vi.restoreAllMocks());

  it('lays the packet out under the ten Part A and four Part B headings, read-only for a viewer', async () => {
    const page = await open('viewer', anAssessment({ canEdit: false }));
    const headings = [...page.el().querySelectorAll('h3')].map((h) => h.textContent?.trim());
    PART_A_HEADINGS.forEach((heading, i) => expect(headings).toContain(`${i + 1}. ${heading}`));
    PART_B_HEADINGS.forEach((heading, i) => expect(headings).toContain(`${i + 1}. ${heading}`));
    const text = page.el().textContent ?? '';
    // Composition with the fragrance's supplier and certificate.
    const composition = page.el().querySelector('table[aria-label=Composition]')!;
    expect(composition.textContent).toContain('56-81-5');
    expect(composition.textContent).toContain('200-289-5');
    expect(composition.querySelector('.fragrance')?.textContent?.trim()).toBe(
      'Fragrance from Lindenfield Aromas (LA-221) · certificate: IFRA certificate 51st amendment, issued Jan 10, 2026',
    );
    // The maker's notes, a blank one said plainly, the attention lines, complaints and item 10.
    expect(text).toContain('White emulsion, pH 5.5');
    expect(text).toContain('Not given by the maker.');
    expect(text).toContain('Exposure to the product is not chosen yet');
    expect(text).toContain('Itchy forearms after use');
    expect(text).toContain('Ingredients: Aqua, Glycerin, Parfum, Linalool.');
    expect(text).toContain('Avoid contact with eyes.');
    // The market's allergens in the formula's own allergen table, with the threshold used.
    const allergens = page.el().querySelector('table[aria-label="Fragrance allergens, EU"]')!;
    expect(allergens.querySelector('thead')?.textContent).toContain('EU');
    const linalool = allergens.querySelector('tbody tr')!.textContent!.replace(/\s+/g, ' ');
    expect(linalool).toContain('Linalool');
    expect(linalool).toContain('Named');
    expect(linalool).toContain('over 0.001 %');
    expect(text).toContain('Safety data sheet');
    expect(text).toContain('261101-EBL-1');
    expect(text).toContain('Smooth onto clean skin.');
    expect(text).toContain('Hollowmere Bathworks, 1 Mill Lane');
    expect(text).toContain('Version 2 has no signed safety assessment.');
    expect(text).toContain('the qualified safety assessor judges and signs');
    // Nothing to type into, and only the PDF to act on.
    expect(page.el().querySelectorAll('input, textarea, mat-select').length).toBe(0);
    expect(await page.buttons()).toEqual(['picture_as_pdf Packet PDF']);
    expect(text).toContain('Draft by Wren Ashby. Only they edit and sign it.');
  });

  it('shows the saved margins with the one under 100 flagged in words, and defaults marked', async () => {
    const detail = aFilledIn({ canEdit: false });
    const packet = aPacket({
      exposure: {
        input: detail.exposure!,
        exposureMgPerKgDay: 130.333,
        presetLabel: null,
        source: 'Our own in-use study',
        defaulted: false,
      },
      margins: [
        {
          ...aPacket().margins[0]!,
          pointOfDepartureMgPerKgDay: 1000,
          sedMgPerKgDay: 6.517,
          marginOfSafety: 153.4,
        },
        {
          ...aPacket().margins[1]!,
          pointOfDepartureMgPerKgDay: 50,
          sedMgPerKgDay: 1.173,
          marginOfSafety: 42.63,
          flagged: true,
        },
      ],
    });
    const page = await open('owner', { ...detail, packet });
    expect(page.el().querySelector('[data-testid=mos-0]')?.textContent?.trim()).toBe('153');
    expect(page.el().querySelector('[data-testid=mos-1]')?.textContent).toContain(
      '43 · below 100, review',
    );
    expect(page.el().textContent).toContain('One margin of safety is below 100');
    expect(page.el().querySelectorAll('.default-tag').length).toBe(2);
    expect(page.el().querySelector('[data-testid=exposure-a]')?.textContent).toContain('130.333');
  });

  it('lets the assessor enter own exposure values and points of departure, working out A and MoS as typed', async () => {
    const page = await open('assessor', anAssessment());
    const exposure = await (
      await page.field('Exposure to the product')
    ).getControl(MatSelectHarness);
    await exposure!.open();
    // The defaults for a lotion come first, in their own group.
    const groups = await exposure!.getOptionGroups();
    expect(await Promise.all(groups.map((g) => g.getLabelText()))).toEqual([
      'For this product type',
      'Other product types',
    ]);
    await exposure!.clickOptions({ text: 'My own values' });
    await page.type('Daily amount', '7.82');
    await page.type('Retention factor', '1');
    await page.type('Source of these values', 'Our own in-use study');
    await page.type('Point of departure, Glycerin', '1000');
    await page.type('Point of departure, Linalool', '50');
    await page.harness.fixture.whenStable();
    // SCCS Notes of Guidance: A = 7.82 g × 1 × 1000 / 60 kg = 130.33 mg/kg bw/day;
    // linalool SED = 130.33 × 0.9/100 × 100/100 = 1.173, MoS = 50 / 1.173 = 42.6 (< 100).
    expect(page.el().querySelector('[data-testid=exposure-a]')?.textContent).toContain('130.333');
    expect(page.el().querySelector('[data-testid=mos-0]')?.textContent?.trim()).toBe('153');
    expect(page.el().querySelector('[data-testid=mos-1]')?.textContent).toContain(
      '43 · below 100, review',
    );

    await page.type('Assessment conclusion', 'Safe as labelled.');
    const saving = (
      await page.loader.getHarness(MatButtonHarness.with({ text: /^save\s*Save$/ }))
    ).click();
    const put = await sent(page.backend, (r) => r.url === URL && r.method === 'PUT');
    expect(put.request.body).toEqual({
      exposure: {
        presetKey: null,
        dailyAmountGrams: 7.82,
        retentionFactor: 1,
        bodyWeightKg: 60,
        source: 'Our own in-use study',
      },
      substances: [
        {
          substanceKey: 'glycerin',
          pointOfDepartureMgPerKgDay: 1000,
          pointOfDepartureSource: '',
          dermalAbsorptionPercent: null,
          dermalAbsorptionSource: '',
        },
        {
          substanceKey: 'linalool',
          pointOfDepartureMgPerKgDay: 50,
          pointOfDepartureSource: '',
          dermalAbsorptionPercent: null,
          dermalAbsorptionSource: '',
        },
      ],
      partB: { conclusion: 'Safe as labelled.', labelWarnings: '', reasoning: '', credentials: '' },
    });
    // The API refuses a value: its message shows beside that substance's field.
    put.flush(
      {
        error: {
          code: 'validation_failed',
          message: 'Check the highlighted fields.',
          fieldErrors: {
            'substances.1.pointOfDepartureMgPerKgDay': ['Point of departure cannot exceed 1000000'],
            'partB.credentials': ['Credentials are too long'],
          },
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await saving;
    await page.harness.fixture.whenStable();
    expect(await (await page.field('Point of departure, Linalool')).getTextErrors()).toEqual([
      'Point of departure cannot exceed 1000000',
    ]);
    expect(await (await page.field('Point of departure, Glycerin')).getTextErrors()).toEqual([]);
    expect(
      await (await page.field("Assessor's credentials and approval of part B")).getTextErrors(),
    ).toEqual(['Credentials are too long']);
    expect(page.el().querySelector('[role=alert]')?.textContent).toContain(
      'Check the highlighted fields.',
    );
  });

  it('takes a shipped default for the product type as published, with its source', async () => {
    const preset = exposureDefaultsFor('lotion')[0]!;
    const page = await open('assessor', anAssessment());
    const exposure = await (
      await page.field('Exposure to the product')
    ).getControl(MatSelectHarness);
    await exposure!.open();
    await exposure!.clickOptions({ text: preset.label });
    expect(page.el().querySelector('[data-testid=preset]')?.textContent).toContain(preset.source);
    expect(page.el().querySelector('[data-testid=exposure-a]')?.textContent).toContain(
      `A = ${preset.exposureMgPerKgDay}`,
    );
    const saving = (
      await page.loader.getHarness(MatButtonHarness.with({ text: /^save\s*Save$/ }))
    ).click();
    const put = await sent(page.backend, (r) => r.url === URL && r.method === 'PUT');
    expect((put.request.body as AssessmentUpdate).exposure).toEqual({
      presetKey: preset.key,
      dailyAmountGrams: preset.dailyAmountGrams,
      retentionFactor: preset.retentionFactor,
      bodyWeightKg: 60,
      source: preset.source,
    });
    put.flush(anAssessment());
    await saving;
  });

  it('refuses in the browser own values without a source, beside the field, sending nothing', async () => {
    const page = await open('assessor', anAssessment());
    const exposure = await (
      await page.field('Exposure to the product')
    ).getControl(MatSelectHarness);
    await exposure!.open();
    await exposure!.clickOptions({ text: 'My own values' });
    await page.type('Daily amount', '7.82');
    await page.type('Retention factor', '1');
    await (await page.loader.getHarness(MatButtonHarness.with({ text: /^save\s*Save$/ }))).click();
    expect(await (await page.field('Source of these values')).getTextErrors()).toEqual([
      'Say where your own exposure values come from',
    ]);
    page.backend.expectNone((r) => r.method === 'PUT');
  });

  it('signs over the packet hash the assessor read, then locks everything', async () => {
    const detail = aFilledIn();
    const page = await open('assessor', detail);
    const signing = (
      await page.loader.getHarness(MatButtonHarness.with({ text: /Sign…/ }))
    ).click();
    const root = TestbedHarnessEnvironment.documentRootLoader(page.harness.fixture);
    const dialog = await vi.waitFor(() => root.getHarness(MatDialogHarness));
    expect(await dialog.getTitleText()).toBe('Sign the safety assessment?');
    const content = await dialog.getContentText();
    expect(content).toContain(HASH);
    expect(content).toContain('Ada Marsh');
    expect(content).toContain('Everyday Body Lotion, version 2');
    const sign = await dialog.getHarness(MatButtonHarness.with({ text: /^verified\s*Sign$/ }));
    expect(await sign.isDisabled()).toBe(true);
    await (await dialog.getHarness(MatCheckboxHarness)).check();
    await sign.click();
    const post = await sent(page.backend, (r) => r.url === `${URL}/sign`);
    expect(post.request.body).toEqual({ contentHash: HASH, confirm: true });
    post.flush({
      ...detail,
      status: 'signed',
      canEdit: false,
      packet: aPacket({
        assessment: {
          ...aPacket().assessment,
          status: 'signed',
          signedAt: '2026-12-03T09:15:00.000Z',
          signedByName: 'Wren Ashby',
          contentHash: HASH,
        },
      }),
    });
    await signing;
    await page.harness.fixture.whenStable();
    const note = page.el().querySelector('[data-testid=signed-note]')?.textContent ?? '';
    expect(note).toContain('Signed by Wren Ashby on');
    expect(note).toContain(`hash ${HASH}`);
    expect(page.el().querySelectorAll('input, textarea, mat-select').length).toBe(0);
    expect(await page.buttons()).toEqual(['picture_as_pdf Packet PDF']);
  });

  it('says the packet changed and reloads it when signing is refused with packet_changed', async () => {
    const page = await open('assessor', aFilledIn());
    const { signing, post } = await signConfirmed(page);
    post.flush(
      { error: { code: 'packet_changed', message: 'The packet has changed since it was read.' } },
      { status: 409, statusText: 'Conflict' },
    );
    await signing;
    const reload = await sent(page.backend, (r) => r.url === URL && r.method === 'GET');
    reload.flush(aFilledIn({ contentHash: 'cd'.repeat(32) }));
    await page.harness.fixture.whenStable();
    expect(page.el().querySelector('[data-testid=notice]')?.textContent).toContain(
      PACKET_CHANGED_NOTICE,
    );
    expect(page.el().querySelector('[data-testid=signed-note]')).toBeNull();
  });

  it('asks before leaving with unsaved changes and stays when asked, saving nothing', async () => {
    const page = await open('assessor', anAssessment());
    await page.type('Assessment conclusion', 'Safe as labelled.');
    const leaving = leave();
    await chooseOnLeaving(
      TestbedHarnessEnvironment.documentRootLoader(page.harness.fixture),
      /Stay on this page/,
    );
    expect(await leaving).toBe(false);
    page.backend.expectNone((r) => r.method === 'PUT');
  });

  it("puts a refused signature's reasons beside the exposure picker and the conclusion", async () => {
    const page = await open('assessor', anAssessment());
    const { signing, post } = await signConfirmed(page);
    post.flush(
      {
        error: {
          code: 'validation_failed',
          message: 'Some fields need attention.',
          fieldErrors: {
            exposure: ['Enter the exposure to the product before signing'],
            'partB.conclusion': ['Write the assessment conclusion before signing'],
          },
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await signing;
    await page.harness.fixture.whenStable();
    expect(await (await page.field('Exposure to the product')).getTextErrors()).toEqual([
      'Enter the exposure to the product before signing',
    ]);
    expect(await (await page.field('Assessment conclusion')).getTextErrors()).toEqual([
      'Write the assessment conclusion before signing',
    ]);
    expect(page.el().querySelector('[data-testid=signed-note]')).toBeNull();
  });
});
