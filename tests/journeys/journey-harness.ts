import { existsSync, mkdirSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { type Browser, type BrowserContext, chromium, type Page } from 'playwright-core';
import { createApp } from '../../apps/api/src/app';
import type { DatabaseHandle } from '../../apps/api/src/db/database';
import { seedDemo } from '../../apps/api/src/seed/demo-seed';
import { firstLink, startMailCatcher } from '../support/mail-catcher';
import { checkLayoutAtWidths } from './layout-checks';
import { openMigratedTestDatabase } from '../support/test-database';

const ROOT = path.resolve(import.meta.dirname, '../..');
const WEB_DIST = path.join(ROOT, 'dist/web/browser');
/** Where screenshots go, `<page>-<width>.png`; `test-output/` is ignored by git. */
export const OUTPUT_DIR = path.join(ROOT, 'test-output/screenshots');

/** Something the browser did that a journey must not allow. */
export interface Problem {
  kind: 'console error' | 'page error' | 'outside request' | 'failed request';
  detail: string;
}

/**
 * The whole product for one journey: the real test database, a mail catcher, the API serving the
 * production web build on a free loopback port, and a headless Debian chromium that records
 * console errors, page errors and any request to a host other than 127.0.0.1.
 */
export interface JourneyHarness {
  /** The app's real URL, also the base of the links the app e-mails. */
  baseUrl: string;
  mail: Awaited<ReturnType<typeof startMailCatcher>>;
  problems: Problem[];
  /** A fresh browser context (its own cookies and storage) with a watched page. */
  newPage(options?: { width?: number; height?: number }): Promise<Page>;
  /**
   * Signs up a fresh workshop in the browser: fills the sign-up form, opens the confirmation link
   * from the mail catcher, confirms, and waits for the workshop's home page.
   */
  signUpWorkshop(page: Page, who: WorkshopOwner): Promise<void>;
  /**
   * Seeds the demo workshop (Hollowmere Bathworks: suppliers, materials, lots, formulas and one
   * member per role, `<role>@hollowmere.example`) with `password`, as `npm start` does.
   */
  seedDemo(password: string): Promise<void>;
  /** Signs in over the API (not the browser) and returns an access token, for arranging data. */
  apiSignIn(email: string, password: string): Promise<string>;
  /**
   * Checks the page as it stands at 360, 768 and 1280 px wide (no sideways overflow, no clipped
   * text) and saves a full-page screenshot of each as `<name>-<width>.png` under the output
   * folder; the window returns to its size. Every page a journey reaches goes through it.
   */
  screenshot(page: Page, name: string): Promise<string[]>;
  close(): Promise<void>;
}

/** Who sets up a workshop in a journey. */
export interface WorkshopOwner {
  workshop: string;
  name: string;
  email: string;
  password: string;
}

export async function startJourneyHarness(): Promise<JourneyHarness> {
  if (!existsSync(path.join(WEB_DIST, 'index.html'))) {
    throw new Error(`No web build at ${WEB_DIST}: run \`npx ng build\` first.`);
  }
  mkdirSync(OUTPUT_DIR, { recursive: true });
  const handle: DatabaseHandle = await openMigratedTestDatabase();
  const mail = await startMailCatcher();

  // Listen first, so the app (and the links it e-mails) knows its real URL.
  const server: Server = createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const app = createApp({
    db: handle.db,
    mailer: mail.mailer,
    jwtSecret: 'journey-secret-that-is-at-least-32-characters',
    appUrl: baseUrl,
    webDist: WEB_DIST,
    rateLimits: { signInPerAccount: 1000, signInPerAddress: 1000, signUpPerAddress: 1000 },
  });
  server.on('request', app);

  const browser: Browser = await chromium.launch({
    executablePath: process.env['CHROMIUM_PATH'] ?? '/usr/bin/chromium',
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
      '--disable-dev-shm-usage',
    ],
  });
  const contexts: BrowserContext[] = [];
  const problems: Problem[] = [];

  return {
    baseUrl,
    mail,
    problems,
    async signUpWorkshop(page, who) {
      await page.goto('/sign-up');
      await page.getByLabel('Workshop name').fill(who.workshop);
      await page.getByLabel('Your name').fill(who.name);
      await page.getByLabel('E-mail').fill(who.email);
      await page.getByLabel('Password').fill(who.password);
      await page.getByRole('button', { name: 'Create workshop' }).click();
      await page.getByText(`We sent a link to ${who.email}`).waitFor();
      const link = firstLink(await mail.waitFor(who.email));
      await page.goto(link);
      await page.getByRole('button', { name: 'Open my workshop' }).click();
      await page.waitForURL(`${baseUrl}/`);
      await page.getByRole('heading', { name: who.workshop }).waitFor();
    },
    async seedDemo(password) {
      await seedDemo(handle.db, password);
    },
    async apiSignIn(email, password) {
      const res = await fetch(`${baseUrl}/api/auth/sign-in`, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ email, password }),
      });
      if (!res.ok) throw new Error(`API sign-in for ${email} answered ${res.status}`);
      return ((await res.json()) as { accessToken: string }).accessToken;
    },
    async newPage({ width = 1280, height = 800 } = {}) {
      const context = await browser.newContext({ viewport: { width, height }, baseURL: baseUrl });
      contexts.push(context);
      const page = await context.newPage();
      page.on('console', (message) => {
        if (message.type() === 'error')
          problems.push({ kind: 'console error', detail: message.text() });
      });
      page.on('pageerror', (error) => problems.push({ kind: 'page error', detail: error.message }));
      page.on('request', (request) => {
        const url = new URL(request.url());
        // The browser's own PDF viewer loads its parts from chrome:// and chrome-extension://.
        const local = ['data:', 'blob:', 'chrome:', 'chrome-extension:'].includes(url.protocol);
        if (!local && url.hostname !== '127.0.0.1') {
          problems.push({ kind: 'outside request', detail: request.url() });
        }
      });
      page.on('requestfailed', (request) => {
        const reason = request.failure()?.errorText ?? 'unknown';
        // A request cut short by the page navigating away is not a failure of the app.
        if (reason !== 'net::ERR_ABORTED') {
          problems.push({ kind: 'failed request', detail: `${request.url()}: ${reason}` });
        }
      });
      return page;
    },
    screenshot: (page, name) => checkLayoutAtWidths(page, name, OUTPUT_DIR),
    async close() {
      for (const context of contexts) await context.close();
      await browser.close();
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await mail.close();
      await handle.close();
    },
  };
}
