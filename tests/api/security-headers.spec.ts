import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../apps/api/src/app';
import {
  startApiHarness,
  TEST_APP_URL,
  TEST_JWT_SECRET,
  type ApiHarness,
} from '../support/api-harness';

let h: ApiHarness;
let web: ReturnType<typeof createApp>;
beforeAll(async () => {
  h = await startApiHarness();
  // A stand-in for the production build: an index.html with the root element, and one script.
  const dist = mkdtempSync(path.join(tmpdir(), 'bp-web-'));
  writeFileSync(
    path.join(dist, 'index.html'),
    '<!doctype html><html><head></head><body><bp-root></bp-root><script src="main.js" type="module"></script></body></html>',
  );
  writeFileSync(path.join(dist, 'main.js'), 'export {};');
  web = createApp({
    db: h.handle.db,
    mailer: h.mail.mailer,
    jwtSecret: TEST_JWT_SECRET,
    appUrl: TEST_APP_URL,
    webDist: dist,
  });
});
afterAll(() => h.close());

/** The CSP header as a map of directive name to its sources. */
function csp(res: request.Response): Map<string, string[]> {
  const header = String(res.headers['content-security-policy'] ?? '');
  return new Map(
    header
      .split(';')
      .map((d) => d.trim().split(/\s+/))
      .filter((parts) => parts[0])
      .map(([name, ...sources]) => [name!, sources]),
  );
}

describe('security headers', () => {
  it.each([
    ['an API answer', '/api/health'],
    ['an API error', '/api/nothing-here'],
    ['the web app', '/formulas'],
    ['a static file of the build', '/main.js'],
  ])('are on %s', async (_what, url) => {
    const res = await request(web).get(url);
    const policy = csp(res);
    expect(policy.get('default-src')).toEqual(["'self'"]);
    // No inline script of any kind, not even by hash or nonce: the build has none.
    expect(policy.get('script-src')).toEqual(["'self'"]);
    // Plugin data and frames only from the page's own blob: URLs (the labels PDF preview).
    expect(policy.get('object-src')).toEqual(['blob:']);
    expect(policy.get('frame-src')).toEqual(["'self'", 'blob:']);
    expect(policy.get('frame-ancestors')).toEqual(["'none'"]);
    expect(policy.get('font-src')).toEqual(["'self'"]);
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    // Reset and invitation tokens travel in URLs: never send them on as a referrer.
    expect(res.headers['referrer-policy']).toBe('no-referrer');
    expect(res.headers['x-frame-options']).toBe('DENY');
    expect(res.headers['x-powered-by']).toBeUndefined();
  });

  it('gives each page load its own style nonce, on the root element Angular reads it from', async () => {
    const loads = await Promise.all([request(web).get('/'), request(web).get('/index.html')]);
    const nonces = loads.map((res) => {
      const styleSrc = csp(res).get('style-src')!;
      expect(styleSrc[0]).toBe("'self'");
      const nonce = /^'nonce-(.+)'$/.exec(styleSrc[1]!)![1]!;
      expect(res.text).toContain(`<bp-root ngCspNonce="${nonce}">`);
      expect(res.headers['cache-control']).toBe('no-cache');
      return nonce;
    });
    expect(nonces[0]).not.toBe(nonces[1]);
  });

  it('sends no HSTS and no upgrade-insecure-requests over plain HTTP, which would break a workshop LAN', async () => {
    const res = await request(web).get('/api/health');
    expect(res.headers['strict-transport-security']).toBeUndefined();
    expect(csp(res).has('upgrade-insecure-requests')).toBe(false);
  });
});
