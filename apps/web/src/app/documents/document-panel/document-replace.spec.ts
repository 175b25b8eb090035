import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import type { SupplierDocument } from '@batchproof/shared';
import { signedInAs } from '../../auth/signed-in-as';
import { pickFile } from '../pick-file';
import { DocumentPanel } from './document-panel';

const MATERIAL_ID = '6f1c1f4e-3a52-4c1e-9c55-0d0f7a9e2b11';
const doc = (id: string, title: string, extra: Partial<SupplierDocument>): SupplierDocument => ({
  id,
  createdAt: '2026-02-01T00:00:00.000Z',
  updatedAt: '2026-02-01T00:00:00.000Z',
  kind: 'ifra-certificate',
  title,
  issuedOn: '2026-01-15',
  version: null,
  materialId: MATERIAL_ID,
  lotId: null,
  filename: 'ifra.pdf',
  mimeType: 'application/pdf',
  sizeBytes: 20480,
  sha256: 'ab'.repeat(32),
  replacesId: null,
  supersededById: null,
  archivedAt: null,
  ...extra,
});
const D1 = '0d5c2f7e-1b3a-4c8d-9e2f-000000000001';
const D2 = '0d5c2f7e-1b3a-4c8d-9e2f-000000000002';
const OLD = doc(D1, 'IFRA certificate, amendment 50', { supersededById: D2 });
const CURRENT = doc(D2, 'IFRA certificate, amendment 51', { replacesId: D1 });

async function openPanel() {
  const backend = await signedInAs('formulator');
  const fixture = TestBed.createComponent(DocumentPanel);
  fixture.componentRef.setInput('materialId', MATERIAL_ID);
  fixture.detectChanges();
  backend.expectOne((r) => r.url === '/api/documents').flush({ items: [CURRENT, OLD] });
  backend.expectOne(`/api/materials/${MATERIAL_ID}/document-status`).flush({
    materialId: MATERIAL_ID,
    asOf: '2026-03-01',
    complete: true,
    entries: [],
  });
  await fixture.whenStable();
  const loader = TestbedHarnessEnvironment.loader(fixture);
  const el = fixture.nativeElement as HTMLElement;
  const click = async (text: RegExp | string) =>
    (await loader.getHarness(MatButtonHarness.with({ text }))).click();
  const clickLabelled = async (label: string) =>
    (
      await loader.getHarness(MatButtonHarness.with({ selector: `[aria-label="${label}"]` }))
    ).click();
  return { backend, fixture, loader, el, click, clickLabelled };
}

describe('DocumentPanel: replacing and archiving documents', () => {
  it('shows a replaced document as superseded, and uploads a newer one in place of the current one', async () => {
    const p = await openPanel();
    expect(p.el.textContent).toMatch(/amendment 50\s*superseded/);

    await p.clickLabelled('Replace, archive or delete IFRA certificate, amendment 51');
    await p.click(/Replace with a newer one/);
    expect(p.el.textContent).toContain('Replacing “IFRA certificate, amendment 51”');

    const inputs = await p.loader.getAllHarnesses(MatInputHarness);
    await inputs[0]!.setValue('IFRA certificate, amendment 52');
    await inputs[1]!.setValue('2026-02-20');
    pickFile(p.el.querySelector('input[type=file]')!, new File(['%PDF-1.4\n%%EOF\n'], 'new.pdf'));
    await p.fixture.whenStable();
    await p.click(/Upload/);
    const body = p.backend.expectOne({ method: 'POST', url: '/api/documents' }).request
      .body as FormData;
    expect(body.get('replacesId')).toBe(D2);
    expect(body.get('kind')).toBe('ifra-certificate');
  });

  it('archives a document from its row, and lists archived ones only when asked', async () => {
    const p = await openPanel();
    await p.clickLabelled('Replace, archive or delete IFRA certificate, amendment 51');
    await p.click(/Archive/);
    p.backend
      .expectOne({ method: 'POST', url: `/api/documents/${D2}/archive` })
      .flush({ ...CURRENT, archivedAt: '2026-03-01T09:00:00.000Z' });
    const reread = await vi.waitFor(() =>
      p.backend.expectOne((r) => r.method === 'GET' && r.url === '/api/documents'),
    );
    expect(reread.request.params.has('includeArchived')).toBe(false);
  });
});
