import { readFileSync } from 'node:fs';
import path from 'node:path';
import express, { Router, type RequestHandler } from 'express';
import { cspNonce } from './security-headers';

/**
 * Serves the built web app: its files as they are, and index.html for every other path (the SPA
 * fallback) with this response's CSP nonce on the root element, where Angular reads it for the
 * `<style>` elements it adds (`ngCspNonce`). index.html is never served from the static folder,
 * which would send it without the nonce.
 */
export function webApp(webDist: string): Router {
  const root = path.resolve(webDist);
  const template = readFileSync(path.join(root, 'index.html'), 'utf8');
  if (!template.includes('<bp-root')) {
    throw new Error(`${root}/index.html has no <bp-root> element to carry the CSP nonce.`);
  }
  const index: RequestHandler = (_req, res) => {
    res.set('Cache-Control', 'no-cache');
    res.type('html').send(template.replace('<bp-root', `<bp-root ngCspNonce="${cspNonce(res)}"`));
  };
  const router = Router();
  router.get('/index.html', index);
  router.use(express.static(root, { index: false, maxAge: '1h' }));
  router.get('/{*splat}', index);
  return router;
}
