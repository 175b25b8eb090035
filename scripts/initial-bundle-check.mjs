// Builds the web app (production) into a temporary folder and weighs what the first page load
// fetches, compressed with brotli as a server would send it: the script and module-preload files
// and the stylesheet that index.html names. Fails when that is over the budget, because Angular's
// own budgets in angular.json only weigh raw bytes. Run by `npm run bench`, or on its own:
// node scripts/initial-bundle-check.mjs
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { performance } from 'node:perf_hooks';
import { brotliCompressSync } from 'node:zlib';
import { root } from './lib/provision.mjs';

/** Largest first-load transfer (JavaScript and CSS, brotli), in kB of 1000 bytes as Angular counts. */
const BUDGET_KB = 150;

const out = mkdtempSync(path.join(tmpdir(), 'batchproof-initial-bundle-'));
try {
  const t = performance.now();
  try {
    execFileSync(
      path.join(root, 'node_modules', '.bin', 'ng'),
      ['build', '--configuration', 'production', '--output-path', out],
      { cwd: root, stdio: 'pipe', encoding: 'utf8' },
    );
  } catch (err) {
    // execFileSync throws on a non-zero exit; the build's own output says why.
    console.error(err.stdout ?? '', err.stderr ?? '');
    throw new Error('ng build failed');
  }
  const browser = path.join(out, 'browser');
  const html = readFileSync(path.join(browser, 'index.html'), 'utf8');
  const files = [
    ...new Set(
      [
        ...html.matchAll(/<script[^>]*\ssrc="([^"]+)"/g),
        ...html.matchAll(/<link[^>]*rel="(?:modulepreload|stylesheet)"[^>]*href="([^"]+)"/g),
      ].map((m) => m[1]),
    ),
  ].filter((f) => !/^[a-z]+:/i.test(f));
  // index.html names at most ten chunks to preload (Angular's cap), so follow the static imports
  // (`import"./chunk-X.js"`, `from"./chunk-X.js"`) of every script it names; `import("…")` is lazy.
  const seen = new Set(files);
  const queue = files.filter((f) => f.endsWith('.js'));
  while (queue.length > 0) {
    const code = readFileSync(path.join(browser, queue.shift()), 'utf8');
    for (const [, dep] of code.matchAll(/(?:\bfrom\s*|\bimport\s*)["']\.\/([^"']+\.js)["']/g)) {
      if (!seen.has(dep)) {
        seen.add(dep);
        queue.push(dep);
      }
    }
  }
  const rows = [...seen].map((file) => {
    const bytes = readFileSync(path.join(browser, file));
    return { file, raw: bytes.length, brotli: brotliCompressSync(bytes).length };
  });
  const sum = (list, key) => list.reduce((n, r) => n + r[key], 0);
  const js = rows.filter((r) => r.file.endsWith('.js'));
  const kb = (n) => `${(n / 1000).toFixed(1)} kB`;
  const total = sum(rows, 'brotli');
  console.log(`production build in ${Math.round(performance.now() - t)} ms`);
  console.log(
    `first load: ${rows.length} files, ${kb(sum(rows, 'raw'))} raw, ${kb(total)} brotli ` +
      `(JavaScript ${kb(sum(js, 'brotli'))} brotli in ${js.length} files)`,
  );
  const verdict = total < BUDGET_KB * 1000 ? 'within' : 'OVER';
  console.log(
    `initial JavaScript and CSS, brotli: ${kb(total)} (budget < ${BUDGET_KB} kB: ${verdict})`,
  );
  if (verdict === 'OVER') process.exitCode = 1;
} finally {
  rmSync(out, { recursive: true, force: true });
}
