import type { Request, RequestHandler } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import { AppError } from '../core/app-error';

/**
 * How many requests of each kind one key may make in {@link RATE_LIMIT_WINDOW_MS}. "Per address"
 * is the client's IP address as Express sees it: the socket's, unless `trust proxy` names the
 * proxy in front (see `TRUST_PROXY` in env.ts), so a forged X-Forwarded-For changes nothing.
 */
export interface RateLimitPolicy {
  /** Failed sign-ins for one e-mail, from anywhere: slows guessing one account's password. */
  signInPerAccount: number;
  /** Failed sign-ins from one address, over all e-mails: slows trying many accounts. */
  signInPerAddress: number;
  /** Reset requests for one e-mail: each sends a mail, so this also stops mail bombing. */
  passwordResetPerAccount: number;
  /** Reset requests from one address, over all e-mails. */
  passwordResetPerAddress: number;
  /** Sign-ups from one address (each sends a mail). */
  signUpPerAddress: number;
  /** Uses of a link token from one address: invitation preview and acceptance, reset, sign-up confirmation. */
  linkTokenPerAddress: number;
  /**
   * Refreshes and workshop switches from one address (both issue a session); every open tab
   * refreshes every few minutes, so this is generous.
   */
  refreshPerAddress: number;
}

/** Every limit counts over the same window. */
export const RATE_LIMIT_WINDOW_MS = 15 * 60_000;

/** Limits in production; a shared workshop network counts as one address, hence the headroom. */
export const DEFAULT_RATE_LIMITS: RateLimitPolicy = {
  signInPerAccount: 10,
  signInPerAddress: 50,
  passwordResetPerAccount: 3,
  passwordResetPerAddress: 20,
  signUpPerAddress: 10,
  linkTokenPerAddress: 30,
  refreshPerAddress: 300,
};

type Keyed = 'address' | 'account';

/** The e-mail a request names, normalised as the schemas do; undefined when there is none. */
function accountOf(req: Request): string | undefined {
  const email: unknown = (req.body as { email?: unknown } | undefined)?.email;
  return typeof email === 'string' && email.trim() ? email.trim().toLowerCase() : undefined;
}

function limiter(
  limit: number,
  keyedBy: Keyed,
  message: string,
  options: { onlyFailures?: boolean } = {},
): RequestHandler {
  return rateLimit({
    windowMs: RATE_LIMIT_WINDOW_MS,
    limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    // A successful sign-in is not an attack: only refused attempts use up the allowance.
    skipSuccessfulRequests: options.onlyFailures ?? false,
    // A request without an e-mail is refused by validation anyway; the address limit still applies.
    skip: keyedBy === 'account' ? (req) => accountOf(req) === undefined : undefined,
    keyGenerator: (req) =>
      keyedBy === 'account' ? accountOf(req)! : ipKeyGenerator(req.ip ?? 'unknown'),
    // X-Forwarded-For is ignored on purpose unless a proxy is configured; no warning for that.
    validate: { xForwardedForHeader: false },
    handler: (_req, _res, next) => next(new AppError(429, 'rate_limited', message)),
  });
}

/**
 * The one rate-limit policy of the API: each auth route takes its limiters from here, so the
 * window, the key (address or account), the 429 envelope and the headers are the same everywhere.
 * Limiters keep their counts in memory, per app instance.
 */
export function createRateLimits(overrides: Partial<RateLimitPolicy> = {}) {
  const p = { ...DEFAULT_RATE_LIMITS, ...overrides };
  const signInMessage = 'Too many sign-in attempts. Wait a few minutes and try again.';
  const manyRequests = 'Too many requests of this kind. Wait a few minutes and try again.';
  return {
    signIn: [
      limiter(p.signInPerAddress, 'address', signInMessage, { onlyFailures: true }),
      limiter(p.signInPerAccount, 'account', signInMessage, { onlyFailures: true }),
    ],
    passwordReset: [
      limiter(p.passwordResetPerAddress, 'address', manyRequests),
      limiter(p.passwordResetPerAccount, 'account', manyRequests),
    ],
    signUp: [limiter(p.signUpPerAddress, 'address', manyRequests)],
    linkToken: [limiter(p.linkTokenPerAddress, 'address', manyRequests)],
    refresh: [limiter(p.refreshPerAddress, 'address', manyRequests)],
  };
}

export type RateLimits = ReturnType<typeof createRateLimits>;
