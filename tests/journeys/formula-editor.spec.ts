import { randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addLine, createMaterial, declaration, marketFindings } from './formula-editor-steps';
import { expectNoSidewaysOverflow } from './layout-checks';
import { type JourneyHarness, startJourneyHarness } from './journey-harness';

describe('journey: a maker builds a bath formula with live checks, releases it and compares versions', () => {
  let h: JourneyHarness;
  const run = `${Date.now().toString(36)}${randomBytes(3).toString('hex')}`;
  const owner = {
    name: 'Ada Marsh',
    email: `formulas-${run}@journey.example`,
    password: 'owner-password-123',
  };

  beforeAll(async () => {
    h = await startJourneyHarness();
  });

  afterAll(async () => {
    await h?.close();
  });

  it('shows the US ultramarine block and the EU allergens change live, refuses then releases, and compares v1 with v2', async () => {
    const page = await h.newPage({ width: 1366, height: 900 });

    // A fresh workshop, signed up in the browser; data is then arranged over the API.
    await h.signUpWorkshop(page, { ...owner, workshop: `Wrenfield Fizz Co ${run}` });
    const accessToken = await h.apiSignIn(owner.email, owner.password);

    // Materials through the API: a fizzer's base and acid, a mica blend with ultramarines and a
    // fragrance oil whose allergen declaration names linalool and limonene.
    await createMaterial(h, accessToken, {
      tradeName: 'Bicarb, fine grade',
      inci: 'Sodium Bicarbonate',
      category: 'base',
      weightPerVolume: { cup: 220 },
    });
    await createMaterial(h, accessToken, {
      tradeName: 'Citric acid, fine',
      inci: 'Citric Acid',
      category: 'acid',
    });
    await createMaterial(h, accessToken, {
      tradeName: 'Harbour Blue mica',
      inci: 'Mica (and) Titanium Dioxide (and) Ultramarines',
      category: 'colourant',
      functions: ['colorant'],
      components: [
        { inci: 'Mica', percent: 60, colourIndex: 'CI 77019', functions: ['colorant'] },
        { inci: 'Titanium Dioxide', percent: 25, colourIndex: 'CI 77891', functions: ['colorant'] },
        { inci: 'Ultramarines', percent: 15, colourIndex: 'CI 77007', functions: ['colorant'] },
      ],
    });
    await createMaterial(h, accessToken, {
      tradeName: 'Sea Fennel fragrance oil',
      inci: 'Parfum',
      usName: 'Fragrance',
      category: 'fragrance',
      functions: ['fragrance'],
      ifraCertificate: {
        maxPercentByIfraCategory: { '9': 5, '5A': 1.5 },
        issuedOn: '2025-03-01',
        amendment: 51,
      },
      allergenDeclaration: {
        documentDate: '2025-03-01',
        allergens: [
          { inci: 'Linalool', cas: '78-70-6', percent: 12 },
          { inci: 'Limonene', cas: '5989-27-5', percent: 8 },
        ],
      },
    });

    // The formula list starts empty and says what to do.
    await page.getByRole('link', { name: 'Formulas' }).click();
    await page.waitForURL('**/formulas');
    await page.getByText('No formulas yet.').waitFor();
    await h.screenshot(page, 'formulas-01-empty-list');

    // A new fizzer for the US and EU.
    await page.getByRole('button', { name: 'New formula' }).click();
    await page.getByLabel('Formula name').fill('Harbour Blue fizzer');
    await h.screenshot(page, 'formulas-02-new-formula');
    await page.getByRole('button', { name: 'Create formula' }).click();
    await page.waitForURL(/\/formulas\/[0-9a-f-]{36}$/);
    await page.getByText('Version 1 · draft').waitFor();

    // Lines by weight: totals and shares follow every keystroke.
    await addLine(page, 'Bicarb', 'Bicarb, fine grade', '200');
    await addLine(page, 'citric', 'Citric acid, fine', '100');
    expect(await page.getByTestId('total-grams').textContent()).toContain('300');
    expect(await page.getByTestId('line-percent-0').textContent()).toContain('66.67');

    // A trace of fragrance: its allergens stay under the EU rinse-off threshold.
    await addLine(page, 'fennel', 'Sea Fennel', '0.02');
    await declaration(page, 'EU').filter({ hasText: 'Parfum' }).waitFor();
    expect(await declaration(page, 'EU').textContent()).not.toContain('Linalool');

    // More fragrance: linalool and limonene must now be named on the EU label.
    await page.getByLabel('Grams, line 3').fill('3');
    await declaration(page, 'EU').filter({ hasText: 'Linalool' }).waitFor();
    expect(await declaration(page, 'EU').textContent()).toContain('Limonene');
    await h.screenshot(page, 'formulas-03-editor-eu-allergens');

    // The blue mica: ultramarines are not permitted in the US for a product used in the bath.
    const us = marketFindings(page, 'US · United States');
    expect(await us.textContent()).not.toContain('Blocks');
    await addLine(page, 'harbour', 'Harbour Blue mica', '1');
    await us.filter({ hasText: 'Ultramarines' }).waitFor();
    expect(await us.textContent()).toContain('Blocks');
    // 21 CFR 82.3(n) does not name bath products: the block says it rests on Batchproof's reading.
    expect(await us.textContent()).toContain('Interpretation:');
    await h.screenshot(page, 'formulas-04-editor-us-block');

    // Saved and released: the server refuses, naming the block.
    await page.getByRole('button', { name: 'Save draft' }).click();
    await page.getByText('Draft version 1 saved.').waitFor();
    await page.getByRole('button', { name: 'Release', exact: true }).click();
    await page.getByText('Not released.').waitFor();
    await page.getByRole('button', { name: 'Release with a recorded reason…' }).waitFor();
    await h.screenshot(page, 'formulas-05-release-refused');

    // Without the blend there is nothing to block; releasing saves the change first.
    await page.getByRole('button', { name: 'Remove line 4' }).click();
    await marketFindings(page, 'US · United States').filter({ hasText: 'Ultramarines' }).waitFor({
      state: 'detached',
    });
    await page.getByRole('button', { name: 'Release', exact: true }).click();
    await page.getByText('Version 1 · released').waitFor();
    await page.getByText('Version 1 is released').waitFor();
    expect(await page.getByLabel('Grams, line 1').isDisabled()).toBe(true);
    await h.screenshot(page, 'formulas-06-released');

    // A new draft from it, with more fragrance, released too.
    await page.getByRole('button', { name: 'New draft from this version' }).click();
    await page.waitForURL(/\/versions\/2$/);
    await page.getByText('Version 2 · draft').waitFor();
    await page.getByLabel('Grams, line 3').fill('4');

    // Half a cup of bicarb from an old recipe, through the material's weight per cup.
    await page.getByRole('button', { name: 'Add from cups or spoons' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByText('Scooped volumes vary').waitFor();
    await dialog.getByRole('combobox', { name: 'Material' }).fill('bicarb');
    await page.getByRole('option', { name: /Bicarb, fine grade/ }).click();
    await dialog.getByLabel('Amount').fill('0.5');
    await dialog.getByTestId('volume-grams').filter({ hasText: '110' }).waitFor();
    await h.screenshot(page, 'formulas-07-volume-to-grams');
    await dialog.getByRole('button', { name: 'Add line' }).click();
    expect(await page.getByLabel('Grams, line 4').inputValue()).toBe('110');

    await page.getByRole('button', { name: 'Release', exact: true }).click();
    await page.getByText('Version 2 · released').waitFor();

    // Scaling the release to 12 pieces of 150 g plus 3 % loss: 1,800 g + 54 g.
    const scale = page.getByRole('region', { name: 'Scale a batch' });
    await scale.getByLabel('Units', { exact: true }).fill('12');
    await scale.getByLabel('Unit mass').fill('150');
    await scale.getByRole('button', { name: 'Scale version 2' }).click();
    await scale.getByRole('table', { name: 'Scaled batch' }).waitFor();
    expect(await scale.getByText('mix 1,854').count()).toBe(1);
    await h.screenshot(page, 'formulas-08-version-2-released-scaled');

    // Compare version 1 with version 2: the fragrance line changed.
    await page.getByRole('link', { name: 'Compare' }).click();
    await page.waitForURL(/\/compare\?from=1&to=2$/);
    const lines = page.getByRole('table', { name: 'Line changes' });
    await lines.getByRole('row', { name: /Sea Fennel fragrance oil/ }).waitFor();
    const fragrance = (await lines.getByRole('row', { name: /Sea Fennel/ }).textContent()) ?? '';
    expect(fragrance).toMatch(/Changed\s+3 g\s+4 g/);
    // The half cup of bicarb joins the 200 g already there.
    expect(await lines.getByRole('row', { name: /Bicarb/ }).textContent()).toMatch(/200 g\s+310 g/);
    await h.screenshot(page, 'formulas-09-compare');

    // The list shows the formula with its released version.
    await page.getByRole('link', { name: 'Formulas', exact: true }).first().click();
    await page.getByRole('table', { name: 'Formulas' }).getByText('Harbour Blue fizzer').waitFor();
    await h.screenshot(page, 'formulas-10-list');

    // The editor at 360 px: the live checks stack below and nothing sticks out sideways.
    await page.getByRole('link', { name: 'Harbour Blue fizzer' }).click();
    await page.getByText('Version 2 · released').waitFor();
    await page.setViewportSize({ width: 360, height: 740 });
    await page.locator('mat-sidenav').waitFor({ state: 'hidden' });
    await expectNoSidewaysOverflow(page);
    await h.screenshot(page, 'formulas-11-editor-360px');

    // The refused release answers 409, which the browser logs; nothing else went wrong.
    const unexpected = h.problems.filter(
      (p) => !(p.kind === 'console error' && /status of 409/.test(p.detail)),
    );
    expect(unexpected).toEqual([]);
  });
});
