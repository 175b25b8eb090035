import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HttpTestingController } from '@angular/common/http/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { RouterTestingHarness } from '@angular/router/testing';
import type { Batch, Role } from '@batchproof/shared';
import { signedInAs } from '../../auth/signed-in-as';
import { aBatch } from '../production-testing';
import BatchPage from './batch-page';

async function openAs(role: Role, batch: Batch = aBatch()) {
  const backend = await signedInAs(role, [{ path: 'production/:id', component: BatchPage }]);
  const harness = await RouterTestingHarness.create();
  await harness.navigateByUrl(`/production/${batch.id}`, BatchPage);
  await answerBatch(backend, batch);
  await harness.fixture.whenStable();
  const loader = TestbedHarnessEnvironment.loader(harness.fixture);
  const el = harness.routeNativeElement as HTMLElement;
  return { harness, backend, loader, el };
}

/** Answers the batch read, then the read of its formula version (for the net quantity). */
async function answerBatch(backend: HttpTestingController, batch: Batch) {
  const req = await vi.waitFor(() => backend.expectOne(`/api/batches/${batch.id}`));
  req.flush(batch);
  const version = await vi.waitFor(() =>
    backend.expectOne(`/api/formulas/${batch.formulaId}/versions/${batch.version}`),
  );
  version.flush(
    { error: { code: 'not_found', message: 'That version does not exist.' } },
    { status: 404, statusText: 'Not Found' },
  );
}

/** The weigh sheet's rows, in line order. */
const sheetRows = (el: HTMLElement) =>
  Array.from(el.querySelectorAll<HTMLTableRowElement>('bp-weigh-sheet tbody tr'));

// Harness steps on a shared two-core machine take longer than the 5 s default.
const SLOW = 20_000;

describe('BatchPage', () => {
  beforeEach(() => localStorage.clear());

  it(
    'flags a weight outside the tolerance with its deviation, as it is typed',
    async () => {
      const { harness, loader, el } = await openAs('production');
      const weighed = await loader.getHarness(
        MatInputHarness.with({ ancestor: 'bp-weigh-sheet tbody tr:first-child .weighed' }),
      );

      // 510.5 g against 500 g: (510.5 − 500) / 500 = 2.1 %, outside ±2 %.
      await weighed.setValue('510.5');
      await harness.fixture.whenStable();
      const flag = sheetRows(el)[0]!.querySelector('.tolerance')!;
      expect(flag.textContent!.trim()).toContain(
        'Out of tolerance: 2.1 % over the target (allowed ±2 %)',
      );
      expect(flag.getAttribute('aria-live')).toBe('polite');
      expect(el.querySelector('.summary')!.textContent).toContain('1 line is out of tolerance');

      // 510 g is exactly 2 %: the edge is inside the tolerance.
      await weighed.setValue('510');
      await harness.fixture.whenStable();
      expect(sheetRows(el)[0]!.querySelector('.tolerance')!.textContent).toContain(
        'Within ±2 % (+2 %)',
      );
      // The line not weighed says so in words.
      expect(sheetRows(el)[1]!.querySelector('.tolerance')!.textContent).toContain(
        'Not weighed yet',
      );
    },
    SLOW,
  );

  it(
    'puts the messages of a 409 batch_not_ready on the lines they name',
    async () => {
      const { harness, backend, loader, el } = await openAs('formulator');
      await (await loader.getHarness(MatButtonHarness.with({ text: /Release/ }))).click();

      const release = await vi.waitFor(() =>
        backend.expectOne((r) => r.method === 'POST' && r.url === '/api/batches/b1/release'),
      );
      release.flush(
        {
          error: {
            code: 'batch_not_ready',
            message:
              'Batch 261202-SGF-001 is not ready to release: weigh every line and choose the lots that cover each weight.',
            fieldErrors: {
              'lines.0.actualGrams': ['Citric acid, fine: not weighed yet'],
              'lines.1.lotPicks': ['Corn starch: choose the lots the 1500 g came from'],
            },
          },
        },
        { status: 409, statusText: 'Conflict' },
      );
      await harness.fixture.whenStable();

      const [first, second] = sheetRows(el);
      expect(first!.querySelector('mat-error')!.textContent).toContain(
        'Citric acid, fine: not weighed yet',
      );
      expect(first!.textContent).not.toContain('choose the lots');
      expect(second!.querySelector('.field-error')!.textContent).toContain(
        'Corn starch: choose the lots the 1500 g came from',
      );
      expect(el.querySelector('[role="alert"]')!.textContent).toContain('is not ready to release');
      // Focus goes to the first field to put right.
      await vi.waitFor(() =>
        expect(document.activeElement).toBe(first!.querySelector('.weighed input')),
      );
    },
    SLOW,
  );

  it(
    'checks a correction with the shared contract before sending it',
    async () => {
      const released = aBatch({
        state: 'released',
        releasedAt: '2026-12-03T10:00:00.000Z',
        releasedBy: 'Ada Marsh',
        mould: { name: 'Dome 6-cavity', unitsMade: 24 },
      });
      const { harness, backend, loader, el } = await openAs('formulator', released);
      // A released batch is read-only: no inputs on the weigh sheet.
      expect(el.querySelector('bp-weigh-sheet input')).toBeNull();
      expect(el.textContent).toContain('Print labels');
      await (await loader.getHarness(MatButtonHarness.with({ text: /Correct a field/ }))).click();
      const submit = () =>
        loader
          .getHarness(MatButtonHarness.with({ text: /Record the correction/ }))
          .then((b) => b.click());
      const errors = async (label: string) =>
        (
          await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }))
        ).getTextErrors();

      await submit();
      expect(await errors('Field')).toEqual(['Choose the field to correct']);

      const field = await loader.getHarness(
        MatSelectHarness.with({ ancestor: 'bp-amendment-form' }),
      );
      await field.open();
      await field.clickOptions({ text: 'Units made' });
      await (
        await loader.getHarness(
          MatInputHarness.with({ ancestor: 'bp-amendment-form', selector: '[type=number]' }),
        )
      ).setValue('-3');
      const reason = await loader.getHarness(
        MatInputHarness.with({ ancestor: 'bp-amendment-form', selector: 'textarea' }),
      );
      await reason.setValue('Miscount');
      await submit();
      await harness.fixture.whenStable();
      expect(await errors('Reason')).toEqual(['Explain the correction in at least 10 characters']);

      // With a reason long enough, the value is checked by the rule of the field it corrects.
      await reason.setValue('Counted 24 but three were cracked and thrown away');
      await submit();
      await harness.fixture.whenStable();
      expect(await errors('New value')).toEqual(['The units made must be at least 0']);
      backend.expectNone((r) => r.url.endsWith('/amendments'));
    },
    SLOW,
  );
});
