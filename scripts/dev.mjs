// `npm run dev`: the same provisioning as `npm start`, then the Angular dev server (with its
// /api proxy) and the API under `tsx watch`, both reloading on change, plus the fake mail server.
import { spawn, spawnSync } from 'node:child_process';
import path from 'node:path';
import {
  dataRoot,
  ensureCluster,
  ensureDatabase,
  ensureNodeModules,
  fail,
  log,
  persistentSecret,
  root,
} from './lib/provision.mjs';

const apiPort = 3000; // the dev server's proxy (apps/web/proxy.conf.json) points here
const webPort = Number(process.env.PORT ?? 4200);
const smtpPort = Number(process.env.SMTP_PORT ?? 2525);

ensureNodeModules();
const cluster = ensureCluster(Number(process.env.DATABASE_PORT ?? 54329));
const demoPassword = process.env.DEMO_PASSWORD || persistentSecret('demo-password', 9);
const env = {
  ...process.env,
  NODE_ENV: 'development',
  PORT: String(apiPort),
  DATABASE_URL: ensureDatabase(cluster, 'batchproof'),
  JWT_SECRET: process.env.JWT_SECRET ?? persistentSecret('jwt-secret', 48),
  APP_URL: `http://127.0.0.1:${webPort}`,
  SMTP_PORT: String(smtpPort),
  MAILBOX_DIR: path.join(dataRoot, 'mailbox'),
  MIGRATIONS_DIR: path.join(root, 'drizzle'),
  DEMO_PASSWORD: demoPassword,
};

const tsx = path.join(root, 'node_modules', '.bin', 'tsx');
const seed = spawnSync(tsx, ['apps/api/src/seed/seed-main.ts'], {
  cwd: root,
  env,
  stdio: 'inherit',
});
if (seed.status !== 0) fail('Seeding the demo workshop failed (see above).');

const children = [
  spawn(tsx, ['apps/api/src/dev-mail/mail-server-main.ts'], { cwd: root, env, stdio: 'inherit' }),
  spawn(tsx, ['watch', 'apps/api/src/main.ts'], { cwd: root, env, stdio: 'inherit' }),
  spawn('npx', ['ng', 'serve', '--host', '127.0.0.1', '--port', String(webPort)], {
    cwd: root,
    env,
    stdio: 'inherit',
  }),
];
log(
  `dev servers starting: web http://127.0.0.1:${webPort}, API :${apiPort}; demo password ${demoPassword}`,
);

let stopping = false;
function stop() {
  if (stopping) return;
  stopping = true;
  for (const child of children) if (child.exitCode === null) child.kill('SIGTERM');
  Promise.all(
    children.map((c) => (c.exitCode !== null ? null : new Promise((r) => c.once('exit', r)))),
  ).then(() => {
    if (cluster.startedHere) cluster.stop();
    process.exit(0);
  });
}
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
