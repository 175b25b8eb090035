import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import type { HttpRequest } from '@angular/common/http';
import { gtinProblem, type ProductIdentityRecord, type Role } from '@batchproof/shared';
import {
  aFormula,
  aVersion,
  FORMULA_ID,
  nextRequest,
  openAs,
  type OpenedPage,
} from '../../formulas/formulas-testing';
import ProductIdentityPage from './product-identity-page';

const ROUTES = [{ path: 'formulas/:id/identity', component: ProductIdentityPage }];
const URL = `/formulas/${FORMULA_ID}/identity`;
const isPut = (r: HttpRequest<unknown>) =>
  r.method === 'PUT' && r.url === `${URL.replace('/formulas', '/api/formulas')}`;

const EMPTY: ProductIdentityRecord = { formulaId: FORMULA_ID, identity: null, updatedAt: null };
const FILLED: ProductIdentityRecord = {
  formulaId: FORMULA_ID,
  updatedAt: '2026-11-02T10:00:00.000Z',
  identity: {
    productName: 'Lagoon Fizzer',
    productCode: 'LF-150',
    gtin: null,
    shelfLifeMonths: 12,
    periodAfterOpeningMonths: null,
    directions: 'Drop into a warm bath.',
    usAdverseEventContact: { address: null, phone: null, website: 'hollowmere.example/safety' },
    euResponsiblePerson: { name: null, address: null },
    ukResponsiblePerson: { name: null, address: null },
    canadianFrench: { productName: null, warnings: null, directions: null },
  },
};

async function openIdentity(role: Role, record = EMPTY, url = URL) {
  const page = await openAs(role, ROUTES, url, ProductIdentityPage);
  page.backend.expectOne(`/api/formulas/${FORMULA_ID}`).flush(aFormula([aVersion([])]));
  (await nextRequest(page.backend, (r) => r.url === `/api/formulas/${FORMULA_ID}/identity`)).flush(
    record,
  );
  await page.harness.fixture.whenStable();
  return page;
}

const input = (page: OpenedPage, id: string) =>
  page.loader.getHarness(MatInputHarness.with({ selector: `[id="${id}"]` }));

/** The error text under the field whose input has `id`. */
async function errorOf(page: OpenedPage, id: string) {
  const fields = await page.loader.getAllHarnesses(MatFormFieldHarness);
  for (const field of fields) {
    const control = await field.getControl(MatInputHarness);
    if (control && (await (await control.host()).getAttribute('id')) === id) {
      return (await field.getTextErrors()).join(' ');
    }
  }
  throw new Error(`No field ${id}`);
}

describe('ProductIdentityPage', () => {
  beforeEach(() => localStorage.clear());

  it('refuses a GTIN with a wrong check digit and a missing name beside their fields, sending nothing', async () => {
    const page = await openIdentity('formulator');
    await (await input(page, 'productCode')).setValue('LF-150');
    await (await input(page, 'gtin')).setValue('4006381333930');
    await (await input(page, 'shelfLifeMonths')).setValue('12');
    await (await page.loader.getHarness(MatButtonHarness.with({ text: /^save\s*Save$/ }))).click();

    expect(page.backend.match(isPut)).toHaveLength(0);
    // GS1 General Specifications, 7.9: the mod-10 check digit (shared gtinProblem).
    expect(await errorOf(page, 'gtin')).toBe(gtinProblem('4006381333930'));
    expect(await errorOf(page, 'gtin')).toContain('check digit should be 1, not 0');
    expect(await errorOf(page, 'productName')).toBe('Product name is required');
  });

  it("saves the identity as the shared contract reads it, and shows the server's field messages beside their fields", async () => {
    const page = await openIdentity('formulator', FILLED);
    expect(await (await input(page, 'productName')).getValue()).toBe('Lagoon Fizzer');
    await (await input(page, 'euResponsiblePerson.name')).setValue('Marisol Verhoeven');
    await (await input(page, 'euResponsiblePerson.address')).setValue('Nowhere');
    await (await page.loader.getHarness(MatButtonHarness.with({ text: /^save\s*Save$/ }))).click();

    const req = await nextRequest(page.backend, isPut);
    const body = req.request.body as Record<string, unknown>;
    expect(body['productName']).toBe('Lagoon Fizzer');
    expect(body['gtin']).toBeNull();
    expect(body['euResponsiblePerson']).toEqual({ name: 'Marisol Verhoeven', address: 'Nowhere' });
    req.flush(
      {
        error: {
          code: 'validation_failed',
          message: 'Check the highlighted fields.',
          fieldErrors: { 'euResponsiblePerson.address': ['Enter a postal address in the EU'] },
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await page.harness.fixture.whenStable();
    expect(await errorOf(page, 'euResponsiblePerson.address')).toBe(
      'Enter a postal address in the EU',
    );
    expect(await (await input(page, 'euResponsiblePerson.name')).getValue()).toBe(
      'Marisol Verhoeven',
    );
  });

  it('focuses the field the link names, so a refused print run lands on it', async () => {
    await openIdentity('owner', FILLED, `${URL}#euResponsiblePerson.address`);
    await vi.waitFor(() => expect(document.activeElement?.id).toBe('euResponsiblePerson.address'));
  });

  it('shows a viewer the identity without a way to change it', async () => {
    const page = await openIdentity('viewer', FILLED);
    expect(await (await input(page, 'productName')).isDisabled()).toBe(true);
    expect(await page.loader.getAllHarnesses(MatButtonHarness.with({ text: /Save/ }))).toHaveLength(
      0,
    );
    expect(page.el.textContent).toContain('the owner or a formulator changes it');
  });

  it('says it holds unsaved changes once a field is changed', async () => {
    const page = await openIdentity('formulator', FILLED);
    const component = page.harness.routeDebugElement!.componentInstance as ProductIdentityPage;
    expect(component.hasUnsavedChanges()).toBe(false);
    await (await input(page, 'directions')).setValue('Drop into a warm bath; rinse the tub.');
    expect(component.hasUnsavedChanges()).toBe(true);
  });
});
