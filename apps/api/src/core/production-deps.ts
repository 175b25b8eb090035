import type { Authenticator } from '../auth/authenticate';
import type { Database } from '../db/database';
import type { Mailer } from '../mail/mailer';

/** What the routers of production and recall need from the app. */
export interface ProductionDeps {
  db: Database;
  authn: Authenticator;
  mailer: Mailer;
  appUrl: string;
}
