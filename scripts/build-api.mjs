// Bundles the API entry points with esbuild; the shared library is bundled in, npm packages stay
// external and load from node_modules.
import { build } from 'esbuild';

await build({
  entryPoints: {
    main: 'apps/api/src/main.ts',
    seed: 'apps/api/src/seed/seed-main.ts',
    'mail-server': 'apps/api/src/dev-mail/mail-server-main.ts',
    // The worker thread that draws label PDFs; main.js starts it from beside itself.
    'label-pdf-worker': 'apps/api/src/labels/pdf/label-pdf-worker.ts',
  },
  outdir: 'dist/api',
  bundle: true,
  platform: 'node',
  target: 'node20',
  format: 'esm',
  packages: 'external',
  sourcemap: true,
  tsconfig: 'tsconfig.json',
  logLevel: 'warning',
});
