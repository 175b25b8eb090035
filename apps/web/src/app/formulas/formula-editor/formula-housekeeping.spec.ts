import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { Router } from '@angular/router';
import type { Formula } from '@batchproof/shared';
import { signedInAs } from '../../auth/signed-in-as';
import { FormulaHousekeeping } from './formula-housekeeping';

const FORMULA: Formula = {
  id: 'f1',
  name: 'Lavender Fizz',
  productType: 'fizzer',
  notes: null,
  versions: [],
  archivedAt: null,
  createdAt: '2026-03-01T10:00:00.000Z',
  updatedAt: '2026-03-01T10:00:00.000Z',
};

async function open() {
  const backend = await signedInAs('owner', [{ path: 'formulas', children: [] }]);
  const fixture = TestBed.createComponent(FormulaHousekeeping);
  fixture.componentRef.setInput('formula', FORMULA);
  await fixture.whenStable();
  const loader = TestbedHarnessEnvironment.loader(fixture);
  const click = async (text: RegExp) =>
    (await loader.getHarness(MatButtonHarness.with({ text }))).click();
  return { backend, fixture, click, el: fixture.nativeElement as HTMLElement };
}

describe('FormulaHousekeeping', () => {
  it('deletes a formula once confirmed and goes back to the list', async () => {
    const o = await open();
    await o.click(/^delete\s*Delete$/);
    await o.click(/Delete for good/);
    o.backend
      .expectOne((r) => r.method === 'DELETE' && r.url === '/api/formulas/f1')
      .flush(null, { status: 204, statusText: 'No Content' });
    await vi.waitFor(() => expect(TestBed.inject(Router).url).toBe('/formulas'));
  });

  it('says why a released formula cannot be deleted, and archives it instead', async () => {
    const o = await open();
    await o.click(/^delete\s*Delete$/);
    await o.click(/Delete for good/);
    const reason =
      'This formula cannot be deleted: a version was released, and a released version stays as ' +
      'the record of what was made. Archive it instead: it leaves the lists, and its versions stay readable.';
    o.backend
      .expectOne((r) => r.method === 'DELETE' && r.url === '/api/formulas/f1')
      .flush(
        { error: { code: 'conflict', message: reason } },
        { status: 409, statusText: 'Conflict' },
      );
    await vi.waitFor(() => expect(o.el.textContent).toContain(reason));

    await o.click(/Archive/);
    o.backend
      .expectOne({ method: 'POST', url: '/api/formulas/f1/archive' })
      .flush({ ...FORMULA, archivedAt: '2026-12-01T09:00:00.000Z' });
    await vi.waitFor(() => expect(o.el.textContent).toContain('Archived 2026-12-01'));
  });
});
