// `npm test [suite…]`: runs the chosen suites (all when none is named) one after another (each
// uses both cores) and ends with one line `N passed, N failed`. The suites are chosen first and
// only what they need is provisioned: `npm test -- shared` starts no database, installs no
// browser and builds nothing. Ctrl-C stops the running suite and the cluster if this started it.
import { spawn } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, rmSync } from 'node:fs';
import path from 'node:path';
import {
  ensureChromium,
  ensureCluster,
  ensureDatabase,
  ensureNodeModules,
  ensureWebBuilt,
  fail,
  log,
  root,
  stopClusterOnExit,
} from './lib/provision.mjs';
import { handleSignals, signalExitCode } from './lib/shutdown.mjs';
import { chooseSuites } from './lib/test-suites.mjs';

const dbPort = Number(process.env.DATABASE_PORT ?? 54329);
const outDir = path.join(root, 'test-output');

let selection;
try {
  selection = chooseSuites(process.argv.slice(2));
} catch (error) {
  // An unknown suite name: say which ones exist.
  fail(error.message);
}
const { chosen, needs } = selection;

ensureNodeModules();
const env = { ...process.env, FORCE_COLOR: '0' };
if (needs.has('chromium')) env.CHROMIUM_PATH = ensureChromium();
/**
 * Each suite that needs a database gets a fresh one of its own (`batchproof_test_<suite>`): the
 * API specs change the demo workshop (one signs the lotion's version 2), and the journeys must
 * start from the demo as seeded, whatever ran before them.
 */
const databaseUrls = new Map();
if (needs.has('database')) {
  const cluster = ensureCluster(dbPort);
  // Every way this script ends, Ctrl-C included, stops the cluster if this script started it.
  stopClusterOnExit(cluster);
  for (const suite of chosen.filter((s) => s.needs.includes('database')))
    databaseUrls.set(
      suite.name,
      ensureDatabase(cluster, `batchproof_test_${suite.name}`, { fresh: true }),
    );
}
if (needs.has('webBuild')) ensureWebBuilt();
rmSync(outDir, { recursive: true, force: true });
mkdirSync(outDir, { recursive: true });

// Ctrl-C reaches the running suite too (same process group); wait for it to end, then exit,
// which stops the cluster. A second Ctrl-C exits at once.
let current;
let interrupted;
handleSignals((signal) => {
  if (interrupted || !current) process.exit(signalExitCode(signal));
  interrupted = signal;
  log(`${signal}: stopping suite ${current.name}…`);
  current.child.kill(signal);
});

/** Runs one suite to its end; resolves with its exit code. */
function runSuite(suite) {
  const args = suite.ng
    ? ['ng', 'test', '--watch=false']
    : [
        'vitest',
        'run',
        '--config',
        suite.config,
        '--reporter=default',
        '--reporter=json',
        `--outputFile.json=${path.join(outDir, `${suite.name}.json`)}`,
      ];
  const suiteEnv = databaseUrls.has(suite.name)
    ? { ...env, TEST_DATABASE_URL: databaseUrls.get(suite.name) }
    : env;
  const child = spawn('npx', args, { cwd: root, env: suiteEnv, stdio: 'inherit' });
  current = { name: suite.name, child };
  return new Promise((resolve) => {
    child.once('error', () => resolve(1));
    child.once('exit', (code) => resolve(code ?? 1));
  });
}

/** Passed and failed counts from a suite's JSON report. */
function countsOf(suite, exitCode) {
  const reportFile = path.join(outDir, `${suite.name}.json`);
  let passed = 0;
  let failed = 0;
  if (existsSync(reportFile)) {
    const report = JSON.parse(readFileSync(reportFile, 'utf8'));
    passed = report.numPassedTests ?? 0;
    failed = report.numFailedTests ?? 0;
    // A file that fails to load has no tests counted; count it once so it cannot pass silently.
    failed += (report.testResults ?? []).filter(
      (t) => t.status === 'failed' && (t.assertionResults ?? []).length === 0,
    ).length;
  }
  if (exitCode !== 0 && failed === 0) failed = 1; // the runner failed without a report
  if (passed + failed === 0) failed = 1; // a suite that ran no test is a failure, not a pass
  return { passed, failed };
}

let passed = 0;
let failed = 0;
const lines = [];
for (const suite of chosen) {
  log(`suite ${suite.name}…`);
  const started = Date.now();
  const exitCode = await runSuite(suite);
  if (interrupted) process.exit(signalExitCode(interrupted));
  const counts = countsOf(suite, exitCode);
  passed += counts.passed;
  failed += counts.failed;
  const seconds = ((Date.now() - started) / 1000).toFixed(1);
  lines.push(
    `  ${suite.name.padEnd(9)} ${String(counts.passed).padStart(4)} passed ${String(counts.failed).padStart(3)} failed  (${seconds} s)`,
  );
}

console.log(`\n${lines.join('\n')}\n`);
console.log(`${passed} passed, ${failed} failed`);
process.exit(failed === 0 ? 0 : 1);
