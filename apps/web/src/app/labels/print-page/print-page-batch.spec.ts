import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import type { HttpRequest } from '@angular/common/http';
import type { Batch, LabelRunCreate } from '@batchproof/shared';
import {
  aFormula,
  aVersion,
  FORMULA_ID,
  nextRequest,
  openAs,
} from '../../formulas/formulas-testing';
import { aBatch } from '../../production/production-testing';
import { aRun, LETTER_30, ROLL_2X1 } from '../labels-testing';
import PrintPage from './print-page';

// A newer version is released since: the batch still prints from the one it was made of.
const SUPERSEDED = aVersion([], { state: 'superseded', releasedAt: '2026-11-02T10:00:00.000Z' });
const BATCH_ID = 'b0000000-0000-4000-8000-000000000001';
const ROUTES = [
  { path: 'labels/print', component: PrintPage },
  { path: 'production/:id', children: [] },
  { path: 'formulas/:id/identity', children: [] },
];
/** A released batch of the test formula's version 1, as `GET /api/batches/:id` answers it. */
const aReleasedBatch = (fields: Partial<Batch> = {}): Batch =>
  aBatch({
    id: BATCH_ID,
    formulaId: FORMULA_ID,
    version: 1,
    batchCode: '261103-LF-1',
    state: 'released',
    madeOn: '2026-11-03',
    durability: {
      bestBeforeMonth: '2027-11',
      expiresOn: '2027-11-30',
      periodAfterOpeningMonths: 6,
    },
    releasedAt: '2026-11-05T08:00:00.000Z',
    ...fields,
  });

const isCreate = (r: HttpRequest<unknown>) => r.method === 'POST' && r.url === '/api/label-runs';

/** Opens the print page for the batch as production and answers its reads. */
async function openForBatch(batch: Batch) {
  const page = await openAs('production', ROUTES, `/labels/print?batch=${BATCH_ID}`, PrintPage);
  (await nextRequest(page.backend, (r) => r.url === `/api/batches/${BATCH_ID}`)).flush(batch);
  (await nextRequest(page.backend, (r) => r.url === `/api/formulas/${FORMULA_ID}`)).flush(
    aFormula([SUPERSEDED]),
  );
  (
    await nextRequest(page.backend, (r) => r.url === `/api/formulas/${FORMULA_ID}/versions/1`)
  ).flush(SUPERSEDED);
  (await nextRequest(page.backend, (r) => r.url === '/api/label-stocks')).flush({
    items: [LETTER_30, ROLL_2X1],
  });
  await page.harness.fixture.whenStable();
  return page;
}

describe('PrintPage for a batch (?batch=)', () => {
  it('lets production print a released batch with its lot code and expiry fixed', async () => {
    const page = await openForBatch(aReleasedBatch());
    const lot = await page.loader.getHarness(MatInputHarness.with({ selector: '#lotCode' }));
    expect(await lot.getValue()).toBe('261103-LF-1');
    expect(await lot.isDisabled()).toBe(true);
    const host = page.el;
    expect(host.querySelector('h1')?.textContent).toContain('batch 261103-LF-1');

    const make = await page.loader.getHarness(
      MatButtonHarness.with({ text: /Make the labels PDF/ }),
    );
    await make.click();
    const req = await nextRequest(page.backend, isCreate);
    expect(req.request.body).toMatchObject({
      formulaId: FORMULA_ID,
      version: 1,
      batchId: BATCH_ID,
      lotCode: '261103-LF-1',
      expiresOn: '2027-11-30',
    } satisfies Partial<LabelRunCreate>);
    req.flush(aRun({ batchId: BATCH_ID, lotCode: '261103-LF-1' }), {
      status: 201,
      statusText: 'Created',
    });
    await page.harness.fixture.whenStable();
  });

  it('says a draft batch prints once released, and offers no form', async () => {
    const page = await openForBatch(aReleasedBatch({ state: 'draft', releasedAt: null }));
    const host = page.el;
    expect(host.querySelector('[role="alert"]')?.textContent).toContain(
      'Batch 261103-LF-1 is still a draft: its labels print once it is released.',
    );
    expect(host.querySelector('form')).toBeNull();
  });
});
