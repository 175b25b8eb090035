import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD, openFromNav, SECOND_WORKSHOP, signIn, switchWorkshop } from './demo-steps';
import { type JourneyHarness, startJourneyHarness } from './journey-harness';

describe('journey: every page of the demo workshop at phone, tablet and laptop widths', () => {
  let h: JourneyHarness;

  beforeAll(async () => {
    h = await startJourneyHarness();
    await h.seedDemo(DEMO_PASSWORD);
  });

  afterAll(async () => {
    await h?.close();
  });

  // Some 30 pages at three widths each: about a minute on two idle cores, more on a busy machine.
  it('lays out the pages of a workshop in use with nothing sticking out sideways and no clipped text', async () => {
    const page = await h.newPage();

    // The signed-out pages.
    await page.goto('/sign-in');
    await page.getByRole('heading', { name: 'Sign in to your workshop' }).waitFor();
    await h.screenshot(page, 'every-01-sign-in');
    await page.goto('/reset-password');
    await page.getByRole('button').first().waitFor();
    await h.screenshot(page, 'every-02-reset-password');

    await signIn(h, page, 'owner@hollowmere.example');
    // The first focusable element skips the navigation to the page's content.
    await page.keyboard.press('Tab');
    const skip = page.getByRole('link', { name: 'Skip to content' });
    expect(await skip.evaluate((el) => el === document.activeElement)).toBe(true);
    expect(await skip.isVisible()).toBe(true);
    await page.keyboard.press('Enter');
    expect(await page.evaluate(() => document.activeElement?.tagName)).toBe('MAIN');
    await h.screenshot(page, 'every-03-home');

    // Materials: the list, a plain material with spoon weights, a blend, a fragrance, a new one.
    await openFromNav(page, 'Materials');
    await page
      .getByRole('table', { name: 'Materials' })
      .getByText('Sodium Bicarbonate')
      .first()
      .waitFor();
    await h.screenshot(page, 'every-04-materials');
    await page.getByRole('link', { name: 'Sodium Bicarbonate' }).click();
    await page.getByRole('heading', { name: 'Sodium Bicarbonate' }).waitFor();
    await page.getByLabel('Grams per tablespoon').first().waitFor();
    await h.screenshot(page, 'every-05-material-bicarb');
    await page.goBack();
    await page.getByRole('link', { name: 'Midnight Blue Mica Blend' }).click();
    await page.getByRole('heading', { name: 'Midnight Blue Mica Blend' }).waitFor();
    await h.screenshot(page, 'every-06-material-blend');
    await page.goBack();
    await page.getByRole('link', { name: 'Orchard Fog Fragrance Oil' }).click();
    await page.getByRole('heading', { name: 'Orchard Fog Fragrance Oil' }).waitFor();
    await page.getByRole('list', { name: 'Expected documents' }).waitFor();
    await h.screenshot(page, 'every-07-material-fragrance');
    await page.goto('/materials/new');
    // A text field in focus is ringed, not only underlined.
    await page.getByLabel('Trade name').focus();
    const field = page.locator('mat-form-field', { has: page.getByLabel('Trade name') });
    expect(await field.evaluate((el) => getComputedStyle(el).outlineStyle)).toBe('solid');
    await h.screenshot(page, 'every-08-material-new');

    // Suppliers: the list, one supplier, a new one.
    await openFromNav(page, 'Materials');
    await page.getByRole('link', { name: 'Suppliers' }).click();
    await page.getByRole('link', { name: 'Fernbrook Salts & Minerals' }).waitFor();
    await h.screenshot(page, 'every-09-suppliers');
    await page.getByRole('link', { name: 'Fernbrook Salts & Minerals' }).click();
    await page.getByRole('heading', { name: 'Fernbrook Salts & Minerals' }).waitFor();
    await h.screenshot(page, 'every-10-supplier');
    await page.goto('/suppliers/new');
    await page.getByLabel('Supplier name').waitFor();
    await h.screenshot(page, 'every-11-supplier-new');

    // Lots: the list, one lot, goods-in.
    await openFromNav(page, 'Lots');
    await page.getByRole('table', { name: 'Lots' }).getByText('FB-SB-2291').waitFor();
    await h.screenshot(page, 'every-12-lots');
    await page.getByRole('link', { name: 'FB-SB-2291' }).click();
    await page.getByRole('heading', { name: 'Lot FB-SB-2291' }).waitFor();
    await h.screenshot(page, 'every-13-lot');
    await page.goto('/lots/new');
    await page.getByRole('heading', { name: 'Record goods-in' }).waitFor();
    await h.screenshot(page, 'every-14-lot-new');

    // Formulas: the list, a draft with a US block and allergens for four markets, a comparison.
    await openFromNav(page, 'Formulas');
    await page.getByRole('table', { name: 'Formulas' }).getByText('Midnight Bubble Bar').waitFor();
    await h.screenshot(page, 'every-15-formulas');
    await page.getByRole('link', { name: 'Midnight Bubble Bar' }).click();
    await page.getByText('Version 1 · draft').waitFor();
    await page.getByRole('region', { name: 'US · United States findings' }).waitFor();
    // The allergen table keeps all four markets' columns in the live panel.
    const allergens = page.getByRole('table', { name: /allergens/i });
    await allergens.waitFor();
    for (const market of ['EU', 'UK', 'CA']) {
      expect(await allergens.getByRole('columnheader', { name: market }).isVisible()).toBe(true);
    }
    await h.screenshot(page, 'every-16-formula-editor');
    await page.goto(`${page.url()}/compare?from=1&to=1`.replace('/versions/1/compare', '/compare'));
    await page.getByRole('table', { name: 'Line changes' }).waitFor();
    await h.screenshot(page, 'every-17-compare');

    // Labels: print runs and stocks, a new stock, a released formula's product identity.
    await openFromNav(page, 'Labels');
    await page.getByRole('heading', { name: 'Label stocks' }).waitFor();
    await page.getByText('US Letter · 2⅝ × 1 in · 30 per sheet').first().waitFor();
    await h.screenshot(page, 'every-17a-labels');
    await page.goto('/labels/stocks/new');
    await page.getByRole('heading', { name: 'New label stock' }).waitFor();
    await h.screenshot(page, 'every-17b-label-stock-new');
    await openFromNav(page, 'Formulas');
    await page.getByRole('link', { name: 'Rainfall Foaming Fizzer' }).click();
    await page.getByRole('link', { name: 'Product identity' }).click();
    await page.getByRole('heading', { name: 'Product identity' }).waitFor();
    expect(await page.getByLabel('Product name', { exact: true }).inputValue()).toBe(
      'Rainfall Foaming Bath Fizzer',
    );
    await h.screenshot(page, 'every-17c-product-identity');

    // Members and the reference lists.
    await openFromNav(page, 'Workshop');
    await page
      .getByRole('table', { name: 'Workshop members' })
      .getByText('owner@hollowmere.example')
      .waitFor();
    await h.screenshot(page, 'every-18-members');
    await openFromNav(page, 'Reference lists');
    await page.getByRole('heading', { name: 'Reference lists' }).waitFor();
    await h.screenshot(page, 'every-19-reference-lists');
    await page.getByRole('main').getByRole('link').first().click();
    await page.getByRole('columnheader', { name: 'How sure' }).waitFor();
    await h.screenshot(page, 'every-20-reference-list');

    // Safety assessments: the list, the lotion's signed version 1, its safety notes, readiness.
    await openFromNav(page, 'Assessments');
    const signedRow = page
      .getByRole('table', { name: 'Assessments' })
      .getByRole('row')
      .filter({ hasText: 'Everyday Body Lotion' })
      .filter({ has: page.getByRole('cell', { name: '1', exact: true }) });
    await signedRow.waitFor();
    await h.screenshot(page, 'every-22-assessments');
    await signedRow.getByRole('link', { name: 'Everyday Body Lotion' }).click();
    await page
      .getByRole('heading', { name: 'Everyday Body Lotion · version 1', level: 1 })
      .waitFor();
    await page.getByTestId('signed-note').waitFor();
    await h.screenshot(page, 'every-23-assessment-signed');
    await openFromNav(page, 'Formulas');
    await page.getByRole('link', { name: 'Everyday Body Lotion' }).click();
    await page.getByText('Version 2 · released').waitFor();
    await page.getByRole('link', { name: 'Safety notes' }).click();
    await page.getByRole('heading', { level: 1 }).waitFor();
    await page.getByRole('textbox').first().waitFor();
    await h.screenshot(page, 'every-24-safety-notes');
    await openFromNav(page, 'Readiness');
    await page
      .getByRole('region', { name: 'Everyday Body Lotion' })
      .getByRole('article', { name: 'European Union' })
      .waitFor();
    await h.screenshot(page, 'every-25-readiness');

    // An assessor signs in to the other workshop they assess for (where they worked last), and
    // reads the reference lists only: a formula page says why it does not open.
    const assessor = await h.newPage();
    await signIn(h, assessor, 'assessor@hollowmere.example', null);
    await switchWorkshop(assessor, SECOND_WORKSHOP);
    await assessor.goto('/formulas');
    await assessor.getByRole('heading', { name: /is not open to your role/ }).waitFor();
    await h.screenshot(assessor, 'every-21-not-open');
    // Their assessments there: a shared version waiting, a draft with its inputs to fill.
    await openFromNav(assessor, 'Assessments');
    await assessor
      .getByRole('button', { name: /^Start assessment of Driftwood Salt Soak/ })
      .waitFor();
    await h.screenshot(assessor, 'every-26-assessments-assessor');
    await assessor.getByRole('link', { name: 'Low Tide Body Butter' }).click();
    await assessor.getByRole('textbox', { name: 'Assessment conclusion' }).waitFor();
    await h.screenshot(assessor, 'every-27-assessment-draft');

    expect(h.problems).toEqual([]);
  }, 240_000);
});
