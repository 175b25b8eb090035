import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import type { MaterialImportPreview, MaterialImportResult } from '@batchproof/shared';
import { pickFile } from '../../documents/pick-file';
import { errorInterceptor } from '../../http/error-interceptor';
import { MaterialImport } from './material-import';

const WITH_ERRORS: MaterialImportPreview = {
  fileErrors: [],
  rows: [
    { line: 2, tradeName: 'Sea Glass Mica', category: 'colourant', valid: true, errors: {} },
    {
      line: 3,
      tradeName: 'Pearl Blend',
      category: 'colourant',
      valid: false,
      errors: { components: ['Components add up to 90 %; they must add up to 100 %'] },
    },
    {
      line: 4,
      tradeName: '',
      category: 'glitter',
      valid: false,
      errors: {
        tradeName: ['Trade name is required'],
        category: ['"glitter" is not a category. Write one of: Base, Acid, …'],
      },
    },
    { line: 5, tradeName: 'Lavender Oil', category: 'essential-oil', valid: true, errors: {} },
  ],
  validCount: 2,
  errorCount: 2,
};

async function openImport() {
  TestBed.configureTestingModule({
    providers: [
      provideZonelessChangeDetection(),
      provideHttpClient(withInterceptors([errorInterceptor])),
      provideHttpClientTesting(),
    ],
  });
  const fixture = TestBed.createComponent(MaterialImport);
  const imported: MaterialImportResult[] = [];
  fixture.componentInstance.imported.subscribe((r) => imported.push(r));
  await fixture.whenStable();
  const el = fixture.nativeElement as HTMLElement;
  const backend = TestBed.inject(HttpTestingController);
  const loader = TestbedHarnessEnvironment.loader(fixture);
  const importButton = () => loader.getHarness(MatButtonHarness.with({ text: /Import/ }));
  return { fixture, el, backend, loader, imported, importButton };
}

type Opened = Awaited<ReturnType<typeof openImport>>;

async function preview(o: Opened, answer: MaterialImportPreview) {
  pickFile(
    o.el.querySelector('input[type=file]')!,
    new File(['tradeName,inci,category\n'], 'm.csv'),
  );
  const req = o.backend.expectOne({ method: 'POST', url: '/api/materials/import/preview' });
  expect((req.request.body as FormData).get('file')).toBeInstanceOf(File);
  req.flush(answer);
  await o.fixture.whenStable();
}

describe('MaterialImport', () => {
  it('lists the problems by row above the table, by the file’s column and the screen’s words, and keeps Import disabled', async () => {
    const o = await openImport();
    await preview(o, WITH_ERRORS);

    // Outside the table, so no cell width can cut a reason short.
    const list = o.el.querySelector('[aria-label="Rows that need attention"]')!;
    expect(list.closest('table')).toBeNull();
    const rows = [...list.querySelectorAll(':scope > li')].map((li) => li.textContent!.trim());
    expect(rows).toHaveLength(2);
    expect(rows[0]).toContain('Line 3 · Pearl Blend');
    expect(rows[0]).toContain(
      'Blend components (column components): Components add up to 90 %; they must add up to 100 %',
    );
    expect(rows[1]).toContain('Line 4 · no trade name');
    expect(rows[1]).toContain('Trade name (column tradeName): Trade name is required');
    expect(rows[1]).toContain('Category (column category): "glitter" is not a category');
    expect(list.textContent).not.toMatch(/(^|\s)(tradeName|components):/);

    const table = await o.loader.getHarness(MatTableHarness);
    const cells = await table.getCellTextByColumnName();
    // Rows that need attention come first.
    expect(cells['line']!.text).toEqual(['3', '4', '2', '5']);
    const checks = ['Needs attention (1)', 'Needs attention (2)', 'Ready', 'Ready'];
    checks.forEach((check, i) => expect(cells['result']!.text[i]).toContain(check));
    // Categories as the screen names them; a value that is none stays as the file has it.
    expect(cells['category']!.text).toEqual(['Colourant', 'glitter', 'Colourant', 'Essential oil']);
    expect(o.el.querySelector('.counts')?.textContent).toContain('2 row(s) ready');
    expect(await (await o.importButton()).isDisabled()).toBe(true);

    await (await o.importButton()).click();
    o.backend.expectNone('/api/materials/import');
  });

  it('names the required columns and asks for CSV UTF-8 before a file is chosen', async () => {
    const o = await openImport();
    const lead = o.el.querySelector('.lead')!.textContent!;
    expect(lead).toContain('the tradeName, inci and category columns are required');
    expect(lead).toContain('Essential oil');
    expect(lead).toContain('CSV UTF-8');
  });

  it('says how to save the file again when the server refuses it as UTF-16', async () => {
    const o = await openImport();
    pickFile(o.el.querySelector('input[type=file]')!, new File(['\uFEFFx'], 'm.csv'));
    o.backend.expectOne('/api/materials/import/preview').flush(
      {
        error: {
          code: 'validation_failed',
          message: 'This file is saved as UTF-16 ("Unicode text"), which the import cannot read.',
          fieldErrors: { file: ['In Excel, Save As "CSV UTF-8 (Comma delimited)".'] },
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await o.fixture.whenStable();

    const alert = o.el.querySelector('[role=alert]')!.textContent!;
    expect(alert).toContain('This file is saved as UTF-16');
    expect(alert).toContain('In Excel, Save As "CSV UTF-8 (Comma delimited)".');
    expect(await (await o.importButton()).isDisabled()).toBe(true);
  });

  it('keeps Import disabled when the file itself has problems', async () => {
    const o = await openImport();
    await preview(o, {
      fileErrors: ['The file has no "inci" column'],
      rows: [],
      validCount: 0,
      errorCount: 0,
    });

    expect(o.el.textContent).toContain('The file has no "inci" column');
    expect(await (await o.importButton()).isDisabled()).toBe(true);
  });

  it('imports the same file once every row is valid, and says how many came in', async () => {
    const o = await openImport();
    await preview(o, {
      ...WITH_ERRORS,
      rows: [WITH_ERRORS.rows[0]!],
      validCount: 1,
      errorCount: 0,
    });

    const button = await o.importButton();
    expect(await button.isDisabled()).toBe(false);
    expect(await button.getText()).toContain('Import 1 material(s)');
    const clicking = button.click();
    const req = await vi.waitFor(() =>
      o.backend.expectOne({ method: 'POST', url: '/api/materials/import' }),
    );
    req.flush({ imported: 1, ids: ['m1'] });
    await clicking;
    expect(o.imported).toEqual([{ imported: 1, ids: ['m1'] }]);
  });
});
