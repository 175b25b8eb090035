import type { Routes } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import type { Role } from '@batchproof/shared';
import lotsRoutes from '../lots/lots.routes';
import LotPage from '../lots/lot-page/lot-page';
import NotOpenPage from './not-open-page/not-open-page';
import { signedInAs } from './signed-in-as';

const ROUTES: Routes = [
  { path: 'lots', children: lotsRoutes },
  { path: 'not-open', component: NotOpenPage },
];

async function open(role: Role, url: string) {
  await signedInAs(role, ROUTES);
  const harness = await RouterTestingHarness.create();
  const component = await harness.navigateByUrl(url);
  return { harness, component, text: () => harness.routeNativeElement?.textContent ?? '' };
}

describe('roleGuard', () => {
  beforeEach(() => localStorage.clear());

  it('explains a page the role may not open: which page, which roles may, what this role can do', async () => {
    const page = await open('viewer', '/lots/new');

    expect(page.component).toBeInstanceOf(NotOpenPage);
    expect(page.text()).toContain('Record goods-in is not open to your role');
    expect(page.text()).toContain(
      'It opens for members whose role is owner, formulator or production.',
    );
    expect(page.text()).toContain('You are signed in as viewer');
    expect(page.text()).toContain('ask an owner of the workshop to change your role');
    expect(page.harness.routeNativeElement?.querySelector('a[href="/"]')).not.toBeNull();
  });

  it('names the lots list to an assessor, who may open none of goods-in', async () => {
    const page = await open('assessor', '/lots');
    expect(page.text()).toContain('Lots is not open to your role');
    expect(page.text()).toContain('owner, formulator, production or viewer');
  });

  it('lets production record goods-in', async () => {
    const page = await open('production', '/lots/new');
    expect(page.component).toBeInstanceOf(LotPage);
    expect(page.text()).toContain('Record goods-in');
  });
});

describe('NotOpenPage', () => {
  beforeEach(() => localStorage.clear());

  it('ignores anything in the address that is not a role', async () => {
    const page = await open('viewer', '/not-open?page=Lots&roles=owner%20admin%20%3Cb%3E');
    expect(page.text()).toContain('It opens for members whose role is owner.');
    expect(page.text()).not.toContain('admin');
  });
});
