import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import type { DocumentStatus, Role, SupplierDocument } from '@batchproof/shared';
import { signedInAs } from '../../auth/signed-in-as';
import { DocumentPanel } from './document-panel';

const MATERIAL_ID = '6f1c1f4e-3a52-4c1e-9c55-0d0f7a9e2b11';
const CERTIFICATE: SupplierDocument = {
  id: 'd1',
  createdAt: '2026-02-01T00:00:00.000Z',
  updatedAt: '2026-02-01T00:00:00.000Z',
  kind: 'ifra-certificate',
  title: 'IFRA certificate, amendment 51',
  issuedOn: '2026-01-15',
  version: '2',
  materialId: MATERIAL_ID,
  lotId: null,
  filename: 'ifra.pdf',
  mimeType: 'application/pdf',
  sizeBytes: 20480,
  sha256: 'ab'.repeat(32),
};
const STATUS: DocumentStatus = {
  materialId: MATERIAL_ID,
  asOf: '2026-03-01',
  complete: false,
  entries: [
    { kind: 'sds', state: 'missing', latest: null, message: 'No safety data sheet on file' },
    {
      kind: 'ifra-certificate',
      state: 'current',
      latest: CERTIFICATE,
      message: 'IFRA certificate issued on 2026-01-15',
    },
  ],
};

async function openPanel(role: Role, owner: { materialId?: string; lotId?: string }) {
  const backend = await signedInAs(role);
  const fixture = TestBed.createComponent(DocumentPanel);
  for (const [key, value] of Object.entries(owner)) fixture.componentRef.setInput(key, value);
  fixture.detectChanges();
  return { fixture, backend, el: fixture.nativeElement as HTMLElement };
}

describe('DocumentPanel', () => {
  beforeEach(() => localStorage.clear());

  it("lists a material's documents with kind and date, and which expected ones are missing", async () => {
    const p = await openPanel('formulator', { materialId: MATERIAL_ID });
    const list = p.backend.expectOne((r) => r.url === '/api/documents');
    expect(list.request.params.get('materialId')).toBe(MATERIAL_ID);
    list.flush({ items: [CERTIFICATE] });
    p.backend.expectOne(`/api/materials/${MATERIAL_ID}/document-status`).flush(STATUS);
    await p.fixture.whenStable();

    const table = await TestbedHarnessEnvironment.loader(p.fixture).getHarness(MatTableHarness);
    const cells = await table.getCellTextByColumnName();
    expect(cells['document']!.text[0]).toContain('IFRA conformity certificate');
    expect(cells['document']!.text[0].replace(/\s+/g, ' ')).toContain('Version 2 · ifra.pdf 20 KB');
    expect(cells['issuedOn']!.text).toEqual(['Jan 15, 2026']);
    const status = p.el.querySelector('bp-document-status-list')!.textContent!;
    expect(status).toContain('Safety data sheet: Missing');
    expect(status).toContain('No safety data sheet on file');
    expect(status).toContain('IFRA conformity certificate: On file');
    expect(p.el.querySelector('bp-document-upload')).not.toBeNull();
  });

  it("lists a lot's documents without a material status, and offers no upload to production", async () => {
    const p = await openPanel('production', { lotId: 'lot-1' });
    const list = p.backend.expectOne((r) => r.url === '/api/documents');
    expect(list.request.params.get('lotId')).toBe('lot-1');
    list.flush({ items: [] });
    await p.fixture.whenStable();

    p.backend.expectNone((r) => r.url.endsWith('/document-status'));
    expect(p.el.querySelector('bp-document-upload')).toBeNull();
    expect(p.el.textContent).toContain('No documents on file yet.');
  });
});
