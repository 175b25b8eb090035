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
  stopClusterOnExit,
} from './lib/provision.mjs';
import { superviseChildren } from './lib/shutdown.mjs';

const apiPort = 3000; // the dev server's proxy (apps/web/proxy.conf.json) points here
const webPort = Number(process.env.PORT ?? 4200);
const smtpPort = Number(process.env.SMTP_PORT ?? 2525);

ensureNodeModules();
const cluster = ensureCluster(Number(process.env.DATABASE_PORT ?? 54329));
// Every way this script ends (Ctrl-C, a crash, a failed seed, a server that dies) stops the
// cluster if this script started it.
stopClusterOnExit(cluster);
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
  spawn(
    path.join(root, 'node_modules', '.bin', 'ng'),
    ['serve', '--host', '127.0.0.1', '--port', String(webPort)],
    {
      cwd: root,
      env,
      stdio: 'inherit',
    },
  ),
];
log(
  `dev servers starting: web http://127.0.0.1:${webPort}, API :${apiPort}; demo password ${demoPassword}`,
);

superviseChildren(children, { log });
