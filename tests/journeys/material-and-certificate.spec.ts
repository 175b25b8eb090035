import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type JourneyHarness, startJourneyHarness } from './journey-harness';
import { choose, daysAgo, runId, shownDay, writeSmallPdf } from './material-and-certificate-steps';

describe('journey: a formulator records a fragrance oil and files its certificate', () => {
  let h: JourneyHarness;
  const run = runId();
  const owner = {
    workshop: `Hollowmere Bathworks ${run}`,
    name: 'Ada Marsh',
    email: `owner-${run}@journey.example`,
    password: 'owner-password-123',
  };
  const supplier = `Wrenfield Aromatics ${run}`;
  const fragrance = `Rain on Slate Fragrance Oil ${run}`;
  const issuedOn = daysAgo(30);

  beforeAll(async () => {
    h = await startJourneyHarness();
  });

  afterAll(async () => {
    await h?.close();
  });

  it('creates a supplier and a fragrance with IFRA maxima and allergens, uploads its certificate and sees the status change', async () => {
    const page = await h.newPage();
    await h.signUpWorkshop(page, owner);

    // The materials list starts empty and says what to do.
    await page.getByRole('link', { name: 'Materials', exact: true }).click();
    await page.waitForURL('**/materials');
    await page.getByText('No materials yet.').waitFor();
    await h.screenshot(page, 'material-01-materials-empty');

    // A supplier first, so the material can name it.
    await page.getByRole('link', { name: 'Suppliers' }).click();
    await page.waitForURL('**/suppliers');
    await page.getByRole('link', { name: 'New supplier' }).click();
    await page.waitForURL('**/suppliers/new');
    await page.getByLabel('Supplier name').fill(supplier);
    await page.getByLabel('E-mail').fill('orders@wrenfield-aromatics.example');
    await page.getByRole('button', { name: 'Create supplier' }).click();
    await page.waitForURL(/\/suppliers\/[0-9a-f-]{36}$/);
    await page.getByRole('heading', { name: supplier }).waitFor();
    await h.screenshot(page, 'material-02-supplier-created');

    // The fragrance, with its certificate maxima and allergen declaration.
    await page.getByRole('link', { name: 'Materials' }).first().click();
    await page.waitForURL('**/materials');
    await page.getByRole('link', { name: 'New material' }).click();
    await page.waitForURL('**/materials/new');
    await page.getByLabel('Trade name').fill(fragrance);
    await page.getByLabel('INCI name').fill('Parfum');
    await choose(page, 'Category', 'Fragrance');
    await choose(page, 'Supplier', supplier);

    await page.getByRole('button', { name: 'Add IFRA category' }).click();
    await page.getByLabel('Maximum in product', { exact: true }).fill('2.5');
    await page.getByRole('button', { name: 'Add IFRA category' }).click();
    const limits = page.getByRole('list', { name: 'Maximum per IFRA category' });
    await limits.getByLabel('IFRA category', { exact: true }).nth(1).fill('5A');
    await limits.getByLabel('Maximum in product', { exact: true }).nth(1).fill('1.2');
    await page.getByLabel('Certificate issue date').fill(issuedOn);
    await page.getByLabel('IFRA amendment').fill('51');

    const allergens = page.getByRole('list', { name: 'Declared allergens' });
    await page.getByRole('button', { name: 'Add allergen' }).click();
    await allergens.getByLabel('Allergen', { exact: true }).nth(0).fill('Linalool');
    await allergens.getByLabel('CAS number', { exact: true }).nth(0).fill('78-70-6');
    await allergens.getByLabel('Percent in oil', { exact: true }).nth(0).fill('12');
    await page.getByRole('button', { name: 'Add allergen' }).click();
    await allergens.getByLabel('Allergen', { exact: true }).nth(1).fill('Limonene');
    await allergens.getByLabel('CAS number', { exact: true }).nth(1).fill('5989-27-5');
    await allergens.getByLabel('Percent in oil', { exact: true }).nth(1).fill('8');
    await page.getByLabel('Declaration date').fill(issuedOn);
    await h.screenshot(page, 'material-03-new-fragrance');
    await page.getByRole('button', { name: 'Create material' }).click();

    await page.waitForURL(/\/materials\/[0-9a-f-]{36}$/);
    await page.getByRole('heading', { name: fragrance }).waitFor();
    expect(await page.getByLabel('Maximum in product', { exact: true }).first().inputValue()).toBe(
      '2.5',
    );
    const status = page.getByRole('list', { name: 'Expected documents' });
    await status.getByText('IFRA conformity certificate: Missing').waitFor();
    await status.getByText('Safety data sheet: Missing').waitFor();
    await page.getByText('No documents yet.').waitFor();
    await h.screenshot(page, 'material-04-fragrance-saved');

    // Its IFRA certificate, as a small PDF picked from disk.
    await choose(page, 'Kind', 'IFRA conformity certificate');
    await page.getByLabel('Title').fill('IFRA conformity certificate, amendment 51');
    await page.getByLabel('Issue date', { exact: true }).fill(issuedOn);
    await page.getByLabel('Version').fill('1');
    await page.getByLabel('Document file').setInputFiles(writeSmallPdf('rain-on-slate-ifra.pdf'));
    await page.getByText('rain-on-slate-ifra.pdf').waitFor();
    await page.getByRole('button', { name: 'Upload', exact: true }).click();

    const documents = page.getByRole('table', { name: 'Documents on file' });
    const row = documents.getByRole('row').filter({ hasText: 'rain-on-slate-ifra.pdf' });
    await row.waitFor();
    expect(await row.getByRole('cell').nth(0).textContent()).toContain(
      'IFRA conformity certificate',
    );
    // Dates are written one way, in the browser's locale, in the table and in the status alike.
    const shown = await shownDay(page, issuedOn);
    expect(await row.getByRole('cell').nth(1).textContent()).toContain(shown);
    await status.getByText('IFRA conformity certificate: On file').waitFor();
    await status.getByText(`IFRA certificate issued on ${shown}`).waitFor();
    expect(await status.getByText('Safety data sheet: Missing').count()).toBe(1);
    await h.screenshot(page, 'material-05-certificate-uploaded');

    // The list now shows the fragrance with its supplier.
    await page.getByRole('navigation', { name: 'Breadcrumb' }).getByRole('link').click();
    await page.waitForURL('**/materials');
    const listed = page.getByRole('table', { name: 'Materials' }).getByRole('row', {
      name: new RegExp(fragrance),
    });
    await listed.waitFor();
    expect(await listed.textContent()).toContain(supplier);
    await h.screenshot(page, 'material-06-materials-list');

    expect(h.problems).toEqual([]);
  });
});
