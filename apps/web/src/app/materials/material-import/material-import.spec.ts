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
      errors: { tradeName: ['Trade name is required'], category: ['Choose a category: base, …'] },
    },
  ],
  validCount: 1,
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
  it('shows each row that needs attention with its messages and keeps Import disabled', async () => {
    const o = await openImport();
    await preview(o, WITH_ERRORS);

    const table = await o.loader.getHarness(MatTableHarness);
    const cells = await table.getCellTextByColumnName();
    // Rows that need attention come first.
    expect(cells['line']!.text).toEqual(['3', '4', '2']);
    expect(cells['result']!.text[0]).toContain(
      'components: Components add up to 90 %; they must add up to 100 %',
    );
    expect(cells['result']!.text[1]).toContain('tradeName: Trade name is required');
    expect(cells['result']!.text[2]).toContain('Ready');
    expect(o.el.querySelector('.counts')?.textContent).toContain('1 row(s) ready');
    expect(await (await o.importButton()).isDisabled()).toBe(true);

    await (await o.importButton()).click();
    o.backend.expectNone('/api/materials/import');
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
