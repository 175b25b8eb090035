import type { Page } from 'playwright-core';
import type { JourneyHarness } from './journey-harness';

/** The password every demo member gets in the journeys' seed. */
export const DEMO_PASSWORD = 'demo-password-for-journeys';

/** The demo workshop every demo member belongs to. */
export const DEMO_WORKSHOP = 'Hollowmere Bathworks';
/** The demo assessor's second workshop, where they worked last when the demo is seeded. */
export const SECOND_WORKSHOP = 'Tidewrack Soap Co.';

/**
 * Signs in through the sign-in page and waits for the home page of the workshop that opens (the
 * one the person worked in last). With `workshop`, waits for that workshop's home page; without,
 * accepts whichever opens. Resolves with the name of the workshop that opened.
 */
export async function signIn(
  h: JourneyHarness,
  page: Page,
  email: string,
  workshop: string | null = DEMO_WORKSHOP,
): Promise<string> {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL(`${h.baseUrl}/`);
  const heading = page
    .getByRole('main')
    .getByRole(
      'heading',
      workshop === null ? { level: 1 } : { level: 1, name: workshop, exact: true },
    );
  await heading.waitFor();
  return ((await heading.textContent()) ?? '').trim();
}

/** The toolbar's workshop switcher (shown to a person in several workshops), named for the active one. */
export const workshopSwitch = (page: Page) =>
  page.getByRole('button', { name: /^Switch workshop: / });

/**
 * Switches to `workshop` from the toolbar's menu and waits for its home page (switching goes
 * home first) with the toolbar naming it; does nothing when it is already the active one.
 */
export async function switchWorkshop(page: Page, workshop: string): Promise<void> {
  const toolbar = workshopSwitch(page);
  if ((await toolbar.getAttribute('aria-label')) === `Switch workshop: ${workshop}`) return;
  await toolbar.click();
  await page
    .getByRole('menu', { name: 'Your workshops' })
    .getByRole('menuitem', { name: new RegExp(`^\\W*${escapeRegExp(workshop)}`) })
    .click();
  await page.getByRole('button', { name: `Switch workshop: ${workshop}` }).waitFor();
  await page
    .getByRole('main')
    .getByRole('heading', { level: 1, name: workshop, exact: true })
    .waitFor();
}

const escapeRegExp = (text: string) => text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');

/** Opens a page from the main navigation (through the menu button when it is an overlay). */
export async function openFromNav(page: Page, name: string): Promise<void> {
  await page
    .getByRole('navigation', { name: 'Main' })
    .getByRole('link', { name, exact: true })
    .click();
}
