import type { Page } from 'playwright-core';
import type { JourneyHarness } from './journey-harness';

/** The password every demo member gets in the journeys' seed. */
export const DEMO_PASSWORD = 'demo-password-for-journeys';

/** Signs in through the sign-in page and waits for the demo workshop's home page. */
export async function signIn(h: JourneyHarness, page: Page, email: string): Promise<void> {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL(`${h.baseUrl}/`);
  await page.getByRole('heading', { name: 'Hollowmere Bathworks' }).waitFor();
}

/** Opens a page from the main navigation (through the menu button when it is an overlay). */
export async function openFromNav(page: Page, name: string): Promise<void> {
  await page
    .getByRole('navigation', { name: 'Main' })
    .getByRole('link', { name, exact: true })
    .click();
}
