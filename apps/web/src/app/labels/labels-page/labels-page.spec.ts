import { MatButtonHarness } from '@angular/material/button/testing';
import { MatSortHarness } from '@angular/material/sort/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { TestBed } from '@angular/core/testing';
import { Router } from '@angular/router';
import type { LabelStockRecord, Role } from '@batchproof/shared';
import { nextRequest, openAs } from '../../formulas/formulas-testing';
import { aRun, LETTER_30 } from '../labels-testing';
import LabelsPage from './labels-page';

const OWN: LabelStockRecord = {
  ...LETTER_30,
  id: '3f2a1b0c-9d8e-4f7a-8b6c-5d4e3f2a1b0c',
  builtIn: false,
  key: null,
  stock: { ...LETTER_30.stock, name: 'Kraft ovals' },
  createdAt: '2026-11-01T10:00:00.000Z',
  updatedAt: '2026-11-01T10:00:00.000Z',
};
const RUNS = [
  aRun({ id: '11111111-1111-4111-8111-111111111111', lotCode: 'LF-0412', outOfDate: true }),
  aRun({
    id: '22222222-2222-4222-8222-222222222222',
    formulaName: 'Rose clay soap',
    version: 3,
    markets: ['UK'],
    lotCode: 'RC-0007',
    labelCount: 8,
    createdAt: '2026-11-21T09:30:00.000Z',
    status: 'rendering',
  }),
];

async function openLabels(role: Role = 'formulator', url = '/labels') {
  const page = await openAs(role, [{ path: 'labels', component: LabelsPage }], url, LabelsPage);
  (await nextRequest(page.backend, (r) => r.url === '/api/label-runs')).flush({ items: RUNS });
  (await nextRequest(page.backend, (r) => r.url === '/api/label-stocks')).flush({
    items: [LETTER_30, OWN],
  });
  await page.harness.fixture.whenStable();
  return page;
}

const squash = (t: string) => t.replace(/\s+/g, ' ').trim();

describe('LabelsPage', () => {
  beforeEach(() => localStorage.clear());

  it('lists the print runs newest first, with "Out of date" in words on a run of a replaced version', async () => {
    const page = await openLabels();
    const [runs] = await page.loader.getAllHarnesses(
      MatTableHarness.with({ selector: '[aria-label="Print runs"]' }),
    );
    const cells = await runs!.getCellTextByColumnName();
    const names = cells['formulaName']!.text;
    expect(names[0]).toBe('Rose clay soap · v3');
    expect(names[1]).toMatch(/^Lagoon fizzer · v1/);
    expect(names[1]).toContain('Out of date');
    expect(cells['markets']!.text).toEqual(['UK', 'US, EU']);
    expect(cells['lotCode']!.text).toEqual(['RC-0007', 'LF-0412']);
    expect(cells['labelCount']!.text).toEqual(['8', '24']);
    expect(cells['status']!.text).toEqual(['hourglass_topRendering', 'check_circleReady']);
    // Only a ready run offers its PDF.
    expect(cells['pdf']!.text).toEqual(['', 'picture_as_pdfPDF']);
  });

  it('sorts by a column and filters by what is typed, keeping the filter in the URL', async () => {
    const page = await openLabels();
    const sort = await page.loader.getHarness(MatSortHarness);
    const [lot] = await sort.getSortHeaders({ label: 'Lot code' });
    await lot!.click();
    const table = await page.loader.getHarness(
      MatTableHarness.with({ selector: '[aria-label="Print runs"]' }),
    );
    expect((await table.getCellTextByColumnName())['lotCode']!.text).toEqual([
      'LF-0412',
      'RC-0007',
    ]);

    const box = page.el.querySelector<HTMLInputElement>('input[type="search"]')!;
    box.value = 'rose';
    box.dispatchEvent(new Event('input'));
    await page.harness.fixture.whenStable();
    expect((await table.getCellTextByColumnName())['lotCode']!.text).toEqual(['RC-0007']);
    await vi.waitFor(() => expect(TestBed.inject(Router).url).toContain('q=rose'));
  });

  it('lists only out-of-date runs when the URL asks', async () => {
    const page = await openLabels('viewer', '/labels?show=outOfDate');
    const table = await page.loader.getHarness(
      MatTableHarness.with({ selector: '[aria-label="Print runs"]' }),
    );
    expect((await table.getCellTextByColumnName())['lotCode']!.text).toEqual(['LF-0412']);
  });

  it("lists the stocks, built in and own, and archives only the workshop's own", async () => {
    const page = await openLabels('formulator');
    const stocks = await page.loader.getHarness(
      MatTableHarness.with({ selector: '[aria-label="Label stocks"]' }),
    );
    const cells = await stocks.getCellTextByColumnName();
    expect(cells['kind']!.text.map(squash)).toEqual(['Sheet · built in', 'Sheet · your own']);
    expect(cells['size']!.text).toEqual(['66.7 × 25.4 mm', '66.7 × 25.4 mm']);
    expect(cells['perSheet']!.text).toEqual(['30', '30']);
    const archive = await page.loader.getAllHarnesses(MatButtonHarness.with({ text: /Archive/ }));
    expect(archive).toHaveLength(1);
    await archive[0]!.click();
    const req = await nextRequest(
      page.backend,
      (r) => r.url === `/api/label-stocks/${OWN.id}/archive`,
    );
    expect(req.request.method).toBe('POST');
  });

  it('shows a viewer no way to add or archive a stock', async () => {
    const page = await openLabels('viewer');
    expect(page.el.textContent).not.toContain('Add label stock');
    expect(
      await page.loader.getAllHarnesses(MatButtonHarness.with({ text: /Archive/ })),
    ).toHaveLength(0);
    // The calibration page is for everyone who prints or checks a printer.
    expect(
      await page.loader.getAllHarnesses(MatButtonHarness.with({ text: /Calibration page/ })),
    ).toHaveLength(2);
  });

  it('lets the owner withdraw a public page, then reads the runs again', async () => {
    const page = await openAs(
      'owner',
      [{ path: 'labels', component: LabelsPage }],
      '/labels',
      LabelsPage,
    );
    const published = aRun({ publicPage: { path: '/p/tok3n', withdrawnAt: null } });
    (await nextRequest(page.backend, (r) => r.url === '/api/label-runs')).flush({
      items: [published],
    });
    (await nextRequest(page.backend, (r) => r.url === '/api/label-stocks')).flush({ items: [] });
    await page.harness.fixture.whenStable();

    const withdraw = await page.loader.getHarness(MatButtonHarness.with({ text: /Withdraw/ }));
    await withdraw.click();
    const req = await nextRequest(
      page.backend,
      (r) => r.url === `/api/label-runs/${published.id}/withdraw`,
    );
    expect(req.request.method).toBe('POST');
    req.flush({
      ...published,
      publicPage: { path: '/p/tok3n', withdrawnAt: '2026-11-22T10:00:00.000Z' },
    });
    const again = await nextRequest(page.backend, (r) => r.url === '/api/label-runs');
    again.flush({
      items: [
        { ...published, publicPage: { path: '/p/tok3n', withdrawnAt: '2026-11-22T10:00:00.000Z' } },
      ],
    });
    await page.harness.fixture.whenStable();
    expect(page.el.textContent).toContain('Page withdrawn');
    expect(
      await page.loader.getAllHarnesses(MatButtonHarness.with({ text: /Withdraw/ })),
    ).toHaveLength(0);
  });

  it('offers a formulator no withdrawal of a public page', async () => {
    const page = await openAs(
      'formulator',
      [{ path: 'labels', component: LabelsPage }],
      '/labels',
      LabelsPage,
    );
    (await nextRequest(page.backend, (r) => r.url === '/api/label-runs')).flush({
      items: [aRun({ publicPage: { path: '/p/tok3n', withdrawnAt: null } })],
    });
    (await nextRequest(page.backend, (r) => r.url === '/api/label-stocks')).flush({ items: [] });
    await page.harness.fixture.whenStable();
    expect(page.el.querySelector('a[href="/p/tok3n"]')).not.toBeNull();
    expect(
      await page.loader.getAllHarnesses(MatButtonHarness.with({ text: /Withdraw/ })),
    ).toHaveLength(0);
  });
});
