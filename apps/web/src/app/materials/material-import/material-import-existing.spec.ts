import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import type { MaterialImportPreview } from '@batchproof/shared';
import { pickFile } from '../../documents/pick-file';
import { errorInterceptor } from '../../http/error-interceptor';
import { MaterialImport } from './material-import';

/** Two ready rows, the first matching a material already on file. */
const WITH_EXISTING: MaterialImportPreview = {
  fileErrors: [],
  rows: [
    {
      line: 2,
      tradeName: 'Bicarb',
      category: 'base',
      valid: true,
      errors: {},
      existingId: 'm-bicarb',
    },
    { line: 3, tradeName: 'Citric', category: 'acid', valid: true, errors: {}, existingId: null },
  ],
  validCount: 2,
  errorCount: 0,
  existingCount: 1,
};

async function previewed() {
  TestBed.configureTestingModule({
    providers: [
      provideZonelessChangeDetection(),
      provideHttpClient(withInterceptors([errorInterceptor])),
      provideHttpClientTesting(),
    ],
  });
  const fixture = TestBed.createComponent(MaterialImport);
  await fixture.whenStable();
  const el = fixture.nativeElement as HTMLElement;
  const backend = TestBed.inject(HttpTestingController);
  pickFile(el.querySelector('input[type=file]')!, new File(['tradeName\n'], 'm.csv'));
  backend.expectOne('/api/materials/import/preview').flush(WITH_EXISTING);
  await fixture.whenStable();
  const loader = TestbedHarnessEnvironment.loader(fixture);
  const importButton = () => loader.getHarness(MatButtonHarness.with({ text: /Import 2/ }));
  return { fixture, el, backend, loader, importButton };
}

describe('MaterialImport: rows already on file', () => {
  it('marks the rows matching a material on file and offers to update them instead', async () => {
    const o = await previewed();
    expect(o.el.textContent).toMatch(/Bicarb\s*base\s*check_circle\s*Ready\s*already on file/i);
    const update = await o.loader.getHarness(
      MatCheckboxHarness.with({ label: /Update the 1 material\(s\) already on file/ }),
    );
    expect(await update.isChecked()).toBe(false);

    await update.check();
    await (await o.importButton()).click();
    o.backend
      .expectOne({ method: 'POST', url: '/api/materials/import?existing=update' })
      .flush({ imported: 2, ids: ['m-bicarb', 'm-new'], updated: 1 });
  });

  it('adds copies when the maker leaves the box unticked', async () => {
    const o = await previewed();
    await (await o.importButton()).click();
    o.backend
      .expectOne({ method: 'POST', url: '/api/materials/import' })
      .flush({ imported: 2, ids: ['m-copy', 'm-new'], updated: 0 });
  });
});
