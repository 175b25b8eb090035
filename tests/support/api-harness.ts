import type { Express } from 'express';
import { createApp, type AppDeps } from '../../apps/api/src/app';
import type { RateLimitPolicy } from '../../apps/api/src/auth/rate-limits';
import type { DatabaseHandle } from '../../apps/api/src/db/database';
import { startMailCatcher } from './mail-catcher';
import { openMigratedTestDatabase } from './test-database';

export const TEST_JWT_SECRET = 'test-secret-that-is-at-least-32-characters-long';
export const TEST_APP_URL = 'http://127.0.0.1:4999';

/** The app on the real test database with a real SMTP round trip, for one spec file. */
export interface ApiHarness {
  app: Express;
  handle: DatabaseHandle;
  mail: Awaited<ReturnType<typeof startMailCatcher>>;
  close(): Promise<void>;
}

/** Limits high enough that no spec meets them unless it sets its own. */
const GENEROUS_LIMITS = {
  signInPerAccount: 1000,
  signInPerAddress: 1000,
  passwordResetPerAccount: 1000,
  passwordResetPerAddress: 1000,
  signUpPerAddress: 1000,
  linkTokenPerAddress: 1000,
  refreshPerAddress: 1000,
} satisfies RateLimitPolicy;

export async function startApiHarness(
  options: Pick<AppDeps, 'rateLimits' | 'trustProxy'> = {},
): Promise<ApiHarness> {
  const handle = await openMigratedTestDatabase();
  const mail = await startMailCatcher();
  const app = createApp({
    db: handle.db,
    mailer: mail.mailer,
    jwtSecret: TEST_JWT_SECRET,
    appUrl: TEST_APP_URL,
    rateLimits: { ...GENEROUS_LIMITS, ...options.rateLimits },
    trustProxy: options.trustProxy,
  });
  return {
    app,
    handle,
    mail,
    async close() {
      await mail.close();
      await handle.close();
    },
  };
}
