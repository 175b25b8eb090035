import { provideHttpClient } from '@angular/common/http';
import { provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { FormControl } from '@angular/forms';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatChipHarness } from '@angular/material/chips/testing';
import type { StoredSubstitute } from '@batchproof/shared';
import { describe, expect, it } from 'vitest';
import { LineSubstitutes } from './line-substitutes';

const TAPIOCA = {
  materialId: 'a0000000-0000-4000-8000-000000000001',
  materialName: 'Tapioca Starch',
};
const ARROWROOT = {
  materialId: 'a0000000-0000-4000-8000-000000000002',
  materialName: 'Arrowroot Powder',
};

async function setup(value: StoredSubstitute[], readOnly = false, message = '') {
  TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
  const fixture = TestBed.createComponent(LineSubstitutes);
  const control = new FormControl<StoredSubstitute[]>(value, { nonNullable: true });
  fixture.componentRef.setInput('control', control);
  fixture.componentRef.setInput('substitutes', control.value);
  fixture.componentRef.setInput('lineNumber', 3);
  fixture.componentRef.setInput('readOnly', readOnly);
  fixture.componentRef.setInput('message', message);
  await fixture.whenStable();
  const loader = TestbedHarnessEnvironment.loader(fixture);
  return { fixture, control, loader };
}

describe('LineSubstitutes', () => {
  it('shows each approved substitute as a chip and removes one with its button', async () => {
    const { control, loader, fixture } = await setup([TAPIOCA, ARROWROOT]);
    const chips = await loader.getAllHarnesses(MatChipHarness);
    expect(await Promise.all(chips.map((c) => c.getText()))).toEqual([
      'Tapioca Starch',
      'Arrowroot Powder',
    ]);
    await (await chips[0]!.getRemoveButton()).click();
    expect(control.value).toEqual([ARROWROOT]);
    expect(control.dirty).toBe(true);
    fixture.componentRef.setInput('substitutes', control.value);
    await fixture.whenStable();
    expect(await loader.getAllHarnesses(MatChipHarness)).toHaveLength(1);
  });

  it('offers to add one, and opens the material picker labelled for the line', async () => {
    const { loader, fixture } = await setup([]);
    const add = await loader.getHarness(MatButtonHarness.with({ text: /Add approved substitute/ }));
    await add.click();
    await fixture.whenStable();
    const host = fixture.nativeElement as HTMLElement;
    expect(host.querySelector('bp-material-picker')?.textContent).toContain(
      'Substitute for line 3',
    );
  });

  it('read-only: chips without remove buttons, nothing to add', async () => {
    const { loader } = await setup([TAPIOCA], true);
    const [chip] = await loader.getAllHarnesses(MatChipHarness);
    await expect(chip!.getRemoveButton()).rejects.toThrow();
    expect(await loader.getAllHarnesses(MatButtonHarness)).toHaveLength(0);
  });

  it('shows the contract’s message for the line’s substitutes', async () => {
    const { fixture } = await setup([TAPIOCA], false, 'A line has at most 5 approved substitutes');
    const alert = (fixture.nativeElement as HTMLElement).querySelector('[role="alert"]');
    expect(alert?.textContent).toContain('A line has at most 5 approved substitutes');
  });
});
