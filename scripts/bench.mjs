// `npm run bench`: runs every benchmark one after another and prints what each measured.
// Timing targets are reported, never asserted: timing belongs here, not in the test suites. The
// first-load size budget is a fixed number of bytes, so going over it fails the run.
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import path from 'node:path';
import { ensureNodeModules, root } from './lib/provision.mjs';

ensureNodeModules();
const benches = [
  'libs/shared/bench/evaluate-bench.ts',
  'apps/api/bench/list-bench.ts',
  'apps/api/bench/import-bench.ts',
  'apps/api/bench/label-pdf-bench.ts',
  'apps/api/bench/packet-bench.ts',
  'apps/api/bench/public-page-bench.ts',
  'apps/api/bench/trace-bench.ts',
  'scripts/initial-bundle-check.mjs',
];
let failed = false;
for (const bench of benches) {
  if (!existsSync(path.join(root, bench))) continue;
  console.log(`\n== ${bench}`);
  const r = spawnSync(path.join(root, 'node_modules', '.bin', 'tsx'), [bench], {
    cwd: root,
    stdio: 'inherit',
  });
  failed ||= r.status !== 0;
}
process.exit(failed ? 1 : 0);
