import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import type { Role } from '@batchproof/shared';
import { nextRequest, openAs } from '../../formulas/formulas-testing';
import { WorkshopLabelDetails } from './workshop-label-details';

const ROUTES = [{ path: 'workshop', component: WorkshopLabelDetails }];

async function openDetails(role: Role, url = '/workshop') {
  const page = await openAs(role, ROUTES, url, WorkshopLabelDetails);
  (await nextRequest(page.backend, (r) => r.url === '/api/workshop/label-details')).flush({
    name: 'Hollowmere Bathworks',
    address: null,
  });
  await page.harness.fixture.whenStable();
  return page;
}

const address = (page: Awaited<ReturnType<typeof openDetails>>) =>
  page.loader.getHarness(MatInputHarness.with({ selector: '[id="workshop.address"]' }));

describe('WorkshopLabelDetails', () => {
  beforeEach(() => localStorage.clear());

  it('lets the owner enter the business address labels print, checked with the shared schema', async () => {
    const page = await openDetails('owner');
    const save = await page.loader.getHarness(MatButtonHarness.with({ text: /Save/ }));
    await save.click();
    expect(page.backend.match((r) => r.method === 'PUT')).toHaveLength(0);
    expect(page.el.textContent).toContain('Business address is required');

    await (await address(page)).setValue('4 Mill Lane, Hollowmere HM1 2AB');
    await save.click();
    const req = await nextRequest(page.backend, (r) => r.method === 'PUT');
    expect(req.request.url).toBe('/api/workshop/label-details');
    expect(req.request.body).toEqual({
      name: 'Hollowmere Bathworks',
      address: '4 Mill Lane, Hollowmere HM1 2AB',
    });
  });

  it('shows other members the address read-only', async () => {
    const page = await openDetails('formulator');
    expect(await (await address(page)).isDisabled()).toBe(true);
    expect(await page.loader.getAllHarnesses(MatButtonHarness.with({ text: /Save/ }))).toHaveLength(
      0,
    );
    expect(page.el.textContent).toContain("The workshop's owner changes these.");
  });
});
