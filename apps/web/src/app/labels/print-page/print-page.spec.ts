import { MatButtonHarness } from '@angular/material/button/testing';
import { MatRadioButtonHarness } from '@angular/material/radio/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import type { HttpRequest } from '@angular/common/http';
import type { ErrorEnvelope, LabelRunCreate, Role } from '@batchproof/shared';
import {
  aFormula,
  aVersion,
  FORMULA_ID,
  nextRequest,
  openAs,
  type OpenedPage,
} from '../../formulas/formulas-testing';
import { aRun, LETTER_30, ROLL_2X1, RUN_ID } from '../labels-testing';
import PrintPage from './print-page';

const RELEASED = aVersion([], { state: 'released', releasedAt: '2026-11-02T10:00:00.000Z' });
const ROUTES = [
  { path: 'labels/print', component: PrintPage },
  { path: 'formulas/:id/identity', children: [] },
  { path: 'workshop', children: [] },
];

const squash = (t: string | null | undefined) => (t ?? '').replace(/\s+/g, ' ').trim();
const isCreate = (r: HttpRequest<unknown>) => r.method === 'POST' && r.url === '/api/label-runs';

/** Opens the print page for version 1 and answers its reads: formula, version, stocks. */
async function openPrint(role: Role = 'formulator', version = RELEASED) {
  const page = await openAs(
    role,
    ROUTES,
    `/labels/print?formula=${FORMULA_ID}&version=1`,
    PrintPage,
  );
  page.backend.expectOne(`/api/formulas/${FORMULA_ID}`).flush(aFormula([version]));
  page.backend.expectOne(`/api/formulas/${FORMULA_ID}/versions/1`).flush(version);
  (await nextRequest(page.backend, (r) => r.url === '/api/label-stocks')).flush({
    items: [LETTER_30, ROLL_2X1],
  });
  await page.harness.fixture.whenStable();
  return page;
}

async function typeInto(page: OpenedPage, id: string, value: string) {
  const input = await page.loader.getHarness(MatInputHarness.with({ selector: `#${id}` }));
  await input.setValue(value);
}

async function clickButton(page: OpenedPage, text: string | RegExp) {
  const button = await page.loader.getHarness(MatButtonHarness.with({ text }));
  await button.click();
}

/** Sends the form and answers the create with a refusal of `status`. */
async function refuse(page: OpenedPage, status: number, error: ErrorEnvelope['error']) {
  await clickButton(page, /Make the labels PDF/);
  const req = await nextRequest(page.backend, isCreate);
  req.flush({ error }, { status, statusText: status === 409 ? 'Conflict' : 'Unprocessable' });
  await page.harness.fixture.whenStable();
  return req;
}

const INCOMPLETE: ErrorEnvelope['error'] = {
  code: 'label_incomplete',
  message: 'The labels lack required elements.',
  missing: [
    {
      market: 'US',
      field: 'workshop.address',
      item: "The business's name and address",
      source: '21 CFR 701.12',
    },
    {
      market: 'EU',
      field: 'identity.euResponsiblePerson.address',
      item: "The EU responsible person's postal address",
      source: 'Regulation (EC) No 1223/2009, Art. 4 and Art. 19(1)(a)',
    },
    {
      market: 'EU',
      field: 'lotCode',
      item: 'A lot code',
      source: 'Regulation (EC) No 1223/2009, Art. 19(1)(e)',
    },
  ],
};

describe('PrintPage', () => {
  let created = 0;
  beforeEach(() => {
    localStorage.clear();
    created = 0;
    // jsdom has no object URLs; the preview only needs one to point the frame at.
    URL.createObjectURL = vi.fn(() => `blob:http://localhost/pdf-${++created}`);
    URL.revokeObjectURL = vi.fn();
  });

  it("sends the version's markets, the stock, the start position clicked on the sheet, the lot code and the copies", async () => {
    const page = await openPrint();
    // 30-up sheet: position 7 is the first label of row 3.
    const seventh = page.el.querySelector<HTMLButtonElement>('[data-position="7"]')!;
    expect(seventh.getAttribute('aria-label')).toBe('Position 7, row 3, column 1');
    seventh.click();
    await page.harness.fixture.whenStable();
    const used = page.el.querySelectorAll('.position.used');
    expect(used.length).toBe(6);
    expect(page.el.querySelector('[data-position="3"]')!.getAttribute('aria-label')).toContain(
      'used',
    );
    await typeInto(page, 'lotCode', 'LF-0412');
    await typeInto(page, 'copies', '12');

    await clickButton(page, /Make the labels PDF/);
    const req = await nextRequest(page.backend, isCreate);
    const body = req.request.body as LabelRunCreate;
    expect(body).toEqual({
      formulaId: FORMULA_ID,
      version: 1,
      markets: ['US', 'EU'],
      stockId: LETTER_30.id,
      startPosition: 7,
      copies: 12,
      lotCode: 'LF-0412',
      layout: 'single',
      placement: {},
      barcode: 'gs1-datamatrix',
      outerPackConfirmed: false,
    });
    expect(req.request.headers.has('Idempotency-Key')).toBe(true);
  });

  it('warns that the version has no signed safety assessment, naming the one that was, with the safety caution', async () => {
    const unassessed = {
      ...RELEASED,
      assessmentFindings: [
        {
          code: 'SAFETY_ASSESSMENT_MISSING' as const,
          severity: 'warn' as const,
          market: 'EU' as const,
          subject: 'Version 1',
          message:
            'Version 1 has no signed safety assessment; version 2 was assessed. A qualified safety assessor must assess and sign this version before it is sold in the EU.',
          source: 'Regulation (EC) No 1223/2009, Art. 10 and Annex I',
          status: 'C' as const,
          lines: [],
        },
      ],
    };
    const page = await openPrint('formulator', unassessed);
    const section = page.el.querySelector('bp-assessment-findings');
    expect(squash(section?.textContent)).toContain('version 2 was assessed');
    expect(squash(section?.querySelector('[role="note"]')?.textContent)).toContain(
      'Do not sell this version in these markets until its assessment is signed',
    );
    // Printing stays open: the warning informs, it does not block.
    expect(page.el.querySelector('form.print')).not.toBeNull();
  });

  it('shows no assessment warning for a version whose assessment is signed', async () => {
    const page = await openPrint('formulator', { ...RELEASED, assessmentFindings: [] });
    expect(squash(page.el.querySelector('bp-assessment-findings')?.textContent)).toBe('');
  });

  it('moves the start position with the arrow keys', async () => {
    const page = await openPrint();
    const first = page.el.querySelector<HTMLButtonElement>('[data-position="1"]')!;
    expect(first.tabIndex).toBe(0);
    first.dispatchEvent(new KeyboardEvent('keydown', { key: 'ArrowDown', bubbles: true }));
    await page.harness.fixture.whenStable();
    first.dispatchEvent(new KeyboardEvent('keydown', { key: 'ArrowRight', bubbles: true }));
    await page.harness.fixture.whenStable();
    const start = page.el.querySelector('.position[aria-checked="true"]')!;
    expect(start.getAttribute('data-position')).toBe('5');
    expect((start as HTMLElement).tabIndex).toBe(0);
    expect(page.el.querySelectorAll('.position.used').length).toBe(4);
  });

  it('refuses to send without a market, saying so beside the markets', async () => {
    const page = await openPrint();
    for (const name of ['US · United States', 'EU · European Union']) {
      const box = Array.from(page.el.querySelectorAll('mat-checkbox')).find((c) =>
        squash(c.textContent).includes(name),
      )!;
      box.querySelector('input')!.click();
    }
    await page.harness.fixture.whenStable();
    await clickButton(page, /Make the labels PDF/);
    expect(page.backend.match(isCreate)).toHaveLength(0);
    expect(squash(page.el.querySelector('.markets')!.textContent)).toContain(
      'Choose at least one market',
    );
  });

  it('shows the progress while the PDF renders, then the PDF in the page with the actual-size reminder', async () => {
    const page = await openPrint();
    await typeInto(page, 'lotCode', 'LF-0412');
    await clickButton(page, /Make the labels PDF/);
    (await nextRequest(page.backend, isCreate)).flush(
      aRun({ status: 'rendering', progress: { done: 0, total: 24 } }),
      { status: 201, statusText: 'Created' },
    );
    await page.harness.fixture.whenStable();
    expect(squash(page.el.textContent)).toContain('Laying out labels: 0 of 24');
    expect(page.el.querySelector('mat-progress-bar[mode="determinate"]')).not.toBeNull();
    expect(page.el.querySelector('iframe')).toBeNull();

    (await nextRequest(page.backend, (r) => r.url === `/api/label-runs/${RUN_ID}`)).flush(
      aRun({ status: 'rendering', progress: { done: 12, total: 24 } }),
    );
    await page.harness.fixture.whenStable();
    expect(squash(page.el.textContent)).toContain('Laying out labels: 12 of 24');
    expect(
      page.el.querySelector('mat-progress-bar[mode="determinate"]')!.getAttribute('aria-valuenow'),
    ).toBe('50');

    (await nextRequest(page.backend, (r) => r.url === `/api/label-runs/${RUN_ID}`)).flush(
      aRun({ publicPage: { path: '/p/tok3n', withdrawnAt: null } }),
    );
    const pdf = await nextRequest(page.backend, (r) => r.url === `/api/label-runs/${RUN_ID}/pdf`);
    pdf.flush(new Blob(['%PDF-1.7'], { type: 'application/pdf' }));
    await page.harness.fixture.whenStable();

    const frame = page.el.querySelector('iframe')!;
    expect(frame.getAttribute('src')).toBe('blob:http://localhost/pdf-1');
    expect(frame.getAttribute('title')).toBe('Labels PDF of Lagoon fizzer');
    expect(squash(page.el.textContent)).toContain('Print at actual size (100 %).');
    const download = page.el.querySelector<HTMLAnchorElement>('a[download]')!;
    expect(download.getAttribute('href')).toBe('blob:http://localhost/pdf-1');
    expect(download.getAttribute('download')).toBe('labels-lagoon-fizzer-v1-lf-0412.pdf');
    const publicLink = Array.from(page.el.querySelectorAll('a')).find((a) =>
      squash(a.textContent).includes('Public ingredients page'),
    )!;
    expect(publicLink.getAttribute('href')).toBe('/p/tok3n');
    // No further polling once the run is ready.
    expect(page.backend.match((r) => r.url === `/api/label-runs/${RUN_ID}`)).toHaveLength(0);
  });

  it('lists what is missing per market on a 409, each linked to its field, and offers a formulator no override', async () => {
    const page = await openPrint('formulator');
    await refuse(page, 409, INCOMPLETE);

    const markets = Array.from(page.el.querySelectorAll('bp-run-refusal section')).map((s) =>
      squash(s.querySelector('h3')!.textContent),
    );
    expect(markets).toEqual(['US · United States', 'EU · European Union']);
    const link = (field: string) =>
      page.el.querySelector(`li[data-field="${field}"] a`)?.getAttribute('href');
    expect(link('identity.euResponsiblePerson.address')).toBe(
      `/formulas/${FORMULA_ID}/identity#euResponsiblePerson.address`,
    );
    expect(link('workshop.address')).toBe('/workshop#workshop.address');
    const eu = squash(
      page.el.querySelector('li[data-field="identity.euResponsiblePerson.address"]')!.textContent,
    );
    expect(eu).toContain("The EU responsible person's postal address");
    expect(eu).toContain('Regulation (EC) No 1223/2009, Art. 4 and Art. 19(1)(a)');
    // The lot code is a field of this form: its link focuses it here.
    page.el.querySelector<HTMLButtonElement>('li[data-field="lotCode"] button')!.click();
    expect(document.activeElement?.id).toBe('lotCode');

    const text = squash(page.el.querySelector('bp-run-refusal')!.textContent);
    expect(text).toContain("The product's safety assessor and the law of each market decide");
    expect(text).toContain('who alone may print anyway');
    expect(
      await page.loader.getAllHarnesses(MatButtonHarness.with({ text: /Print anyway/ })),
    ).toHaveLength(0);
  });

  it('lets the owner print anyway, only with a reason, which the request carries', async () => {
    const page = await openPrint('owner');
    await refuse(page, 409, INCOMPLETE);

    await clickButton(page, /Print anyway/);
    expect(page.backend.match(isCreate)).toHaveLength(0);
    expect(squash(page.el.querySelector('#override-reason-error')?.textContent)).toContain(
      'Reason for printing anyway is required',
    );

    const reason = page.el.querySelector<HTMLTextAreaElement>('bp-run-refusal textarea')!;
    reason.value = 'Samples for the responsible person to review';
    reason.dispatchEvent(new Event('input'));
    await page.harness.fixture.whenStable();
    await clickButton(page, /Print anyway/);
    const req = await nextRequest(page.backend, isCreate);
    const body = req.request.body as LabelRunCreate;
    expect(body.overrideReason).toBe('Samples for the responsible person to review');
    expect(body.markets).toEqual(['US', 'EU']);
  });

  it('lists each field that cannot fit at its legal size on a 422, with its label, minimum and source', async () => {
    const page = await openPrint();
    await refuse(page, 422, {
      code: 'label_does_not_fit',
      message: 'Some text cannot fit.',
      fitProblems: [
        {
          market: 'US',
          label: 'front label (66.7 × 25.4 mm)',
          field: 'warnings',
          fieldName: 'Warnings',
          message: 'Needs 31 mm of height at 1.59 mm letters; the label has 18 mm left.',
          minimumMm: 1.5875,
          source: '21 CFR 740.2(a)',
        },
      ],
    });
    const text = squash(page.el.querySelector('bp-run-refusal')!.textContent);
    expect(text).toContain('US · front label (66.7 × 25.4 mm): Warnings');
    expect(text).toContain('Needs 31 mm of height');
    expect(text).toContain('Letters at least 1.59 mm high · 21 CFR 740.2(a)');
    expect(
      await page.loader.getAllHarnesses(MatButtonHarness.with({ text: /Print anyway/ })),
    ).toHaveLength(0);
  });

  it("asks for the small item's confirmation and says what the outer pack must still carry", async () => {
    const page = await openPrint();
    const small = await page.loader.getHarness(
      MatRadioButtonHarness.with({ label: 'Small item with QR code' }),
    );
    await small.check();
    expect(squash(page.el.querySelector('.small-note')!.textContent)).toContain(
      'The law still requires the ingredient list and the warnings on the outer pack, a tag or a card',
    );
    await typeInto(page, 'lotCode', 'LF-0412');
    await clickButton(page, /Make the labels PDF/);
    expect(page.backend.match(isCreate)).toHaveLength(0);
    expect(squash(page.el.textContent)).toContain(
      'Confirm that the outer pack, a tag or a card carries the ingredients, warnings and directions',
    );

    page.el.querySelector<HTMLInputElement>('#outerPackConfirmed input')!.click();
    await page.harness.fixture.whenStable();
    await clickButton(page, /Make the labels PDF/);
    const body = (await nextRequest(page.backend, isCreate)).request.body as LabelRunCreate;
    expect(body.layout).toBe('small');
    expect(body.outerPackConfirmed).toBe(true);
  });

  it('shows no start grid for a roll, which prints from its first label', async () => {
    const page = await openPrint();
    expect(page.el.querySelector('bp-start-position-grid')).not.toBeNull();
    const stock = await page.loader.getHarness(MatSelectHarness.with({ selector: '#stockId' }));
    await stock.open();
    await stock.clickOptions({ text: ROLL_2X1.stock.name });
    await page.harness.fixture.whenStable();
    expect(page.el.querySelector('bp-start-position-grid')).toBeNull();
  });
});
