import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import {
  aVersion,
  BICARB,
  CITRIC,
  fieldInput,
  FORMULA_ID,
  nextRequest,
  type OpenedPage,
  openVersionOn,
  textOf,
} from '../formulas-testing';
import FormulaPage from './formula-page';

const ROUTES = [{ path: 'formulas/:id/versions/:n', component: FormulaPage }];
const URL = `/formulas/${FORMULA_ID}/versions/1`;
/** A fizzer, so the live panel also computes the acid/base balance. */
const DRAFT = aVersion([
  { material: BICARB, grams: 200 },
  { material: CITRIC, grams: 100 },
]);

const open = () => openVersionOn(ROUTES, FormulaPage, URL, 'formulator', DRAFT, [BICARB, CITRIC]);

/** The messages shown under the field labelled `label`. */
async function messagesOf(page: OpenedPage, label: string) {
  const field = await page.loader.getHarness(
    MatFormFieldHarness.with({ floatingLabelText: label }),
  );
  return field.getTextErrors();
}

/**
 * Types `value` into the field labelled `label`. The test DOM reads a number input's half-typed
 * "1e" as empty, so the whole value is announced once more as the browser would have it.
 */
async function type(page: OpenedPage, label: string, value: string) {
  const input = await fieldInput(page, label);
  await input.setValue(value);
  await (await input.host()).dispatchEvent('input');
  await page.harness.fixture.whenStable();
}

describe('FormulaPage: the contract’s message beside the field, as it is typed', () => {
  beforeEach(() => localStorage.clear());

  it('says why negative grams are refused beside the field, not “Check this field.”', async () => {
    const page = await open();
    await type(page, 'Grams, line 2', '-5');

    expect(await messagesOf(page, 'Grams, line 2')).toEqual(['Grams cannot be negative']);
  });

  for (const typed of ['1e308', '99999999999']) {
    it(`refuses ${typed} g beside the field before the live panel computes with it`, async () => {
      const page = await open();
      expect(page.el.querySelector('bp-fizz-panel')).not.toBeNull();

      await type(page, 'Grams, line 2', typed);

      expect(await messagesOf(page, 'Grams, line 2')).toEqual([
        'Grams is too large (1,000,000,000 at most)',
      ]);
      expect(page.el.querySelector('bp-fizz-panel')).toBeNull();
      expect(textOf(page, 'bp-live-checks')).toContain('A value in the form is refused');
      expect(textOf(page, 'bp-live-checks')).not.toMatch(/E\+308|99,999,999,999/);

      // Put right, the message goes and the panel computes again.
      await type(page, 'Grams, line 2', '100');
      expect(await messagesOf(page, 'Grams, line 2')).toEqual([]);
      expect(page.el.querySelector('bp-fizz-panel')).not.toBeNull();
    });
  }

  it('refuses an absurd unit mass in the profile beside its field', async () => {
    const page = await open();
    await type(page, 'Unit mass', '1e308');

    expect(await messagesOf(page, 'Unit mass')).toEqual([
      'The unit mass is too large (1,000,000 g at most)',
    ]);
  });

  it('scaling refuses an absurd number of units and clears the previous result', async () => {
    const page = await open();
    const scale = async () => {
      const button = await page.loader.getHarness(
        MatButtonHarness.with({ text: /Scale version 1/ }),
      );
      return button.click();
    };
    await type(page, 'Units', '12');
    const clicked = scale();
    (await nextRequest(page.backend, (r) => r.url.endsWith('/versions/1/scale'))).flush({
      targetGrams: 1800,
      batchGrams: 1854,
      lossPercent: 3,
      lines: [
        { materialId: BICARB.id, materialName: BICARB.tradeName, percent: 66.67, grams: 1236 },
        { materialId: CITRIC.id, materialName: CITRIC.tradeName, percent: 33.33, grams: 618 },
      ],
    });
    await clicked;
    await page.harness.fixture.whenStable();
    expect(page.el.querySelector('table[aria-label="Scaled batch"]')).not.toBeNull();

    await type(page, 'Units', '5000000');

    expect(await messagesOf(page, 'Units')).toEqual(['Make at most 1,000,000 units at a time']);
    expect(page.el.querySelector('table[aria-label="Scaled batch"]')).toBeNull();
    await scale();
    page.backend.expectNone((r) => r.url.endsWith('/scale'));
  });
});
