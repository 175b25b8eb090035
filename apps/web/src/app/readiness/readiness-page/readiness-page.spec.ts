import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HttpRequest } from '@angular/common/http';
import type { HttpTestingController } from '@angular/common/http/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatRadioGroupHarness } from '@angular/material/radio/testing';
import { RouterTestingHarness } from '@angular/router/testing';
import type { ProductReadiness, ReadinessList, ReadinessItem, Role } from '@batchproof/shared';
import { signedInAs } from '../../auth/signed-in-as';
import ReadinessPage from './readiness-page';

const item = (key: string, label: string, over: Partial<ReadinessItem> = {}): ReadinessItem => ({
  key,
  label,
  done: true,
  detail: null,
  link: null,
  source: 'Regulation (EC) No 1223/2009, Art. 10',
  ...over,
});

const LOTION: ProductReadiness = {
  formulaId: 'f-lotion',
  formulaName: 'Everyday Body Lotion',
  productType: 'lotion',
  versionId: 'v-lotion-2',
  versionNumber: 2,
  markets: [
    {
      market: 'EU',
      complete: false,
      items: [
        item('assessment', 'Safety assessment signed for version 2', {
          link: '/assessments/a1',
        }),
        item('notification', 'Notification reference recorded', {
          done: false,
          detail: 'No EU notification reference recorded',
          link: '/readiness',
          source: 'Regulation (EC) No 1223/2009, Art. 13',
        }),
      ],
    },
    {
      market: 'UK',
      complete: true,
      items: [item('assessment', 'Safety assessment signed for version 2')],
    },
  ],
  records: [],
};

const FIZZER: ProductReadiness = {
  formulaId: 'f-fizzer',
  formulaName: 'Sea Glass Fizzer',
  productType: 'fizzer',
  versionId: 'v-fizzer-3',
  versionNumber: 3,
  markets: [
    {
      market: 'US',
      complete: false,
      items: [
        item('labels', 'Labels printed from version 3', {
          done: false,
          detail: 'The last labels were printed from version 2',
          link: '/labels?formulaId=f-fizzer',
          source: '21 CFR 701.3',
        }),
        item('listing', 'Product listed with FDA', { source: 'FD&C Act §607' }),
      ],
    },
    {
      market: 'CA',
      complete: false,
      items: [
        item('notification', 'Canadian notification recorded', {
          done: false,
          detail: 'Due by 2026-12-11: 10 days after the first sale on 2026-12-01',
          link: '/readiness',
          source: 'Cosmetic Regulations (C.R.C., c. 869), s. 30(1)',
        }),
        item('name-address', 'Name and address on the label', {
          done: false,
          detail: 'The label has no address',
          link: '/formulas/f-fizzer/identity',
          source: 'Cosmetic Regulations (C.R.C., c. 869), s. 20',
        }),
      ],
    },
  ],
  records: [
    {
      kind: 'us-listing',
      reference: null,
      recordedOn: '2026-11-02',
      firstSaleOn: null,
      smallBusinessExempt: true,
      notes: 'Owner checked US sales for 2023-2025',
      updatedAt: '2026-11-02T10:00:00.000Z',
    },
    {
      kind: 'ca-notification',
      reference: null,
      recordedOn: null,
      firstSaleOn: '2026-12-01',
      smallBusinessExempt: null,
      notes: null,
      updatedAt: '2026-12-01T10:00:00.000Z',
    },
  ],
};

const SALTS: ProductReadiness = {
  formulaId: 'f-salts',
  formulaName: 'calm bath salts',
  productType: 'bath-salts',
  versionId: 'v-salts-1',
  versionNumber: 1,
  markets: [
    { market: 'US', complete: true, items: [item('labels', 'Labels printed from version 1')] },
  ],
  records: [],
};

/** Out of name order, as the API might answer. */
const LIST: ReadinessList = { items: [FIZZER, SALTS, LOTION] };

const sent = (backend: HttpTestingController, match: (r: HttpRequest<unknown>) => boolean) =>
  vi.waitFor(() => backend.expectOne(match));

/** The testing backend of the running test, checked after it for requests left unanswered. */
let backend: HttpTestingController | undefined;

async function openAs(role: Role) {
  const http = await signedInAs(role, [{ path: 'readiness', component: ReadinessPage }]);
  backend = http;
  const harness = await RouterTestingHarness.create();
  await harness.navigateByUrl('/readiness');
  (await sent(http, (r) => r.url === '/api/readiness' && r.method === 'GET')).flush(LIST);
  await harness.fixture.whenStable();
  const root = TestbedHarnessEnvironment.documentRootLoader(harness.fixture);
  const el = () => harness.routeNativeElement as HTMLElement;
  return {
    backend: http,
    harness,
    root,
    el,
    headings: () => [...el().querySelectorAll('h2')].map((h) => h.textContent?.trim()),
    market: (formulaId: string, market: string) =>
      el().querySelector<HTMLElement>(
        `section[aria-labelledby="product-${formulaId}"] [data-market="${market}"]`,
      )!,
    buttons: async () =>
      Promise.all((await root.getAllHarnesses(MatButtonHarness)).map((b) => b.getText())),
  };
}

describe('ReadinessPage', { timeout: 20_000 }, () => {
  afterEach(() => {
    backend?.verify();
    backend = undefined;
  });

  it('shows every product by name with a block per market, its state in words and each item', async () => {
    const page = await openAs('owner');
    expect(page.headings()).toEqual([
      'calm bath salts',
      'Everyday Body Lotion',
      'Sea Glass Fizzer',
    ]);

    const eu = page.market('f-lotion', 'EU');
    expect(eu.querySelector('h3')?.textContent).toContain('European Union');
    expect(eu.textContent).toContain('Incomplete: 1 missing');
    expect(eu.querySelector('[data-item="assessment"]')?.textContent).toContain('Done:');
    const missing = eu.querySelector('[data-item="notification"]')!;
    expect(missing.textContent).toContain('Missing:');
    expect(missing.textContent).toContain('No EU notification reference recorded');
    expect(missing.textContent).toContain('Source: Regulation (EC) No 1223/2009, Art. 13');

    const uk = page.market('f-lotion', 'UK');
    expect(uk.querySelector('h3')?.textContent).toContain('United Kingdom');
    expect(uk.textContent).toContain('Complete');
    expect(uk.textContent).not.toContain('Incomplete');
    expect(page.market('f-fizzer', 'US').querySelector('h3')?.textContent).toContain(
      'United States',
    );
    expect(page.market('f-fizzer', 'CA').querySelector('h3')?.textContent).toContain('Canada');
    expect(page.el().textContent).toContain('Ready in every market it sells in');
    expect(page.el().textContent).toContain('Incomplete in 2 of 2 markets');

    // The listing is recorded as exempt by the owner's answer; Canada's first sale is shown.
    const listing = page.market('f-fizzer', 'US').querySelector('[data-record="us-listing"]')!;
    expect(listing.textContent).toContain('Exempt as a small business');
    expect(listing.textContent).toContain('Owner checked US sales for 2023-2025');
    const ca = page.market('f-fizzer', 'CA').querySelector('[data-record="ca-notification"]')!;
    expect(ca.textContent).toContain('first sale Dec 1, 2026');
  });

  it('links each missing item to where it is done, and no done item', async () => {
    const page = await openAs('viewer');
    const links = [...page.el().querySelectorAll<HTMLAnchorElement>('a.go')].map((a) => [
      a.closest('li')?.getAttribute('data-item'),
      a.getAttribute('href'),
    ]);
    expect(links).toEqual([
      ['labels', '/labels?formulaId=f-fizzer'],
      ['name-address', '/formulas/f-fizzer/identity'],
    ]);
    expect(page.el().querySelector('[data-item="assessment"] a')).toBeNull();
    // A reference recorded on this page is not a link back to it; a viewer only reads what is due.
    const caNotification = page
      .market('f-fizzer', 'CA')
      .querySelector('[data-item="notification"]');
    expect(caNotification?.textContent).toContain('Due by 2026-12-11');
    expect(caNotification?.querySelector('a, button')).toBeNull();
  });

  it('filters by product name and to the incomplete products only', async () => {
    const page = await openAs('viewer');
    const search = await page.root.getHarness(MatInputHarness.with({ selector: '[type=search]' }));
    await search.setValue('LOTION');
    await page.harness.fixture.whenStable();
    expect(page.headings()).toEqual(['Everyday Body Lotion']);

    await search.setValue('');
    await (
      await page.root.getHarness(MatCheckboxHarness.with({ label: /Only incomplete/ }))
    ).check();
    await page.harness.fixture.whenStable();
    expect(page.headings()).toEqual(['Everyday Body Lotion', 'Sea Glass Fizzer']);

    await search.setValue('salts');
    await page.harness.fixture.whenStable();
    expect(page.headings()).toEqual([]);
    expect(page.el().textContent).toContain('No product matches these filters.');
  });

  it('records a notification: PUTs the form, shows the field errors, then reads the readiness again', async () => {
    const page = await openAs('owner');
    await (
      await page.root.getHarness(MatButtonHarness.with({ text: /Record it: EU notification/ }))
    ).click();
    const dialog = await page.root.getHarness(MatDialogHarness);
    expect(await dialog.getTitleText()).toBe('EU notification · Everyday Body Lotion');
    // Only Canada asks for the first sale, only the US listing the small-business question.
    expect(await dialog.getContentText()).not.toContain('First sale in Canada');
    expect(await dialog.getContentText()).not.toContain('§612');

    const reference = await dialog.getHarness(
      MatInputHarness.with({ selector: '[formControlName=reference]' }),
    );
    await reference.setValue('  CPNP-1234567 ');
    await (
      await dialog.getHarness(MatInputHarness.with({ selector: '[formControlName=recordedOn]' }))
    ).setValue('2026-11-30');
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Save' }))).click();
    const put = await sent(page.backend, (r) => r.method === 'PUT');
    expect(put.request.url).toBe('/api/readiness/f-lotion/records/eu-notification');
    expect(put.request.body).toEqual({
      reference: 'CPNP-1234567',
      recordedOn: '2026-11-30',
      firstSaleOn: null,
      smallBusinessExempt: null,
      notes: null,
    });
    put.flush(
      {
        error: {
          code: 'validation_failed',
          message: 'Some fields need attention.',
          fieldErrors: { reference: ['This reference is already recorded for another product'] },
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await page.harness.fixture.whenStable();
    expect(await dialog.getContentText()).toContain(
      'This reference is already recorded for another product',
    );
    expect(await reference.getValue()).toBe('  CPNP-1234567 ');
    page.backend.expectNone('/api/readiness');

    await reference.setValue('CPNP-7654321');
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Save' }))).click();
    (await sent(page.backend, (r) => r.method === 'PUT')).flush({
      kind: 'eu-notification',
      reference: 'CPNP-7654321',
      recordedOn: '2026-11-30',
      firstSaleOn: null,
      smallBusinessExempt: null,
      notes: null,
      updatedAt: '2026-12-03T08:00:00.000Z',
    });
    (await sent(page.backend, (r) => r.url === '/api/readiness')).flush(LIST);
    await page.harness.fixture.whenStable();
    expect(await page.root.getAllHarnesses(MatDialogHarness)).toHaveLength(0);
  });

  it('asks the US listing the small-business question, and shows Canada its 10-day clock', async () => {
    const page = await openAs('formulator');
    await (
      await page.root.getHarness(
        MatButtonHarness.with({ text: 'Edit', selector: '[aria-label*="US product listing"]' }),
      )
    ).click();
    let dialog = await page.root.getHarness(MatDialogHarness);
    expect(await dialog.getContentText()).toContain('FD&C Act §612');
    const answer = await dialog.getHarness(MatRadioGroupHarness);
    expect(await answer.getCheckedValue()).toBe('yes');
    await answer.checkRadioButton({ label: 'No, we list' });
    await (
      await dialog.getHarness(MatInputHarness.with({ selector: '[formControlName=reference]' }))
    ).setValue('LST-0042');
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Save' }))).click();
    const put = await sent(page.backend, (r) => r.method === 'PUT');
    expect(put.request.url).toBe('/api/readiness/f-fizzer/records/us-listing');
    expect(put.request.body).toMatchObject({ reference: 'LST-0042', smallBusinessExempt: false });
    put.flush({ ...FIZZER.records[0], reference: 'LST-0042', smallBusinessExempt: false });
    (await sent(page.backend, (r) => r.url === '/api/readiness')).flush(LIST);
    await page.harness.fixture.whenStable();

    await (
      await page.root.getHarness(
        MatButtonHarness.with({ text: 'Edit', selector: '[aria-label*="Canada notification"]' }),
      )
    ).click();
    dialog = await page.root.getHarness(MatDialogHarness);
    // Cosmetic Regulations (C.R.C., c. 869), s. 30(1): at the latest 10 days after the first sale.
    expect(await dialog.getContentText()).toContain('Notification due by Dec 11, 2026');
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Cancel' }))).click();
    await page.harness.fixture.whenStable();
    page.backend.expectNone((r) => r.method === 'PUT');
  });

  it('lets a viewer read the records but record nothing', async () => {
    const page = await openAs('viewer');
    const buttons = await page.buttons();
    expect(buttons.filter((b) => /Record|Edit/.test(b))).toEqual([]);
    expect(
      page.market('f-lotion', 'EU').querySelector('[data-record="eu-notification"]')?.textContent,
    ).toContain('Not recorded');
  });
});
