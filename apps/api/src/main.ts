import path from 'node:path';
import { createApp } from './app';
import { applyMigrations, openDatabase } from './db/database';
import { loadEnv } from './env';
import { createSmtpMailer } from './mail/mailer';
import { syncReferenceData } from './reference/reference-sync';

/** Starts the API (and the built web app) on HOST:PORT after applying migrations. */
async function main() {
  const env = loadEnv();
  const handle = openDatabase(env.DATABASE_URL, env.DATABASE_POOL_SIZE);
  await applyMigrations(handle.db, path.resolve(env.MIGRATIONS_DIR));
  const referenceRowCount = await syncReferenceData(handle.db);
  console.log(`[api] reference lists synced (${referenceRowCount} rows)`);
  const mailer = createSmtpMailer({
    host: env.SMTP_HOST,
    port: env.SMTP_PORT,
    from: env.MAIL_FROM,
  });
  const app = createApp({
    db: handle.db,
    mailer,
    jwtSecret: env.JWT_SECRET,
    appUrl: env.APP_URL,
    accessTokenSeconds: env.ACCESS_TOKEN_SECONDS,
    refreshTokenDays: env.REFRESH_TOKEN_DAYS,
    rateLimits: { signInPerAccount: env.SIGN_IN_LIMIT },
    trustProxy: env.TRUST_PROXY,
    webDist: env.WEB_DIST,
  });
  const server = app.listen(env.PORT, env.HOST, () => {
    console.log(`[api] listening on http://${env.HOST}:${env.PORT}`);
  });
  const stop = () => {
    server.close(() => {
      mailer.close();
      void handle.close().then(() => process.exit(0));
    });
    setTimeout(() => process.exit(0), 3000).unref();
  };
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}

main().catch((err: unknown) => {
  console.error('[api] could not start:', err instanceof Error ? err.message : err);
  process.exit(1);
});
