import type { Express } from 'express';
import { createApp } from '../../apps/api/src/app';
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

export async function startApiHarness(options: { signInLimit?: number } = {}): Promise<ApiHarness> {
  const handle = await openMigratedTestDatabase();
  const mail = await startMailCatcher();
  const app = createApp({
    db: handle.db,
    mailer: mail.mailer,
    jwtSecret: TEST_JWT_SECRET,
    appUrl: TEST_APP_URL,
    signInLimit: options.signInLimit ?? 1000,
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
