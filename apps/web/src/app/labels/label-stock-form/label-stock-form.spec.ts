import { MatButtonHarness } from '@angular/material/button/testing';
import { MatButtonToggleHarness } from '@angular/material/button-toggle/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import type { HttpRequest } from '@angular/common/http';
import type { LabelStockCreate, Role } from '@batchproof/shared';
import { nextRequest, openAs, type OpenedPage } from '../../formulas/formulas-testing';
import { LETTER_30 } from '../labels-testing';
import LabelStockForm from './label-stock-form';

const ROUTES = [
  { path: 'labels/stocks/new', component: LabelStockForm },
  { path: 'labels/stocks/:id', component: LabelStockForm },
];
const isCreate = (r: HttpRequest<unknown>) => r.method === 'POST' && r.url === '/api/label-stocks';

const input = (page: OpenedPage, id: string) =>
  page.loader.getHarness(MatInputHarness.with({ selector: `[id="${id}"]` }));

async function fill(page: OpenedPage, values: Record<string, string>) {
  for (const [id, value] of Object.entries(values)) await (await input(page, id)).setValue(value);
}

async function errorOf(page: OpenedPage, id: string) {
  for (const field of await page.loader.getAllHarnesses(MatFormFieldHarness)) {
    const control = await field.getControl(MatInputHarness);
    if (control && (await (await control.host()).getAttribute('id')) === id) {
      return (await field.getTextErrors()).join(' ');
    }
  }
  throw new Error(`No field ${id}`);
}

const submit = async (page: OpenedPage) =>
  (await page.loader.getHarness(MatButtonHarness.with({ text: /Add stock/ }))).click();

/** A 2-across, 3-down sheet of 80 × 60 mm labels on A4, as a ruler measures it. */
const SHEET = {
  name: 'Kraft 80 × 60',
  pageWidthMm: '210',
  pageHeightMm: '297',
  topMarginMm: '20',
  leftMarginMm: '20',
  labelWidthMm: '80',
  labelHeightMm: '60',
  horizontalPitchMm: '90',
  verticalPitchMm: '65',
  across: '2',
  down: '3',
};

const openNew = (role: Role = 'formulator') =>
  openAs(role, ROUTES, '/labels/stocks/new', LabelStockForm);

describe('LabelStockForm', () => {
  beforeEach(() => localStorage.clear());

  it('says beside the horizontal pitch when labels would overlap, and sends nothing', async () => {
    const page = await openNew();
    await fill(page, { ...SHEET, horizontalPitchMm: '70' });
    await submit(page);
    expect(page.backend.match(isCreate)).toHaveLength(0);
    expect(await errorOf(page, 'horizontalPitchMm')).toBe(
      'The horizontal pitch (70 mm) is less than the label width (80 mm), so the labels would overlap',
    );
  });

  it('sends a sheet in millimetres, and converts lengths typed in inches', async () => {
    const page = await openNew();
    await fill(page, SHEET);
    const inches = await page.loader.getHarness(MatButtonToggleHarness.with({ text: 'inches' }));
    await inches.check();
    // 80 mm is 3.1496 in: what was typed is kept, in the new unit.
    expect(await (await input(page, 'labelWidthMm')).getValue()).toBe('3.1496');
    await fill(page, { labelWidthMm: '3.125' });
    await submit(page);
    const req = await nextRequest(page.backend, isCreate);
    const body = req.request.body as LabelStockCreate & { labelWidthMm: number };
    expect(body.kind).toBe('sheet');
    // 3.125 in × 25.4 mm (the international inch).
    expect(body.labelWidthMm).toBe(79.375);
    expect(body).toMatchObject({ across: 2, down: 3, shape: { kind: 'rectangle' } });
    expect(req.request.headers.has('Idempotency-Key')).toBe(true);
  });

  it('asks a roll only for its label size and gap', async () => {
    const page = await openNew();
    await (await page.loader.getHarness(MatButtonToggleHarness.with({ text: 'Roll' }))).check();
    expect(page.el.querySelector('[id="pageWidthMm"]')).toBeNull();
    expect(page.el.querySelector('[id="across"]')).toBeNull();
    await fill(page, {
      name: 'Thermal 50 × 30',
      labelWidthMm: '50',
      labelHeightMm: '30',
      gapMm: '3',
    });
    await submit(page);
    const body = (await nextRequest(page.backend, isCreate)).request.body as LabelStockCreate;
    expect(body).toEqual({
      kind: 'roll',
      name: 'Thermal 50 × 30',
      labelWidthMm: 50,
      labelHeightMm: 30,
      gapMm: 3,
      shape: { kind: 'rectangle' },
    });
  });

  it('opens a built-in stock read-only, with its calibration page', async () => {
    const page = await openAs('owner', ROUTES, `/labels/stocks/${LETTER_30.id}`, LabelStockForm);
    (await nextRequest(page.backend, (r) => r.url === `/api/label-stocks/${LETTER_30.id}`)).flush(
      LETTER_30,
    );
    await page.harness.fixture.whenStable();
    expect(page.el.textContent).toContain('A built-in stock');
    expect(await (await input(page, 'labelWidthMm')).isDisabled()).toBe(true);
    expect(await (await input(page, 'labelWidthMm')).getValue()).toBe('66.675');
    expect(
      await page.loader.getAllHarnesses(MatButtonHarness.with({ text: /Save changes/ })),
    ).toHaveLength(0);
    await (
      await page.loader.getHarness(MatButtonHarness.with({ text: /Calibration page/ }))
    ).click();
    const pdf = await nextRequest(
      page.backend,
      (r) => r.url === `/api/label-stocks/${LETTER_30.id}/calibration.pdf`,
    );
    expect(pdf.request.responseType).toBe('blob');
  });
});
