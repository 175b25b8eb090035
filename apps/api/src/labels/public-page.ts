import { Router, type Response } from 'express';
import type { ComplianceMarket, LabelContent, LabelFieldKey } from '@batchproof/shared';
import { cspNonce } from '../core/security-headers';
import type { Database } from '../db/database';
import { findPublicRun } from './label-runs-repository';

/** A public token: 32 random bytes in base64url, 43 characters. */
const TOKEN = /^[A-Za-z0-9_-]{43}$/;

/** The page's language per market; French fields carry their own. */
const LANG: Record<ComplianceMarket, string> = { US: 'en-US', EU: 'en', UK: 'en-GB', CA: 'en-CA' };
const FRENCH: readonly LabelFieldKey[] = ['productNameFr', 'warningsFr', 'directionsFr'];
const MARKET_NAMES: Record<ComplianceMarket, string> = {
  US: 'United States',
  EU: 'European Union',
  UK: 'United Kingdom',
  CA: 'Canada',
};

/** HTML-escapes text for an element's content or a quoted attribute. */
export function escapeHtml(text: string): string {
  return text.replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!,
  );
}

/** Small, readable from 360 px up; system fonts, nothing fetched. */
const STYLE = `
body{margin:0;font:16px/1.5 system-ui,-apple-system,"Segoe UI",Roboto,sans-serif;color:#1b1b1b;background:#fff}
main{max-width:40rem;margin:0 auto;padding:1rem}
h1{font-size:1.5rem;line-height:1.25;margin:.5rem 0 1rem}
h2{font-size:1rem;margin:1.25rem 0 .25rem}
p{margin:0;white-space:pre-line;overflow-wrap:anywhere}
.warnings{font-weight:700}
nav{display:flex;flex-wrap:wrap;gap:.5rem;margin-bottom:.5rem}
nav a{padding:.5rem .75rem;border:1px solid #666;border-radius:4px;color:#1b1b1b;text-decoration:none}
nav a[aria-current]{background:#1b1b1b;color:#fff}
.caution{margin-top:2rem;padding-top:1rem;border-top:1px solid #ccc;font-size:.9rem}
`;

function page(res: Response, lang: string, title: string, body: string): string {
  return `<!doctype html>
<html lang="${lang}">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="robots" content="noindex">
<title>${escapeHtml(title)}</title>
<style nonce="${escapeHtml(cspNonce(res))}">${STYLE}</style>
</head>
<body><main>
${body}
</main></body>
</html>
`;
}

/** The page of one market's label: its fields in label order and nothing else. */
function labelPage(res: Response, contents: LabelContent[], chosen: LabelContent): string {
  const name = chosen.fields.find((f) => f.key === 'productName')?.text ?? 'Product';
  const nav =
    contents.length > 1
      ? `<nav aria-label="Market">${contents
          .map(
            (c) =>
              `<a href="?market=${c.market}" hreflang="${LANG[c.market]}"${
                c.market === chosen.market ? ' aria-current="page"' : ''
              }>${escapeHtml(MARKET_NAMES[c.market])}</a>`,
          )
          .join('')}</nav>`
      : '';
  const fields = chosen.fields
    .filter((f) => f.key !== 'productName' && f.text.trim() !== '')
    .map((f) => {
      const lang = FRENCH.includes(f.key) ? ' lang="fr-CA"' : '';
      const cls = f.bold ? ' class="warnings"' : '';
      return `<section${lang}><h2>${escapeHtml(f.name)}</h2><p${cls}>${escapeHtml(f.text)}</p></section>`;
    })
    .join('\n');
  const body = `${nav}
<h1>${escapeHtml(name)}</h1>
${fields}
<p class="caution">The maker named above is responsible for this product and its label. Follow the directions and warnings, and ask the maker if anything is unclear.</p>`;
  return page(res, LANG[chosen.market], name, body);
}

function notFoundPage(res: Response) {
  res
    .status(404)
    .type('html')
    .send(
      page(
        res,
        'en',
        'Page not found',
        '<h1>This page is not available</h1>\n<p>The address may be mistyped, or the maker has withdrawn this page.</p>',
      ),
    );
}

/**
 * `/p/:token`: a run's public ingredients page, without sign-in, reached by the QR code on small
 * labels. Plain HTML from the run's stored label content: exactly what the label carries for the
 * chosen market (`?market=`, else the run's first), nothing else of the workshop. A wrong token
 * or a withdrawn page is a plain 404. One lookup on the token's unique index.
 */
export function publicPageRouter(deps: { db: Database }) {
  const router = Router();
  router.get('/:token', async (req, res) => {
    res.set({ 'X-Robots-Tag': 'noindex', 'Cache-Control': 'no-cache' });
    const token = String(req.params.token);
    const run = TOKEN.test(token) ? await findPublicRun(deps.db, token) : undefined;
    if (!run || run.withdrawnAt || run.contents.length === 0) {
      notFoundPage(res);
      return;
    }
    const asked = typeof req.query['market'] === 'string' ? req.query['market'] : '';
    const chosen = run.contents.find((c) => c.market === asked) ?? run.contents[0]!;
    res.type('html').send(labelPage(res, run.contents, chosen));
  });
  return router;
}
