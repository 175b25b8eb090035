// `npm test`: provisions a fresh test database (and Chromium), builds the web app, runs every
// suite one after another (each uses both cores), and ends with one line `N passed, N failed`.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, rmSync } from 'node:fs';
import path from 'node:path';
import {
  ensureBuilt,
  ensureChromium,
  ensureCluster,
  ensureDatabase,
  ensureNodeModules,
  log,
  root,
} from './lib/provision.mjs';

const dbPort = Number(process.env.DATABASE_PORT ?? 54329);
const outDir = path.join(root, 'test-output');

ensureNodeModules();
const chromium = ensureChromium();
const cluster = ensureCluster(dbPort);
const testDatabaseUrl = ensureDatabase(cluster, 'batchproof_test', { fresh: true });
ensureBuilt();
rmSync(outDir, { recursive: true, force: true });
mkdirSync(outDir, { recursive: true });

const env = {
  ...process.env,
  TEST_DATABASE_URL: testDatabaseUrl,
  CHROMIUM_PATH: chromium,
  FORCE_COLOR: '0',
};
const vitest = (config, name) => ({
  name,
  cmd: 'npx',
  args: [
    'vitest',
    'run',
    '--config',
    config,
    '--reporter=default',
    '--reporter=json',
    `--outputFile.json=${path.join(outDir, `${name}.json`)}`,
  ],
  report: `${name}.json`,
});
const suites = [
  vitest('libs/shared/vitest.config.ts', 'shared'),
  vitest('tests/api/vitest.config.ts', 'api'),
  { name: 'web', cmd: 'npx', args: ['ng', 'test', '--watch=false'], report: 'web.json' },
  vitest('tests/journeys/vitest.config.ts', 'journeys'),
];

const only = process.argv.slice(2);
let passed = 0;
let failed = 0;
const lines = [];
for (const suite of suites) {
  if (only.length && !only.includes(suite.name)) continue;
  log(`suite ${suite.name}…`);
  const started = Date.now();
  const result = spawnSync(suite.cmd, suite.args, { cwd: root, env, stdio: 'inherit' });
  const reportFile = path.join(outDir, suite.report);
  let p = 0;
  let f = 0;
  if (existsSync(reportFile)) {
    const report = JSON.parse(readFileSync(reportFile, 'utf8'));
    p = report.numPassedTests ?? 0;
    f = report.numFailedTests ?? 0;
    // A file that fails to load has no tests counted; count it once so it cannot pass silently.
    const brokenFiles = (report.testResults ?? []).filter(
      (t) => t.status === 'failed' && (t.assertionResults ?? []).length === 0,
    ).length;
    f += brokenFiles;
  }
  if (result.status !== 0 && f === 0) f = 1; // the runner failed without a report
  if (p + f === 0) f = 1; // a suite that ran no test is a failure, not a pass
  passed += p;
  failed += f;
  lines.push(
    `  ${suite.name.padEnd(9)} ${String(p).padStart(4)} passed ${String(f).padStart(3)} failed  (${((Date.now() - started) / 1000).toFixed(1)} s)`,
  );
}

if (cluster.startedHere) cluster.stop();
console.log(`\n${lines.join('\n')}\n`);
console.log(`${passed} passed, ${failed} failed`);
process.exit(failed === 0 ? 0 : 1);
