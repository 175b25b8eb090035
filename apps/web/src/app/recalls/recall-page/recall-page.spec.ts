import type { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HttpRequest } from '@angular/common/http';
import type { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatRadioGroupHarness } from '@angular/material/radio/testing';
import { Router } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import {
  RECALL_AUTHORITY_NOTE,
  type Recall,
  type RecallPreview,
  type Role,
} from '@batchproof/shared';
import { signedInAs } from '../../auth/signed-in-as';
import NewRecall from '../new-recall/new-recall';
import RecallPage from './recall-page';

/** A supplier lot's id (scopes carry record ids). */
const LOT = '7d3e1c0a-5b2f-4c1d-9e8a-1f2b3c4d5e6f';

const HARBOUR = {
  customerId: 'c1',
  customerName: 'Harbour Soap Shop',
  email: 'orders@harbour.example',
  phone: '01632 960001',
  lots: [
    {
      finishedLotId: 'b1',
      lotCode: '261101-SGF-1',
      productName: 'Sea Glass Fizzer',
      unitsDelivered: 18,
    },
  ],
  unitsDelivered: 18,
};
const TIDELINE = {
  customerId: 'c2',
  customerName: 'Tideline Market Stall',
  email: null,
  phone: '07700 900123',
  lots: [
    {
      finishedLotId: 'b1',
      lotCode: '261101-SGF-1',
      productName: 'Sea Glass Fizzer',
      unitsDelivered: 5,
    },
  ],
  unitsDelivered: 5,
};

function aRecall(overrides: Partial<Recall> = {}): Recall {
  return {
    id: 'r1',
    createdAt: '2026-03-01T09:00:00.000Z',
    updatedAt: '2026-03-01T09:00:00.000Z',
    scope: { kind: 'supplier-lot', supplierLotId: LOT },
    batchCodes: ['261101-SGF-1', '261102-SGF-2'],
    reason: 'Possible metal fragments in the citric acid.',
    severity: 'serious-harm',
    drill: false,
    state: 'open',
    openedAt: '2026-03-01T09:00:00.000Z',
    closedAt: null,
    affected: [HARBOUR, TIDELINE],
    notices: [],
    replies: [],
    unitsDelivered: 23,
    unitsReturned: 0,
    drillReport: null,
    summary: null,
    products: ['Sea Glass Fizzer'],
    whatToDo: null,
    ...overrides,
  };
}

async function openAs(role: Role, url: string) {
  const backend = await signedInAs(role, [
    { path: 'recalls/new', component: NewRecall },
    { path: 'recalls/:id', component: RecallPage },
  ]);
  const harness = await RouterTestingHarness.create();
  await harness.navigateByUrl(url);
  const loader = TestbedHarnessEnvironment.loader(harness.fixture);
  return {
    harness,
    backend,
    loader,
    buttons: async () =>
      Promise.all((await loader.getAllHarnesses(MatButtonHarness)).map((b) => b.getText())),
    click: async (text: string | RegExp, from: HarnessLoader = loader) =>
      (await from.getHarness(MatButtonHarness.with({ text }))).click(),
    text: () => (harness.routeNativeElement as HTMLElement).textContent ?? '',
  };
}

const sent = (backend: HttpTestingController, match: (r: HttpRequest<unknown>) => boolean) =>
  vi.waitFor(() => backend.expectOne(match));

describe('RecallPage', () => {
  beforeEach(() => localStorage.clear());

  it('sends the notices only after the owner confirms, then shows each status in words', async () => {
    const page = await openAs('owner', '/recalls/r1');
    (await sent(page.backend, (r) => r.url === '/api/recalls/r1')).flush(aRecall());
    await page.harness.fixture.whenStable();
    expect(page.text()).toContain(RECALL_AUTHORITY_NOTE);
    expect(page.text()).toContain('No e-mail: call them');

    await page.click(/Send notices \(2\)/);
    const root = TestbedHarnessEnvironment.documentRootLoader(page.harness.fixture);
    const dialog = await root.getHarness(MatDialogHarness);
    expect(await dialog.getTitleText()).toBe('Send the recall notices?');
    expect(await dialog.getContentText()).toContain('1 customer(s) get the notice by e-mail now');
    expect(await dialog.getContentText()).toContain('1 customer(s) have no e-mail address');
    page.backend.expectNone((r) => r.url === '/api/recalls/r1/notices');
    // The click settles once the answer is in, so it is awaited after the answer is given.
    const clicked = page.click('Send notices', dialog);
    const post = await sent(page.backend, (r) => r.url === '/api/recalls/r1/notices');
    expect(post.request.body).toEqual({ whatToDo: null });
    post.flush(
      aRecall({
        notices: [
          {
            id: 'n1',
            customerId: 'c1',
            to: HARBOUR.email,
            subject: 'Recall',
            status: 'sent',
            sentAt: '2026-03-01T09:05:00.000Z',
            failure: null,
          },
          {
            id: 'n2',
            customerId: 'c2',
            to: '',
            subject: 'Recall',
            status: 'not-sent',
            sentAt: null,
            failure: 'No e-mail address: call 07700 900123',
          },
        ],
      }),
    );
    await clicked;
    await page.harness.fixture.whenStable();
    expect(page.text()).toContain('Sent');
    expect(page.text()).toContain('No e-mail address: call 07700 900123');
    // Everyone has a notice now: nothing is left to send.
    expect((await page.buttons()).some((t) => t.includes('Send notices'))).toBe(false);
  });

  it('shows a drill its report, and a viewer reads without any way to act', async () => {
    const page = await openAs('viewer', '/recalls/r1');
    (await sent(page.backend, (r) => r.url === '/api/recalls/r1')).flush(
      aRecall({
        drill: true,
        severity: 'unlikely-harm',
        drillReport: {
          traceMilliseconds: 12.5,
          missing: ['Lot 261102-SGF-2 has no recorded delivery'],
        },
      }),
    );
    await page.harness.fixture.whenStable();
    expect(page.text()).toContain('The trace to customers took 12.5 ms.');
    expect(page.text()).toContain('Lot 261102-SGF-2 has no recorded delivery');
    expect(page.text()).not.toContain(RECALL_AUTHORITY_NOTE);
    expect(await page.buttons()).toEqual(['picture_as_pdfSummary PDF']);
  });
});

describe('NewRecall', () => {
  beforeEach(() => localStorage.clear());

  it('shows whom a supplier-lot recall reaches, then opens a drill with the reason and severity', async () => {
    const page = await openAs('owner', `/recalls/new?supplierLot=${LOT}`);
    const preview = await sent(page.backend, (r) => r.url === '/api/recalls/preview');
    expect(preview.request.body).toEqual({ scope: { kind: 'supplier-lot', supplierLotId: LOT } });
    const answer: RecallPreview = {
      batchCodes: ['261101-SGF-1', '261102-SGF-2'],
      products: ['Sea Glass Fizzer'],
      affected: [HARBOUR, TIDELINE],
      unitsDelivered: 23,
      lotsWithoutDelivery: ['261102-SGF-2'],
    };
    preview.flush(answer);
    await page.harness.fixture.whenStable();
    expect(page.text()).toContain('23 to 2 customers');
    expect(page.text()).toContain('No delivery is recorded for 261102-SGF-2');

    // Nothing chosen: the contract's messages, and no request.
    await page.click(/Open the recall/);
    await page.harness.fixture.whenStable();
    expect(page.text()).toContain('Reason is required');
    page.backend.expectNone('/api/recalls');

    await (
      await page.loader.getHarness(MatInputHarness.with({ selector: 'textarea' }))
    ).setValue('Drill: a supplier recall of citric acid');
    await (
      await page.loader.getHarness(MatRadioGroupHarness)
    ).checkRadioButton({
      label: 'Could cause minor or temporary harm',
    });
    await (await page.loader.getHarness(MatCheckboxHarness)).check();
    await page.click(/Start the drill/);
    const open = await sent(page.backend, (r) => r.url === '/api/recalls' && r.method === 'POST');
    expect(open.request.body).toEqual({
      scope: { kind: 'supplier-lot', supplierLotId: LOT },
      reason: 'Drill: a supplier recall of citric acid',
      severity: 'minor-harm',
      drill: true,
    });
    expect(open.request.headers.has('Idempotency-Key')).toBe(true);
    open.flush(aRecall({ id: 'r9', drill: true }));
    await vi.waitFor(() => expect(TestBed.inject(Router).url).toBe('/recalls/r9'));
  });
});
