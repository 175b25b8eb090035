import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HttpRequest } from '@angular/common/http';
import type { HttpTestingController } from '@angular/common/http/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { RouterTestingHarness } from '@angular/router/testing';
import type { SafetyNotesRecord } from '@batchproof/shared';
import { signedInAs } from '../../auth/signed-in-as';
import { FORMULA_ID, VERSION_ID } from '../assessments-testing';
import SafetyNotesPage from './safety-notes-page';

const URL = `/api/formulas/${FORMULA_ID}/versions/2/safety-notes`;

const sent = (backend: HttpTestingController, match: (r: HttpRequest<unknown>) => boolean) =>
  vi.waitFor(() => backend.expectOne(match));

const RECORD: SafetyNotesRecord = {
  versionId: VERSION_ID,
  notes: {
    physicalChemical: 'White emulsion, pH 5.5',
    stability: '',
    microbiological: '',
    impurities: '',
    packaging: '',
    normalUse: '',
  },
  updatedAt: null,
  updatedByName: null,
};

async function open() {
  const backend = await signedInAs('formulator', [
    { path: 'assessments/notes/:formulaId/:n', component: SafetyNotesPage },
  ]);
  const harness = await RouterTestingHarness.create();
  await harness.navigateByUrl(`/assessments/notes/${FORMULA_ID}/2`);
  (await sent(backend, (r) => r.url === URL && r.method === 'GET')).flush(RECORD);
  await harness.fixture.whenStable();
  const loader = TestbedHarnessEnvironment.loader(harness.fixture);
  const field = (label: RegExp) =>
    loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }));
  return { backend, harness, loader, field };
}

describe('SafetyNotesPage', { timeout: 20_000 }, () => {
  it("saves the maker's notes for Part A items 2–5 and shows the API's refusal beside its field", async () => {
    const page = await open();
    const physical = await (await page.field(/Physical and chemical/)).getControl(MatInputHarness);
    expect(await physical!.getValue()).toBe('White emulsion, pH 5.5');
    const stability = await (await page.field(/^2\. Stability/)).getControl(MatInputHarness);
    await stability!.setValue('  Three months at 40 °C, no separation  ');
    const save = (
      await page.loader.getHarness(MatButtonHarness.with({ text: /Save safety notes/ }))
    ).click();
    const put = await sent(page.backend, (r) => r.url === URL && r.method === 'PUT');
    // Trimmed as the shared schema says.
    expect(put.request.body).toEqual({
      ...RECORD.notes,
      stability: 'Three months at 40 °C, no separation',
    });
    put.flush(
      {
        error: {
          code: 'validation_failed',
          message: 'Check the highlighted fields.',
          fieldErrors: { normalUse: ['Normal and reasonably foreseeable use is too long'] },
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await save;
    expect(await (await page.field(/Normal and reasonably/)).getTextErrors()).toEqual([
      'Normal and reasonably foreseeable use is too long',
    ]);
  });
});
