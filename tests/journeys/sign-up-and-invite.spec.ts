import { randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { firstLink } from '../support/mail-catcher';
import { type JourneyHarness, startJourneyHarness } from './journey-harness';
import { expectNoSidewaysOverflow } from './layout-checks';

describe('journey: a maker sets up a workshop and brings in a formulator', () => {
  let h: JourneyHarness;
  const run = `${Date.now().toString(36)}${randomBytes(3).toString('hex')}`;
  const workshop = `Wrenfield Fizz Co ${run}`;
  const owner = {
    name: 'Ada Marsh',
    email: `owner-${run}@journey.example`,
    password: 'owner-password-123',
  };
  const member = {
    name: 'Tomas Reed',
    email: `formulator-${run}@journey.example`,
    password: 'member-password-456',
  };

  beforeAll(async () => {
    h = await startJourneyHarness();
  });

  afterAll(async () => {
    await h?.close();
  });

  it('signs up, signs out and in, invites a formulator who accepts and lands signed in as formulator', async () => {
    const page = await h.newPage();

    // Sign up a new workshop. The page runs under the strict Content-Security-Policy (no inline
    // script, styles only from the app or with the page's nonce): a violation would be a console
    // error, and the journey fails on any.
    const signUpPage = await page.goto('/sign-up');
    const policy = signUpPage!.headers()['content-security-policy'];
    expect(policy).toContain("script-src 'self';");
    expect(policy).toMatch(/style-src 'self' 'nonce-[^']+';/);
    expect(policy).toContain("frame-ancestors 'none'");
    await page.getByLabel('Workshop name').fill(workshop);
    await page.getByLabel('Your name').fill(owner.name);
    await page.getByLabel('E-mail').fill(owner.email);
    await page.getByLabel('Password').fill(owner.password);
    await h.screenshot(page, '01-sign-up');
    await page.getByRole('button', { name: 'Create workshop' }).click();
    await page.getByText(`We sent a link to ${owner.email}`).waitFor();
    await h.screenshot(page, '01-sign-up-check-your-mail');

    // The confirmation link from the mail creates the workshop and signs the owner in.
    const confirmation = firstLink(await h.mail.waitFor(owner.email));
    expect(confirmation.startsWith(`${h.baseUrl}/confirm-sign-up/`)).toBe(true);
    await page.goto(confirmation);
    await page.getByRole('button', { name: 'Open my workshop' }).click();
    await page.waitForURL(`${h.baseUrl}/`);
    await page.getByRole('heading', { name: workshop }).waitFor();
    expect(await page.getByTestId('signed-in-role').textContent()).toBe('owner');
    await h.screenshot(page, '02-home-owner');

    // Sign out.
    await page.getByRole('button', { name: `Account of ${owner.name}` }).click();
    await page.getByRole('menuitem', { name: 'Sign out', exact: true }).click();
    await page.waitForURL('**/sign-in');
    await page.getByRole('heading', { name: 'Sign in to your workshop' }).waitFor();
    await h.screenshot(page, '03-sign-in');

    // Sign in again.
    await page.getByLabel('E-mail').fill(owner.email);
    await page.getByLabel('Password').fill(owner.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(`${h.baseUrl}/`);
    await page.getByRole('heading', { name: workshop }).waitFor();

    // Invite a formulator from the members page.
    await page.getByRole('link', { name: 'Workshop' }).click();
    await page.waitForURL('**/workshop');
    await page.getByRole('table', { name: 'Workshop members' }).getByText(owner.email).waitFor();
    await page.getByLabel('E-mail', { exact: true }).fill(member.email);
    await page.getByRole('combobox', { name: 'Role', exact: true }).click();
    await page.getByRole('option', { name: /^formulator/ }).click();
    await page.getByRole('button', { name: 'Send invitation' }).click();
    await page.getByRole('list', { name: 'Pending invitations' }).getByText(member.email).waitFor();
    await h.screenshot(page, '04-members-invited');

    // The invitation arrives at the mail catcher with a link into the app.
    const mail = await h.mail.waitFor(member.email);
    const link = firstLink(mail);
    expect(link.startsWith(`${h.baseUrl}/accept-invite/`)).toBe(true);

    // The invitee opens the link in a browser of their own and accepts.
    const invitee = await h.newPage();
    await invitee.goto(link);
    await invitee.getByText(`invited you to ${workshop}`).waitFor();
    expect(await invitee.getByText(owner.name).first().isVisible()).toBe(true);
    await h.screenshot(invitee, '05-accept-invite');
    await invitee.getByLabel('Your name').fill(member.name);
    await invitee.getByLabel('Choose a password').fill(member.password);
    await invitee.getByRole('button', { name: `Join ${workshop}` }).click();
    await invitee.waitForURL(`${h.baseUrl}/`);
    await invitee.getByRole('heading', { name: workshop }).waitFor();
    expect(await invitee.getByTestId('signed-in-role').textContent()).toBe('formulator');
    await h.screenshot(invitee, '06-home-formulator');

    // The same home page at 360 px wide: nothing sticks out sideways.
    await invitee.getByRole('button', { name: 'OK' }).click(); // dismiss the welcome note
    await invitee.setViewportSize({ width: 360, height: 740 });
    await invitee.getByRole('button', { name: 'Open the navigation' }).waitFor();
    await invitee.locator('mat-sidenav').waitFor({ state: 'hidden' }); // the overlay has slid away
    await expectNoSidewaysOverflow(invitee);
    await h.screenshot(invitee, '07-home-formulator-360px');

    expect(h.problems).toEqual([]);
  });
});
