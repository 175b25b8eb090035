import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import type { Material, Role } from '@batchproof/shared';
import { signedInAs } from '../../auth/signed-in-as';
import { MaterialForm } from './material-form';

const SUPPLIER_ID = '3d1f0a52-2b7e-4c0b-8f2e-9a8b7c6d5e4f';

async function openForm(role: Role, material: Material | null = null) {
  const backend = await signedInAs(role);
  const fixture = TestBed.createComponent(MaterialForm);
  fixture.componentRef.setInput('material', material);
  fixture.detectChanges();
  backend
    .expectOne((r) => r.url === '/api/suppliers')
    .flush({
      items: [
        {
          id: SUPPLIER_ID,
          name: 'Wrenfield Supply',
          contact: null,
          email: null,
          website: null,
          notes: null,
          materialCount: 0,
          createdAt: '2026-01-01T00:00:00.000Z',
          updatedAt: '2026-01-01T00:00:00.000Z',
        },
      ],
      total: 1,
      page: 1,
      pageSize: 100,
    });
  await fixture.whenStable();
  const loader = TestbedHarnessEnvironment.loader(fixture);
  const field = (label: string, index = 0) =>
    loader
      .getAllHarnesses(MatFormFieldHarness.with({ floatingLabelText: label }))
      .then((all) => all[index]!);
  const input = async (label: string, index = 0) =>
    (await (await field(label, index)).getControl(MatInputHarness))!;
  const select = async (label: string) =>
    (await (await field(label)).getControl(MatSelectHarness))!;
  const button = (text: RegExp) => loader.getHarness(MatButtonHarness.with({ text }));
  return { fixture, backend, loader, field, input, select, button };
}

describe('MaterialForm', () => {
  beforeEach(() => localStorage.clear());

  it('sends a fragrance with its IFRA maxima keyed by category and its allergen declaration', async () => {
    const f = await openForm('formulator');
    await (await f.input('Trade name')).setValue('Wrenfield Rain Fragrance Oil');
    await (await f.input('INCI name')).setValue('Parfum');
    await (await f.select('Category')).clickOptions({ text: 'Fragrance' });
    await (await f.select('Supplier')).clickOptions({ text: 'Wrenfield Supply' });

    await (await f.button(/Add IFRA category/)).click();
    expect(await (await f.input('IFRA category')).getValue()).toBe('9');
    await (await f.input('Maximum in product')).setValue('2.5');
    await (await f.input('Certificate issue date')).setValue('2026-01-15');
    await (await f.input('IFRA amendment')).setValue('51');
    await (await f.button(/Add allergen/)).click();
    await (await f.input('Allergen')).setValue('Linalool');
    await (await f.input('CAS number', 1)).setValue('78-70-6');
    await (await f.input('Percent in oil')).setValue('12');
    await (await f.input('Declaration date')).setValue('2026-01-10');
    await (await f.button(/Create material/)).click();

    const req = f.backend.expectOne({ method: 'POST', url: '/api/materials' });
    expect(req.request.body).toMatchObject({
      tradeName: 'Wrenfield Rain Fragrance Oil',
      inci: 'Parfum',
      category: 'fragrance',
      supplierId: SUPPLIER_ID,
      ifraCertificate: {
        maxPercentByIfraCategory: { '9': 2.5 },
        issuedOn: '2026-01-15',
        amendment: 51,
      },
      allergenDeclaration: {
        documentDate: '2026-01-10',
        allergens: [{ inci: 'Linalool', cas: '78-70-6', percent: 12 }],
      },
    });
  });

  it('checks with the shared schema first: messages beside the fields, nothing sent, nothing lost', async () => {
    const f = await openForm('formulator');
    await (await f.input('Trade name')).setValue('Pearl Blend');
    await (await f.button(/Add component/)).click();
    await (await f.input('INCI name', 1)).setValue('Mica');
    await (await f.input('Percent')).setValue('90');
    await (await f.button(/Create material/)).click();

    f.backend.expectNone('/api/materials');
    expect(await (await f.field('INCI name')).getTextErrors()).toEqual(['INCI name is required']);
    expect(await (await f.field('Category')).getTextErrors()).toEqual([
      expect.stringContaining('Choose a category'),
    ]);
    const blend = (f.fixture.nativeElement as HTMLElement).querySelector('bp-blend-editor')!;
    expect(blend.textContent).toContain('10 % still to place');
    expect(await (await f.input('Trade name')).getValue()).toBe('Pearl Blend');

    // The blend's own rule is checked once the fields it rests on are valid.
    await (await f.input('INCI name')).setValue('Mica, Titanium Dioxide');
    await (await f.select('Category')).clickOptions({ text: 'Colourant' });
    await (await f.button(/Create material/)).click();
    f.backend.expectNone('/api/materials');
    expect(blend.querySelector('.list-error')?.textContent).toContain(
      'Components add up to 90 %; they must add up to 100 %',
    );
  });

  it('shows a material read-only, without save or row buttons, to a viewer', async () => {
    const f = await openForm('viewer', {
      id: '0b7f3c52-8a7e-4d0b-9f2e-1c2d3e4f5a6b',
      createdAt: '2026-01-01T00:00:00.000Z',
      updatedAt: '2026-01-01T00:00:00.000Z',
      tradeName: 'Citric Acid',
      inci: 'Citric Acid',
      usName: null,
      cas: '77-92-9',
      ec: null,
      functions: ['pH adjuster'],
      category: 'acid',
      supplierId: null,
      supplierName: null,
      notes: null,
      colourIndex: null,
      nano: false,
      components: [],
      ifraCertificate: null,
      allergenDeclaration: null,
      weightPerVolume: { cup: 220 },
      calibrations: [{ unit: 'cup', amount: 1, grams: 215, measuredOn: null }],
      calibrationSummary: [
        {
          unit: 'cup',
          count: 1,
          averageGrams: 215,
          minGrams: 215,
          maxGrams: 215,
          standardDeviationGrams: 0,
          spreadPercent: 0,
        },
      ],
    });

    expect(await (await f.input('Trade name')).isDisabled()).toBe(true);
    expect(await f.loader.getAllHarnesses(MatButtonHarness.with({ text: /Save|Add/ }))).toEqual([]);
    const text = (f.fixture.nativeElement as HTMLElement).textContent;
    expect(text).toContain('You can read this material');
    expect(text).toContain('Average and spread');
  });
});
