import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { errorInterceptor } from '../../http/error-interceptor';
import { pickFile } from '../pick-file';
import { DocumentUpload } from './document-upload';

const MATERIAL_ID = '6f1c1f4e-3a52-4c1e-9c55-0d0f7a9e2b11';

async function openUpload() {
  TestBed.configureTestingModule({
    providers: [
      provideZonelessChangeDetection(),
      provideHttpClient(withInterceptors([errorInterceptor])),
      provideHttpClientTesting(),
    ],
  });
  const fixture = TestBed.createComponent(DocumentUpload);
  fixture.componentRef.setInput('materialId', MATERIAL_ID);
  await fixture.whenStable();
  const loader = TestbedHarnessEnvironment.loader(fixture);
  const el = fixture.nativeElement as HTMLElement;
  return { fixture, loader, el, backend: TestBed.inject(HttpTestingController) };
}

type Upload = Awaited<ReturnType<typeof openUpload>>;

async function fillAndSend(u: Upload, file: File) {
  const inputs = await u.loader.getAllHarnesses(MatInputHarness);
  // Title, issue date, version, in the order the form shows them.
  await inputs[0]!.setValue('Safety data sheet');
  await inputs[1]!.setValue('2026-02-01');
  pickFile(u.el.querySelector('input[type=file]')!, file);
  await u.fixture.whenStable();
  await (await u.loader.getHarness(MatButtonHarness.with({ text: /Upload/ }))).click();
  return u.backend.expectOne({ method: 'POST', url: '/api/documents' });
}

describe('DocumentUpload', () => {
  it('sends the file with its kind, title, issue date and material as multipart form data', async () => {
    const u = await openUpload();
    const req = await fillAndSend(u, new File(['%PDF-1.4\n%%EOF\n'], 'sds.pdf'));

    const body = req.request.body as FormData;
    expect(body.get('kind')).toBe('sds');
    expect(body.get('title')).toBe('Safety data sheet');
    expect(body.get('issuedOn')).toBe('2026-02-01');
    expect(body.get('materialId')).toBe(MATERIAL_ID);
    expect((body.get('file') as File).name).toBe('sds.pdf');
    req.flush(null, { status: 500, statusText: 'Server Error' });
  });

  it('says plainly that a refused file (415) is not a PDF, PNG or JPEG, and keeps what was typed', async () => {
    const u = await openUpload();
    const req = await fillAndSend(u, new File(['MZ not really a pdf'], 'certificate.pdf'));
    req.flush(
      {
        error: {
          code: 'unsupported_media_type',
          message:
            'Upload a PDF, PNG or JPEG file. The file’s contents are not one of these, whatever its name says.',
          fieldErrors: { file: ['Upload a PDF, PNG or JPEG file'] },
        },
      },
      { status: 415, statusText: 'Unsupported Media Type' },
    );
    await u.fixture.whenStable();

    expect(u.el.querySelector('.bp-form-error')?.textContent).toContain(
      'This file is not a PDF, PNG or JPEG, whatever its name says.',
    );
    expect(u.el.querySelector('.file-error')?.textContent).toContain(
      'Upload a PDF, PNG or JPEG file',
    );
    const inputs = await u.loader.getAllHarnesses(MatInputHarness);
    expect(await inputs[0]!.getValue()).toBe('Safety data sheet');
  });

  it('says plainly that a file over the limit (413) is too large', async () => {
    const u = await openUpload();
    const req = await fillAndSend(u, new File(['%PDF-1.4'], 'big.pdf'));
    req.flush(
      { error: { code: 'payload_too_large', message: 'The file is too large.' } },
      { status: 413, statusText: 'Payload Too Large' },
    );
    await u.fixture.whenStable();

    expect(u.el.querySelector('.bp-form-error')?.textContent).toContain(
      'This file is too large. The largest file Batchproof accepts is 10 MB.',
    );
  });

  it('asks for a file and a title before sending anything', async () => {
    const u = await openUpload();
    await (await u.loader.getHarness(MatButtonHarness.with({ text: /Upload/ }))).click();

    u.backend.expectNone('/api/documents');
    expect(u.el.querySelector('.file-error')?.textContent).toContain(
      'Choose a PDF, PNG or JPEG file to upload',
    );
    expect(u.el.textContent).toContain('Title is required');
  });
});
