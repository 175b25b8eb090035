import { TestBed } from '@angular/core/testing';
import type { Role } from '@batchproof/shared';
import { signedInAs } from '../../auth/signed-in-as';
import HomePage from './home-page';

async function openHomeAs(role: Role) {
  await signedInAs(role);
  const fixture = TestBed.createComponent(HomePage);
  await fixture.whenStable();
  return fixture.nativeElement as HTMLElement;
}

describe('HomePage', () => {
  beforeEach(() => localStorage.clear());

  it('shows the workshop and the signed-in role', async () => {
    const el = await openHomeAs('production');

    expect(el.querySelector('h1')?.textContent).toContain('Hollowmere Bathworks');
    expect(el.querySelector('[data-testid=signed-in-role]')?.textContent?.trim()).toBe(
      'production',
    );
    expect(el.textContent).toContain('Batch records, weigh sheets, lot picks and label printing.');
  });

  it('suggests inviting people to owners only', async () => {
    expect((await openHomeAs('owner')).textContent).toContain('Invite the people you work with');
    TestBed.resetTestingModule();
    expect((await openHomeAs('viewer')).textContent).not.toContain(
      'Invite the people you work with',
    );
  });

  it('links writers to materials, lots and formulas, and everyone else to reading formulas', async () => {
    const formulator = await openHomeAs('formulator');
    const links = (el: HTMLElement) =>
      Array.from(el.querySelectorAll('.next a')).map((a) => a.getAttribute('href'));
    expect(links(formulator)).toEqual(['/materials', '/lots', '/formulas', '/reference']);
    TestBed.resetTestingModule();
    expect(links(await openHomeAs('production'))).toEqual(['/formulas', '/reference']);
    TestBed.resetTestingModule();
    expect(links(await openHomeAs('assessor'))).toEqual(['/reference']);
  });
});
