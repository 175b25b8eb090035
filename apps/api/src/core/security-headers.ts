import { randomBytes } from 'node:crypto';
import type { RequestHandler, Response } from 'express';
import helmet from 'helmet';

/** The per-response nonce that lets the web app's own `<style>` elements through the CSP. */
export const cspNonce = (res: Response): string => String(res.locals['cspNonce']);

/**
 * Security headers on every response, API and web app alike. The Content-Security-Policy allows
 * only what the production build needs: its own scripts (no inline script at all), its own
 * styles, fonts and images, frames and plugin data from its own blob: URLs (the labels PDF preview),
 * and the `<style>` elements Angular adds at run time, which carry the
 * response's nonce (`ngCspNonce` on the root element, see web-app.ts). Reset and invitation
 * tokens travel in URLs, hence `no-referrer`. HSTS and upgrade-insecure-requests only over HTTPS:
 * on a plain-HTTP workshop network they would break the app.
 */
export function securityHeaders(options: { https: boolean }): RequestHandler[] {
  const nonce: RequestHandler = (_req, res, next) => {
    res.locals['cspNonce'] = randomBytes(16).toString('base64');
    next();
  };
  const headers = helmet({
    contentSecurityPolicy: {
      useDefaults: false,
      directives: {
        defaultSrc: ["'self'"],
        scriptSrc: ["'self'"],
        styleSrc: ["'self'", (_req, res) => `'nonce-${cspNonce(res as Response)}'`],
        imgSrc: ["'self'", 'data:', 'blob:'],
        fontSrc: ["'self'"],
        connectSrc: ["'self'"],
        // The print page shows a run's labels PDF in an <iframe> from a blob: URL (the PDF needs
        // the bearer token, so it is fetched, not linked); Chromium's PDF viewer loads the blob
        // as plugin data under the page's policy, so object-src allows blob: and nothing else.
        frameSrc: ["'self'", 'blob:'],
        objectSrc: ['blob:'],
        baseUri: ["'self'"],
        formAction: ["'self'"],
        frameAncestors: ["'none'"],
        ...(options.https ? { upgradeInsecureRequests: [] } : {}),
      },
    },
    referrerPolicy: { policy: 'no-referrer' },
    strictTransportSecurity: options.https
      ? { maxAge: 15_552_000, includeSubDomains: true }
      : false,
    xFrameOptions: { action: 'deny' },
  });
  return [nonce, headers];
}
