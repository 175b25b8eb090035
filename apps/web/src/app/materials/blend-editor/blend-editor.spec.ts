import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { NonNullableFormBuilder } from '@angular/forms';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import type { Material } from '@batchproof/shared';
import { signedInAs } from '../../auth/signed-in-as';
import { MaterialForm } from '../material-form/material-form';
import { MaterialFormModel } from '../material-form/material-form-model';
import { BlendEditor } from './blend-editor';

const MICA_BLEND: Material = {
  id: '0b7f3c52-8a7e-4d0b-9f2e-1c2d3e4f5a6b',
  createdAt: '2026-01-01T00:00:00.000Z',
  updatedAt: '2026-01-01T00:00:00.000Z',
  tradeName: 'Harbour Blue Mica',
  inci: 'Mica, Titanium Dioxide, Ultramarines',
  usName: null,
  cas: null,
  ec: null,
  functions: ['colourant'],
  category: 'colourant',
  supplierId: null,
  supplierName: null,
  notes: null,
  colourIndex: null,
  nano: false,
  components: [
    { inci: 'Mica', colourIndex: 'CI 77019', percent: 70 },
    { inci: 'Ultramarines', colourIndex: 'CI 77007', percent: 30 },
  ],
  ifraCertificate: null,
  allergenDeclaration: null,
  weightPerVolume: {},
  calibrations: [],
  calibrationSummary: [],
};

describe('BlendEditor', () => {
  it('shows the running sum and what is left to reach 100 % as percentages change', async () => {
    TestBed.configureTestingModule({ providers: [provideZonelessChangeDetection()] });
    const model = new MaterialFormModel(TestBed.inject(NonNullableFormBuilder));
    const rows = model.form(null).controls.components;
    rows.push(model.component({ inci: 'Mica', percent: 60 }));
    rows.push(model.component({ inci: 'Titanium Dioxide', percent: 25 }));
    const fixture = TestBed.createComponent(BlendEditor);
    fixture.componentRef.setInput('rows', rows);
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    const sum = () =>
      el.querySelector('[data-testid=blend-sum]')!.textContent!.replace(/\s+/g, ' ');

    expect(sum()).toContain('Sum 85 %');
    expect(sum()).toContain('15 % still to place');

    const loader = TestbedHarnessEnvironment.loader(fixture);
    const percent = await loader.getAllHarnesses(
      MatFormFieldHarness.with({ floatingLabelText: 'Percent' }),
    );
    await ((await percent[1]!.getControl()) as MatInputHarness).setValue('40');
    expect(sum()).toContain('Sum 100 %');
    expect(sum()).toContain('adds up to 100 %');

    // A new row is offered what is left, so the sum stays easy to close.
    await ((await percent[1]!.getControl()) as MatInputHarness).setValue('20');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Add component/ }))).click();
    expect(rows.at(2).controls.percent.value).toBe(20);
    expect(sum()).toContain('Sum 100 %');
  });

  it("shows the server's message about the components beside them and keeps what was typed", async () => {
    const backend = await signedInAs('formulator');
    const fixture = TestBed.createComponent(MaterialForm);
    fixture.componentRef.setInput('material', MICA_BLEND);
    // The supplier picker's read goes out on the first render; answer it before waiting.
    fixture.detectChanges();
    backend
      .expectOne((r) => r.url === '/api/suppliers')
      .flush({
        items: [],
        total: 0,
        page: 1,
        pageSize: 100,
      });
    await fixture.whenStable();
    const loader = TestbedHarnessEnvironment.loader(fixture);

    const name = await loader.getHarness(MatInputHarness.with({ value: 'Harbour Blue Mica' }));
    await name.setValue('Harbour Blue Mica 2');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Save material/ }))).click();
    const req = backend.expectOne({ method: 'PUT', url: `/api/materials/${MICA_BLEND.id}` });
    expect(req.request.body.components).toEqual([
      { inci: 'Mica', colourIndex: 'CI 77019', percent: 70 },
      { inci: 'Ultramarines', colourIndex: 'CI 77007', percent: 30 },
    ]);
    req.flush(
      {
        error: {
          code: 'validation_failed',
          message: 'Some fields need attention.',
          fieldErrors: { components: ['Components add up to 90 %; they must add up to 100 %'] },
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();

    const blend = (fixture.nativeElement as HTMLElement).querySelector('bp-blend-editor')!;
    expect(blend.querySelector('.list-error')?.textContent).toContain(
      'Components add up to 90 %; they must add up to 100 %',
    );
    expect(await name.getValue()).toBe('Harbour Blue Mica 2');
  });
});
