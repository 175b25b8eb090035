import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HttpRequest } from '@angular/common/http';
import type { HttpTestingController } from '@angular/common/http/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { RouterTestingHarness } from '@angular/router/testing';
import type { Customer, Delivery, Role } from '@batchproof/shared';
import { signedInAs } from '../../auth/signed-in-as';
import DeliveryPage from './delivery-page';

const PANTRY = '5a1f0c3e-7b2d-4e8f-9a6b-1c2d3e4f5a60';
const DELIVERY_ID = 'd0d0d0d0-0000-4000-8000-000000000001';

const customer: Customer = {
  id: PANTRY,
  createdAt: '2026-01-02T09:00:00.000Z',
  updatedAt: '2026-01-02T09:00:00.000Z',
  kind: 'stockist',
  name: 'Larkspur Pantry',
  contact: null,
  email: 'orders@larkspur.test',
  phone: null,
  address: null,
  notes: null,
  deliveryCount: 1,
  archivedAt: null,
};

const DELIVERY: Delivery = {
  id: DELIVERY_ID,
  createdAt: '2026-02-02T09:00:00.000Z',
  updatedAt: '2026-02-02T09:00:00.000Z',
  customerId: PANTRY,
  customerName: 'Larkspur Pantry',
  deliveredOn: '2026-02-02',
  reference: 'INV-2001',
  lines: [
    { finishedLotId: 'b1', lotCode: '260201-FZ-01', productName: 'Bramble Fizzer', units: 24 },
  ],
  totalUnits: 24,
  notes: null,
};

/** Waits until the one request matching `match` has been sent, and returns it. */
const sent = (backend: HttpTestingController, match: (r: HttpRequest<unknown>) => boolean) =>
  vi.waitFor(() => backend.expectOne(match));

async function openAs(role: Role, url: string) {
  const backend = await signedInAs(role, [
    { path: 'deliveries', children: [] },
    { path: 'deliveries/new', component: DeliveryPage },
    { path: 'deliveries/:id', component: DeliveryPage },
  ]);
  const harness = await RouterTestingHarness.create();
  await harness.navigateByUrl(url);
  const loader = TestbedHarnessEnvironment.loader(harness.fixture);
  (await sent(backend, (r) => r.url === '/api/customers')).flush({
    items: [customer],
    total: 1,
    page: 1,
    pageSize: 100,
  });
  await harness.fixture.whenStable();
  const field = (label: string) =>
    loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }));
  const input = async (label: string) =>
    (await (await field(label)).getControl()) as MatInputHarness;
  return {
    harness,
    backend,
    loader,
    errors: async (label: string) => (await field(label)).getTextErrors(),
    value: async (label: string) => (await input(label)).getValue(),
    fill: async (label: string, value: string) => (await input(label)).setValue(value),
    click: async (text: string | RegExp) =>
      (await loader.getHarness(MatButtonHarness.with({ text }))).click(),
    text: () => (harness.routeNativeElement as HTMLElement).textContent ?? '',
  };
}

describe('DeliveryPage', () => {
  it("shows the server's messages beside the line they are about and keeps what was typed", async () => {
    const page = await openAs('production', '/deliveries/new');
    const select = await page.loader.getHarness(MatSelectHarness);
    await select.open();
    await select.clickOptions({ text: 'Larkspur Pantry' });
    await page.fill('Delivered on', '2026-02-02');
    await page.fill('Reference', 'INV-2001');
    await page.fill('Lot code (line 1)', '260201-FZ-01');
    await page.fill('Units (line 1)', '24');
    await page.click(/Add a lot/);
    await page.fill('Lot code (line 2)', '260115-SB-02');
    await page.fill('Units (line 2)', '50');
    await page.click(/Record delivery/);

    const post = await sent(
      page.backend,
      (r) => r.method === 'POST' && r.url === '/api/deliveries',
    );
    expect(post.request.body).toEqual({
      customerId: PANTRY,
      deliveredOn: '2026-02-02',
      reference: 'INV-2001',
      lines: [
        { lotCode: '260201-FZ-01', units: 24 },
        { lotCode: '260115-SB-02', units: 50 },
      ],
      notes: null,
    });
    expect(post.request.headers.get('Idempotency-Key')).toMatch(/^[0-9a-f-]{36}$/);
    post.flush(
      {
        error: {
          code: 'validation_failed',
          message: 'Some fields need attention.',
          fieldErrors: {
            'lines.0.lotCode': ['No released batch has lot code 260201-FZ-01'],
            'lines.1.units': ['Only 12 units of lot 260115-SB-02 are left to deliver'],
          },
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await page.harness.fixture.whenStable();

    expect(await page.errors('Lot code (line 1)')).toEqual([
      'No released batch has lot code 260201-FZ-01',
    ]);
    expect(await page.errors('Units (line 2)')).toEqual([
      'Only 12 units of lot 260115-SB-02 are left to deliver',
    ]);
    expect(await page.errors('Units (line 1)')).toEqual([]);
    expect(page.text()).toContain('Some fields need attention.');
    expect(await page.value('Lot code (line 1)')).toBe('260201-FZ-01');
    expect(await page.value('Units (line 2)')).toBe('50');
  }, 30_000);

  it('checks the lines in the browser first: a lot listed twice, no units, and sends nothing', async () => {
    const page = await openAs('owner', '/deliveries/new');
    const select = await page.loader.getHarness(MatSelectHarness);
    await select.open();
    await select.clickOptions({ text: 'Larkspur Pantry' });
    await page.fill('Lot code (line 1)', '260201-FZ-01');
    await page.fill('Units (line 1)', '3');
    await page.click(/Add a lot/);
    await page.fill('Lot code (line 2)', '260201-FZ-01');
    await page.click(/Record delivery/);
    await page.harness.fixture.whenStable();

    expect(await page.errors('Lot code (line 2)')).toEqual([]);
    expect(await page.errors('Units (line 2)')).toEqual(['Enter Units as a whole number']);
    page.backend.expectNone((r) => r.method === 'POST');

    await page.fill('Units (line 2)', '2');
    await page.click(/Record delivery/);
    await page.harness.fixture.whenStable();
    expect(await page.errors('Lot code (line 2)')).toEqual([
      'Lot 260201-FZ-01 is listed twice; put all its units on one line',
    ]);
    page.backend.expectNone((r) => r.method === 'POST');

    await (
      await page.loader.getHarness(
        MatButtonHarness.with({ selector: '[aria-label="Remove line 2"]' }),
      )
    ).click();
    await page.click(/Record delivery/);
    const post = await sent(page.backend, (r) => r.method === 'POST');
    expect((post.request.body as { lines: unknown[] }).lines).toEqual([
      { lotCode: '260201-FZ-01', units: 3 },
    ]);
  }, 30_000);

  it('shows a saved delivery read-only to a viewer, with each lot’s product', async () => {
    const backend = await signedInAs('viewer', [
      { path: 'deliveries', children: [] },
      { path: 'deliveries/:id', component: DeliveryPage },
    ]);
    const harness = await RouterTestingHarness.create();
    await harness.navigateByUrl(`/deliveries/${DELIVERY_ID}`);
    (await sent(backend, (r) => r.url === `/api/deliveries/${DELIVERY_ID}`)).flush(DELIVERY);
    (await sent(backend, (r) => r.url === '/api/customers')).flush({
      items: [customer],
      total: 1,
      page: 1,
      pageSize: 100,
    });
    await harness.fixture.whenStable();
    const loader = TestbedHarnessEnvironment.loader(harness.fixture);
    const lotCode = await loader.getHarness(MatInputHarness.with({ value: '260201-FZ-01' }));
    expect(await lotCode.isDisabled()).toBe(true);
    const text = (harness.routeNativeElement as HTMLElement).textContent ?? '';
    expect(text).toContain('Bramble Fizzer');
    expect(text).toContain('Delivery INV-2001 to Larkspur Pantry');
    expect(
      await loader.getAllHarnesses(MatButtonHarness.with({ text: /Save changes|Delete/ })),
    ).toEqual([]);
  });
});
