import { existsSync } from 'node:fs';
import path from 'node:path';
import cookieParser from 'cookie-parser';
import express, { type Express } from 'express';
import { authRouter, meRouter } from './auth/auth-router';
import { createAuthenticator } from './auth/authenticate';
import { createRateLimits, type RateLimitPolicy } from './auth/rate-limits';
import { apiNotFound, errorHandler } from './core/error-handler';
import { securityHeaders } from './core/security-headers';
import { webApp } from './core/web-app';
import type { Database } from './db/database';
import { healthRouter } from './health/health-router';
import type { Mailer } from './mail/mailer';
import { membersRouter } from './members/members-router';
import { referenceRouter } from './reference/reference-router';
import { documentsRouter } from './documents/documents-router';
import { formulasRouter } from './formulas/formulas-router';
import { lotsRouter } from './lots/lots-router';
import { materialsRouter } from './materials/materials-router';
import { suppliersRouter } from './suppliers/suppliers-router';
import { evaluationsRouter } from './evaluations/evaluations-router';
import { attentionRouter } from './attention/attention-router';
import { labelStocksRouter } from './labels/label-stocks-router';
import { labelRunsRouter } from './labels/label-runs-router';
import { productIdentityRouter } from './labels/product-identity-router';
import { publicPageRouter } from './labels/public-page';
import { workshopRouter } from './workshop/workshop-router';
import { batchesRouter } from './batches/batches-router';
import { customersRouter } from './deliveries/customers-router';
import { deliveriesRouter } from './deliveries/deliveries-router';
import { traceRouter } from './trace/trace-router';
import { recallsRouter } from './recalls/recalls-router';
import { complaintsRouter } from './complaints/complaints-router';
import { assessmentSharesRouter } from './assessments/assessment-shares-router';
import { assessmentsRouter } from './assessments/assessments-router';
import { safetyNotesRouter } from './assessments/safety-notes-router';
import { readinessRouter } from './readiness/readiness-router';
import { auditRouter } from './audit/audit-router';

/** Everything the app needs from outside; tests pass their own. */
export interface AppDeps {
  db: Database;
  mailer: Mailer;
  jwtSecret: string;
  appUrl: string;
  accessTokenSeconds?: number;
  refreshTokenDays?: number;
  /** Overrides of the rate-limit policy's numbers (auth/rate-limits.ts). */
  rateLimits?: Partial<RateLimitPolicy>;
  /**
   * Express's `trust proxy`: which proxy's X-Forwarded-For to believe for the client address.
   * Off unless configured, so a client cannot pick its own address for the rate limits.
   */
  trustProxy?: boolean | number | string;
  /** Folder of the built web app to serve with an SPA fallback; omitted in API-only tests. */
  webDist?: string;
  version?: string;
}

/** Builds the Express app: API routes under /api, the web app (when built) everywhere else. */
export function createApp(deps: AppDeps): Express {
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', deps.trustProxy ?? false);
  app.set('query parser', 'extended');

  const authn = createAuthenticator(deps.db, deps.jwtSecret);
  const config = {
    jwtSecret: deps.jwtSecret,
    accessTokenSeconds: deps.accessTokenSeconds ?? 900,
    refreshTokenDays: deps.refreshTokenDays ?? 14,
    appUrl: deps.appUrl,
    secureCookies: deps.appUrl.startsWith('https:'),
  };

  app.use(securityHeaders({ https: config.secureCookies }));

  const api = express.Router();
  api.use(express.json({ limit: '1mb' }));
  api.use(cookieParser());
  api.use((_req, res, next) => {
    res.set('Cache-Control', 'no-store');
    next();
  });
  api.use('/health', healthRouter(deps.db, deps.version ?? '0.1.0'));
  api.use(
    '/auth',
    authRouter({
      db: deps.db,
      mailer: deps.mailer,
      authn,
      limits: createRateLimits(deps.rateLimits),
      config,
    }),
  );
  api.use('/me', meRouter({ db: deps.db, authn }));
  api.use(
    '/members',
    membersRouter({ db: deps.db, mailer: deps.mailer, authn, appUrl: deps.appUrl }),
  );
  api.use('/reference', referenceRouter({ db: deps.db, authn }));
  api.use('/evaluations', evaluationsRouter({ authn }));
  // Routers of the formulator's workspace (suppliers, materials, documents, lots, formulas) mount here.
  api.use('/suppliers', suppliersRouter({ db: deps.db, authn }));
  api.use('/materials', materialsRouter({ db: deps.db, authn }));
  api.use('/documents', documentsRouter({ db: deps.db, authn }));
  api.use('/lots', lotsRouter({ db: deps.db, authn }));
  api.use('/formulas', productIdentityRouter({ db: deps.db, authn }));
  api.use('/formulas', safetyNotesRouter({ db: deps.db, authn }));
  api.use('/formulas', formulasRouter({ db: deps.db, authn }));
  api.use('/attention', attentionRouter({ db: deps.db, authn }));
  api.use('/label-stocks', labelStocksRouter({ db: deps.db, authn }));
  api.use('/label-runs', labelRunsRouter({ db: deps.db, authn, appUrl: deps.appUrl }));
  api.use('/workshop', workshopRouter({ db: deps.db, authn }));
  // Production and recall.
  const production = { db: deps.db, authn, mailer: deps.mailer, appUrl: deps.appUrl };
  api.use('/batches', batchesRouter(production));
  api.use('/customers', customersRouter(production));
  api.use('/deliveries', deliveriesRouter(production));
  api.use('/trace', traceRouter(production));
  api.use('/recalls', recallsRouter(production));
  api.use('/complaints', complaintsRouter(production));
  api.use('/audit-events', auditRouter(production));
  // Safety assessment and market readiness.
  api.use('/assessment-shares', assessmentSharesRouter(production));
  api.use('/assessments', assessmentsRouter(production));
  api.use('/readiness', readinessRouter(production));
  api.use(apiNotFound);
  api.use(errorHandler);
  app.use('/api', api);
  // The public ingredients pages: no sign-in, before the web app's fallback.
  app.use('/p', publicPageRouter({ db: deps.db }));

  if (deps.webDist && existsSync(path.join(deps.webDist, 'index.html'))) {
    app.use(webApp(deps.webDist));
  }
  app.use(errorHandler);
  return app;
}
