// `npm start`: everything a fresh machine needs, then the app on one port.
import { spawn, spawnSync } from 'node:child_process';
import path from 'node:path';
import {
  dataRoot,
  ensureBuilt,
  ensureCluster,
  ensureDatabase,
  ensureNodeModules,
  fail,
  log,
  persistentSecret,
  root,
  stopClusterOnExit,
} from './lib/provision.mjs';
import { superviseChildren } from './lib/shutdown.mjs';

const port = Number(process.env.PORT ?? 3000);
const dbPort = Number(process.env.DATABASE_PORT ?? 54329);
const smtpPort = Number(process.env.SMTP_PORT ?? 2525);

ensureNodeModules();
// From here on, every way this script ends (Ctrl-C, a crash, a failed build or seed, a server
// that dies) stops the cluster if this script started it.
const cluster = ensureCluster(dbPort);
stopClusterOnExit(cluster);
const databaseUrl = ensureDatabase(cluster, 'batchproof');
ensureBuilt();

const demoPassword = process.env.DEMO_PASSWORD || persistentSecret('demo-password', 9);
const appUrl = process.env.APP_URL ?? `http://127.0.0.1:${port}`;
const env = {
  ...process.env,
  NODE_ENV: 'production',
  PORT: String(port),
  DATABASE_URL: databaseUrl,
  JWT_SECRET: process.env.JWT_SECRET ?? persistentSecret('jwt-secret', 48),
  APP_URL: appUrl,
  SMTP_PORT: String(smtpPort),
  MAILBOX_DIR: path.join(dataRoot, 'mailbox'),
  WEB_DIST: path.join(root, 'dist', 'web', 'browser'),
  MIGRATIONS_DIR: path.join(root, 'drizzle'),
  DEMO_PASSWORD: demoPassword,
};

const seed = spawnSync('node', ['dist/api/seed.js'], { cwd: root, env, stdio: 'inherit' });
if (seed.status !== 0) fail('Seeding the demo workshop failed (see above).');

const children = [
  spawn('node', ['dist/api/mail-server.js'], { cwd: root, env, stdio: 'inherit' }),
  spawn('node', ['--enable-source-maps', 'dist/api/main.js'], { cwd: root, env, stdio: 'inherit' }),
];

const supervisor = superviseChildren(children, { log });

// Print the sign-in details once the API answers.
const deadline = Date.now() + 30_000;
async function announce() {
  try {
    const res = await fetch(`http://127.0.0.1:${port}/api/health`);
    if (res.ok) {
      console.log(`
  Batchproof is running at ${appUrl}

  Demo sign-ins (workshop: Hollowmere Bathworks), password: ${demoPassword}
    owner@hollowmere.example        formulator@hollowmere.example
    production@hollowmere.example   assessor@hollowmere.example
    viewer@hollowmere.example

  The assessor also assesses for a second workshop, Tidewrack Soap Co., and opens it on
  sign-in (switch workshop from the toolbar). Its owner, same password:
    owner@tidewrack.example

  E-mails the app sends (invitations, password resets) go to the local fake mail
  server on 127.0.0.1:${smtpPort}; read them with:  npm run mail

  Press Ctrl-C to stop the app, the mail server and the database.
`);
      return;
    }
  } catch {
    // Not listening yet; try again shortly.
  }
  if (Date.now() < deadline && !supervisor.isStopping()) setTimeout(announce, 300);
}
announce();
